import * as DropdownMenu from '@radix-ui/react-dropdown-menu';
import { CircleUserRound, LogOut } from 'lucide-react';
import type { User } from '@shared/auth/auth.schema';
import { useLogout } from '../api/logout';

/** The account button in the top bar: who is signed in, and the way out. */
export function AccountMenu({ user }: { user: User }) {
  const logout = useLogout();
  return (
    // Not modal: a modal menu locks scrolling with an injected <style>, which our CSP refuses.
    <DropdownMenu.Root modal={false}>
      <DropdownMenu.Trigger
        className="inline-flex min-h-tap min-w-tap items-center justify-center gap-2 rounded px-2 font-semibold text-ink hover:bg-surface-raised"
        aria-label={`Account: ${user.displayName}`}
      >
        <CircleUserRound aria-hidden="true" className="size-6" />
        <span className="hidden max-w-40 truncate md:inline">{user.displayName}</span>
      </DropdownMenu.Trigger>
      <DropdownMenu.Portal>
        <DropdownMenu.Content
          align="end"
          sideOffset={6}
          className="z-50 min-w-60 rounded-lg border border-line bg-surface p-1 text-ink shadow-lg"
        >
          <DropdownMenu.Label className="flex flex-col px-3 py-2">
            <span className="font-bold">{user.displayName}</span>
            <span className="truncate text-sm text-ink-muted">{user.email}</span>
          </DropdownMenu.Label>
          <DropdownMenu.Separator className="my-1 h-px bg-line" />
          <DropdownMenu.Item
            className="flex min-h-tap cursor-pointer items-center gap-3 rounded px-3 font-semibold outline-none data-[disabled]:opacity-60 data-[highlighted]:bg-surface-raised"
            disabled={logout.isPending}
            onSelect={(event) => {
              event.preventDefault();
              logout.mutate();
            }}
          >
            <LogOut aria-hidden="true" className="size-5" />
            {logout.isPending ? 'Signing out…' : 'Sign out'}
          </DropdownMenu.Item>
        </DropdownMenu.Content>
      </DropdownMenu.Portal>
    </DropdownMenu.Root>
  );
}

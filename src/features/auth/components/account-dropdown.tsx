import { useState } from 'react';
import * as DropdownMenu from '@radix-ui/react-dropdown-menu';
import { LogOut, Settings, Store, UserCog, Users } from 'lucide-react';
import { Link } from 'react-router-dom';
import type { User } from '@shared/auth/auth.schema';
import { paths } from '@/config/paths';
import { useOutbox, useOutboxEntries } from '@/lib/outbox-context';
import { onDeviceOnlyText, summariseOutbox } from '@/lib/outbox-summary';
import { Button } from '@/components/ui/button';
import { Dialog } from '@/components/ui/dialog';
import { useLogout } from '../api/logout';
import { ACCOUNT_BUTTON, AccountButtonFace } from './account-button';

const ITEM =
  'flex min-h-tap cursor-pointer items-center gap-3 rounded px-3 font-semibold outline-none data-[disabled]:opacity-60 data-[highlighted]:bg-surface-raised';

/** Asks before signing out while changes are still only on this phone: signing out deletes them. */
function SignOutWarning({ open, onOpenChange }: { open: boolean; onOpenChange: (open: boolean) => void }) {
  const outbox = useOutbox();
  const entries = useOutboxEntries();
  const logout = useLogout();
  const [uploading, setUploading] = useState(false);
  const summary = summariseOutbox(entries);
  const reason = outbox.retryReason();

  const uploadNow = async () => {
    setUploading(true);
    try {
      await outbox.retryNow();
    } finally {
      setUploading(false);
    }
  };

  const empty = entries.length === 0;
  return (
    <Dialog
      open={open}
      onOpenChange={onOpenChange}
      title={empty ? 'Everything is uploaded' : 'Not everything is uploaded'}
      description={
        empty ? (
          'Nothing is left on this phone only. You can sign out.'
        ) : (
          <>
            <span className="font-bold">{onDeviceOnlyText(entries)}.</span> Signing out deletes them from this phone.
            {summary.failed.length ? ` ${summary.failed.length} of them ${summary.failed.length === 1 ? 'was' : 'were'} refused and ${summary.failed.length === 1 ? 'needs' : 'need'} fixing first.` : ''}
            {reason ? ` Last try: ${reason}.` : ''}
          </>
        )
      }
    >
      <div className="flex flex-col gap-3">
        {empty ? null : (
          <Button onClick={() => void uploadNow()} isPending={uploading} pendingLabel="Uploading…" className="w-full">
            Upload now
          </Button>
        )}
        <Button
          variant={empty ? 'primary' : 'secondary'}
          className="w-full"
          isPending={logout.isPending}
          pendingLabel="Signing out…"
          onClick={() => logout.mutate()}
        >
          {empty ? 'Sign out' : 'Sign out anyway'}
        </Button>
      </div>
    </Dialog>
  );
}

/**
 * The account menu itself (Radix DropdownMenu) and the sign-out warning. Loaded the first time
 * someone reaches for the account button (see account-menu.tsx), so no page waits for it.
 */
export function AccountDropdown({ user, defaultOpen = false }: { user: User; defaultOpen?: boolean }) {
  const logout = useLogout();
  const entries = useOutboxEntries();
  const [warning, setWarning] = useState(false);
  return (
    <>
      {/* Not modal: a modal menu locks scrolling with an injected <style>, which our CSP refuses. */}
      <DropdownMenu.Root modal={false} defaultOpen={defaultOpen}>
        <DropdownMenu.Trigger className={ACCOUNT_BUTTON} aria-label={`Account: ${user.displayName}`}>
          <AccountButtonFace user={user} />
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
            {user.roles.includes('shop_staff') ? (
              <DropdownMenu.Item asChild className={ITEM}>
                <Link to={paths.shop}>
                  <Store aria-hidden="true" className="size-5" />
                  Your shop
                </Link>
              </DropdownMenu.Item>
            ) : null}
            <DropdownMenu.Item asChild className={ITEM}>
              <Link to={paths.teams}>
                <Users aria-hidden="true" className="size-5" />
                Teams
              </Link>
            </DropdownMenu.Item>
            {user.roles.includes('admin') ? (
              <DropdownMenu.Item asChild className={ITEM}>
                <Link to={paths.accounts}>
                  <UserCog aria-hidden="true" className="size-5" />
                  Accounts
                </Link>
              </DropdownMenu.Item>
            ) : null}
            <DropdownMenu.Item asChild className={ITEM}>
              <Link to={paths.settings}>
                <Settings aria-hidden="true" className="size-5" />
                Units and settings
              </Link>
            </DropdownMenu.Item>
            <DropdownMenu.Item
              className={ITEM}
              disabled={logout.isPending}
              onSelect={(event) => {
                // With work still on the phone, the menu closes and the warning asks first.
                if (entries.length > 0) {
                  setWarning(true);
                  return;
                }
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
      <SignOutWarning open={warning} onOpenChange={setWarning} />
    </>
  );
}

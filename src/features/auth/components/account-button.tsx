import { CircleUserRound } from 'lucide-react';
import type { User } from '@shared/auth/auth.schema';

/** How the account button in the top bar looks, before and after its menu is loaded. */
export const ACCOUNT_BUTTON =
  'inline-flex min-h-tap min-w-tap items-center justify-center gap-2 rounded px-2 font-semibold text-ink hover:bg-surface-raised';

export function AccountButtonFace({ user }: { user: User }) {
  return (
    <>
      <CircleUserRound aria-hidden="true" className="size-6 shrink-0" />
      <span className="hidden max-w-40 truncate lg:inline">{user.displayName}</span>
    </>
  );
}

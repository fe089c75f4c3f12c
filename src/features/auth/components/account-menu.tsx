import { lazy, Suspense, useState } from 'react';
import type { User } from '@shared/auth/auth.schema';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { ACCOUNT_BUTTON, AccountButtonFace } from './account-button';

const loadDropdown = () => import('./account-dropdown');
// The menu (Radix DropdownMenu and its positioning) and the sign-out warning (Radix Dialog) are
// loaded on the first reach for the button, so the trackside page stays a small download; the
// service worker keeps the chunk for offline use.
const lazyDropdown = () => lazy(async () => ({ default: (await loadDropdown()).AccountDropdown }));
const preload = () => void loadDropdown().catch(() => undefined);

/** The account button in the top bar: who is signed in, settings, and the way out. */
export function AccountMenu({ user }: { user: User }) {
  const [wanted, setWanted] = useState(false);
  const [AccountDropdown, setAccountDropdown] = useState(() => lazyDropdown());
  const button = (onClick: () => void) => (
    <button
      type="button"
      className={ACCOUNT_BUTTON}
      aria-label={`Account: ${user.displayName}`}
      aria-haspopup="menu"
      aria-expanded={false}
      // Start the download as soon as a pointer or the focus arrives, so the menu opens at once.
      onPointerEnter={preload}
      onFocus={preload}
      onClick={onClick}
    >
      <AccountButtonFace user={user} />
    </button>
  );
  if (!wanted) return button(() => setWanted(true));
  return (
    // Not downloaded (offline before the app was kept on the device): the button stays, and a tap tries again.
    <ErrorBoundary
      fallback={({ reset }) =>
        button(() => {
          setAccountDropdown(() => lazyDropdown());
          reset();
        })
      }
    >
      <Suspense fallback={button(() => undefined)}>
        <AccountDropdown user={user} defaultOpen />
      </Suspense>
    </ErrorBoundary>
  );
}

import { lazy, Suspense } from 'react';
import { Outlet } from 'react-router-dom';
import { Calculator, Car, Flag, House, Settings, Wrench } from 'lucide-react';
import { paths } from '@/config/paths';
import { AppShell } from '@/components/layouts/app-shell';
import type { NavItem } from '@/components/layouts/nav-items';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { LoadingScreen } from '@/components/ui/loading-screen';
import { UnitsProvider } from '@/lib/units-context';
import { useMe } from '@/features/auth/api/get-me';
import { AccountMenu } from '@/features/auth/components/account-menu';
import { SyncStatusBadge } from '@/features/sync/components/sync-badge';

const NAV_ITEMS: readonly NavItem[] = [
  { to: paths.home, label: 'Home', icon: House, end: true },
  { to: paths.eventDay, label: 'Event day', icon: Flag, alsoActiveUnder: paths.events },
  { to: paths.cars, label: 'Cars', icon: Car },
  { to: paths.calculators, label: 'Calculators', icon: Calculator },
  { to: paths.settings, label: 'Settings', icon: Settings },
];
// Shop staff spend their days on the shop's page: it takes Settings' place, which the account menu also holds.
const STAFF_NAV_ITEMS: readonly NavItem[] = [...NAV_ITEMS.slice(0, 4), { to: paths.shop, label: 'Shop', icon: Wrench }];

// The bell and the comments host load just after the page: no page waits for them (see shell-extras.tsx).
const ShellExtras = lazy(async () => ({ default: (await import('../shell-extras')).ShellExtras }));

/** Every page behind sign-in: the route's loader has already checked the session. */
export function SignedInLayout() {
  const { data: user } = useMe();
  // Only while leaving after sign-out or an ended session: the redirect is on its way.
  if (!user) return <LoadingScreen label="One moment…" />;

  return (
    <UnitsProvider units={user.preferences.units}>
      <AppShell
        navItems={user.roles.includes('shop_staff') ? STAFF_NAV_ITEMS : NAV_ITEMS}
        status={
          <>
            <ErrorBoundary fallback={() => null}>
              <SyncStatusBadge />
            </ErrorBoundary>
            <ErrorBoundary fallback={() => null}>
              {/* Holds the bell's place, so the sync status beside it does not move when it comes. */}
              <Suspense fallback={<span aria-hidden="true" className="inline-flex size-tap shrink-0" />}>
                <ShellExtras />
              </Suspense>
            </ErrorBoundary>
          </>
        }
        account={<AccountMenu user={user} />}
      >
        <Outlet />
      </AppShell>
    </UnitsProvider>
  );
}

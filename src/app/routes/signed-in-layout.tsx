import { Outlet } from 'react-router-dom';
import { House } from 'lucide-react';
import { paths } from '@/config/paths';
import { AppShell } from '@/components/layouts/app-shell';
import type { NavItem } from '@/components/layouts/nav-items';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { LoadingScreen } from '@/components/ui/loading-screen';
import { useMe } from '@/features/auth/api/get-me';
import { AccountMenu } from '@/features/auth/components/account-menu';
import { SyncStatusBadge } from '@/features/sync/components/sync-status';

/** Only real pages appear here; new ones join as they are built. */
const NAV_ITEMS: readonly NavItem[] = [{ to: paths.home, label: 'Home', icon: House, end: true }];

/** Every page behind sign-in: the route's loader has already checked the session. */
export function SignedInLayout() {
  const { data: user } = useMe();
  // Only while leaving after sign-out or an ended session: the redirect is on its way.
  if (!user) return <LoadingScreen label="One moment…" />;

  return (
    <AppShell
      navItems={NAV_ITEMS}
      status={
        <ErrorBoundary fallback={() => null}>
          <SyncStatusBadge />
        </ErrorBoundary>
      }
      account={<AccountMenu user={user} />}
    >
      <Outlet />
    </AppShell>
  );
}

import type { ReactNode } from 'react';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { Wordmark } from '@/components/ui/wordmark';
import { BottomNav } from './bottom-nav';
import type { NavItem } from './nav-items';
import { TopNav } from './top-nav';

interface AppShellProps {
  navItems: readonly NavItem[];
  /** Always-visible status in the top bar (the sync line). */
  status?: ReactNode;
  /** The account menu. */
  account?: ReactNode;
  children: ReactNode;
}

/** The frame around every signed-in page: top bar, page content, phone bottom bar. */
export function AppShell({ navItems, status, account, children }: AppShellProps) {
  return (
    <div className="flex min-h-dvh flex-col">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:fixed focus:top-2 focus:left-2 focus:z-50 focus:rounded focus:bg-surface focus:p-3 focus:font-bold"
      >
        Skip to content
      </a>
      <header className="sticky top-0 z-30 border-b border-line bg-surface print:hidden">
        <div className="mx-auto flex min-h-tap-lg max-w-page items-center gap-3 px-4">
          <Link to={paths.home} className="inline-flex min-h-tap items-center rounded" aria-label="Scrubline, Home">
            <Wordmark />
          </Link>
          <TopNav items={navItems} />
          <div className="ml-auto flex min-w-0 items-center gap-2">
            {status}
            {account}
          </div>
        </div>
      </header>
      <main id="main" tabIndex={-1} className="mx-auto w-full max-w-page flex-1 px-4 pt-6 pb-28 outline-none md:pb-10 print:max-w-none print:p-0">
        {children}
      </main>
      <BottomNav items={navItems} />
    </div>
  );
}

import { NavLink, useLocation } from 'react-router-dom';
import { cn } from '@/lib/cn';
import type { NavItem } from './nav-items';

/** Desktop navigation in the top bar (768 px and wider). */
export function TopNav({ items }: { items: readonly NavItem[] }) {
  const { pathname } = useLocation();
  return (
    <nav aria-label="Main" className="hidden md:block">
      <ul className="flex items-center gap-1">
        {items.map(({ to, label, end, alsoActiveUnder }) => (
          <li key={to}>
            <NavLink
              to={to}
              end={end}
              className={({ isActive: exact }) => {
                const isActive = exact || (alsoActiveUnder !== undefined && pathname.startsWith(alsoActiveUnder));
                return cn(
                  'inline-flex min-h-tap items-center rounded px-3 font-semibold',
                  isActive ? 'bg-accent-soft text-link' : 'text-ink-muted hover:bg-surface-raised hover:text-ink',
                );
              }}
            >
              {label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

import { NavLink } from 'react-router-dom';
import { cn } from '@/lib/cn';
import { type NavItem, useIsCurrent } from './nav-items';

/** Desktop navigation in the top bar (768 px and wider). */
export function TopNav({ items }: { items: readonly NavItem[] }) {
  const isCurrent = useIsCurrent();
  return (
    <nav aria-label="Main" className="hidden md:block">
      <ul className="flex items-center gap-1">
        {items.map((item) => (
          <li key={item.to}>
            <NavLink
              to={item.to}
              end={item.end}
              className={({ isActive }) =>
                cn(
                  'inline-flex min-h-tap items-center rounded px-3 font-semibold whitespace-nowrap',
                  isCurrent(item, isActive) ? 'bg-accent-soft text-link' : 'text-ink-muted hover:bg-surface-raised hover:text-ink',
                )
              }
            >
              {item.label}
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

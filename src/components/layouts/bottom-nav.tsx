import { NavLink } from 'react-router-dom';
import { cn } from '@/lib/cn';
import { type NavItem, useIsCurrent } from './nav-items';

/** Phone navigation: a bar at the bottom, in thumb reach, with large targets. Hidden from 768 px. */
export function BottomNav({ items }: { items: readonly NavItem[] }) {
  const isCurrent = useIsCurrent();
  return (
    <nav aria-label="Main" className="pb-safe fixed inset-x-0 bottom-0 z-40 border-t border-line bg-surface md:hidden print:hidden">
      <ul className="mx-auto flex max-w-page">
        {items.map((item) => (
          <li key={item.to} className="flex-1">
            <NavLink
              to={item.to}
              end={item.end}
              className={({ isActive }) =>
                cn(
                  'flex min-h-tap-lg flex-col items-center justify-center gap-0.5 text-sm font-semibold',
                  isCurrent(item, isActive) ? 'text-link' : 'text-ink-muted hover:text-ink',
                )
              }
            >
              <item.icon aria-hidden="true" className="size-6" />
              {/* One line each, a little smaller on the narrowest phones (320 px), so the icons stay level. */}
              <span className="text-[min(0.875rem,3.6vw)] whitespace-nowrap">{item.label}</span>
            </NavLink>
          </li>
        ))}
      </ul>
    </nav>
  );
}

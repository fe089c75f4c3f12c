import type { LucideIcon } from 'lucide-react';
import { useLocation } from 'react-router-dom';

export interface NavItem {
  to: string;
  label: string;
  icon: LucideIcon;
  /** Match the address exactly (for Home, so it is not "current" on every page). */
  end?: boolean;
  /** Also "current" on addresses under this one (Event day opens /events/…). */
  alsoActiveUnder?: string;
}

/** Whether an item is the current page: NavLink's own match (`exact`), or an address under `alsoActiveUnder`. */
export function useIsCurrent(): (item: NavItem, exact: boolean) => boolean {
  const { pathname } = useLocation();
  return (item, exact) => exact || (item.alsoActiveUnder !== undefined && pathname.startsWith(item.alsoActiveUnder));
}

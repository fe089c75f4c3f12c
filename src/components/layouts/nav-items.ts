import type { LucideIcon } from 'lucide-react';

export interface NavItem {
  to: string;
  label: string;
  icon: LucideIcon;
  /** Match the address exactly (for Home, so it is not "current" on every page). */
  end?: boolean;
  /** Also "current" on addresses under this one (Event day opens /events/…). */
  alsoActiveUnder?: string;
}

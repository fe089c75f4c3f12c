import { Bell } from 'lucide-react';
import { Link } from 'react-router-dom';
import { paths } from '@/config/paths';
import { useUnreadCount } from '../api/get-unread-count';

/** The bell in the top bar: how many notifications are unread, one tap from the list. Kept tiny: every page loads it. */
export function NotificationBell() {
  const n = useUnreadCount().data?.unread ?? 0;
  return (
    <Link
      to={paths.notifications}
      aria-label={n > 0 ? `${n} unread notification${n === 1 ? '' : 's'}` : 'Notifications'}
      className="relative inline-flex size-tap shrink-0 items-center justify-center rounded text-ink hover:bg-surface-raised"
    >
      <Bell aria-hidden="true" className="size-6" />
      {n > 0 ? (
        <span aria-hidden="true" className="tabular-figures absolute top-0.5 right-0 min-w-5 rounded-full bg-accent px-1 text-center text-xs font-bold text-accent-ink">
          {n > 99 ? '99+' : n}
        </span>
      ) : null}
    </Link>
  );
}

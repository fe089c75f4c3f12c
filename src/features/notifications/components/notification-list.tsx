import { useNavigate } from 'react-router-dom';
import { CheckCheck, ChevronRight } from 'lucide-react';
import type { AppNotification } from '@shared/collab/notification.schema';
import { safeNextPath } from '@/config/paths';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { cn } from '@/lib/cn';
import { RelativeTime } from '@/lib/relative-time';
import { useNotifications } from '../api/get-notifications';
import { useMarkRead } from '../api/mark-read';

function NotificationItem({ item, onOpen }: { item: AppNotification; onOpen: (item: AppNotification) => void }) {
  const unread = item.readAt === null;
  return (
    <li>
      <button
        type="button"
        onClick={() => onOpen(item)}
        className={cn(
          'flex min-h-tap-lg w-full items-center gap-3 rounded border p-3 text-left hover:bg-surface-raised',
          unread ? 'border-l-8 border-accent bg-accent-soft' : 'border-line bg-surface',
        )}
      >
        <span className="flex min-w-0 flex-1 flex-col gap-0.5">
          <span className={cn('wrap-anywhere', unread ? 'font-bold' : 'text-ink')}>
            {unread ? <span className="sr-only">Unread: </span> : null}
            {item.summary}
          </span>
          <RelativeTime iso={item.createdAt} className="tabular-figures text-sm text-ink-muted" />
        </span>
        <ChevronRight aria-hidden="true" className="size-5 shrink-0 text-ink-muted" />
      </button>
    </li>
  );
}

/** What happened around the user's cars and shops, newest first; opening one marks it read and goes to it. */
export function NotificationList() {
  const navigate = useNavigate();
  const { data, isPending, isError } = useNotifications();
  const markRead = useMarkRead();

  const open = (item: AppNotification) => {
    if (item.readAt === null) markRead.mutate({ ids: [item.id] });
    // Only addresses inside the app are followed.
    const to = safeNextPath(item.link);
    if (to) void navigate(to);
  };

  if (isPending) return <p className="text-ink-muted">Loading notifications…</p>;
  if (isError) return <p className="text-ink-muted">Notifications could not be loaded. Try again shortly.</p>;
  if (data.items.length === 0) {
    return <EmptyState message="Nothing yet. Comments, setup suggestions and shop access on your cars show here." />;
  }
  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <p className="text-ink-muted" aria-live="polite">
          {data.unread === 0 ? 'All read.' : `${data.unread} unread`}
        </p>
        {data.unread > 0 ? (
          <Button variant="secondary" isPending={markRead.isPending} pendingLabel="Marking…" onClick={() => markRead.mutate({ all: true })}>
            <CheckCheck aria-hidden="true" className="size-5" /> Mark all read
          </Button>
        ) : null}
      </div>
      <ul className="flex flex-col gap-2" aria-label="Notifications, newest first">
        {data.items.map((item) => (
          <NotificationItem key={item.id} item={item} onOpen={open} />
        ))}
      </ul>
    </div>
  );
}

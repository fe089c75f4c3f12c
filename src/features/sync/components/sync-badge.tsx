import { CircleCheck, CloudUpload, TriangleAlert } from 'lucide-react';
import { useOutboxEntries } from '@/lib/outbox-context';
import { summariseOutbox } from '@/lib/outbox-summary';
import { useOnlineStatus } from '@/hooks/use-online-status';
import { cn } from '@/lib/cn';

/*
 * The save state, always in view: everything made at the car goes to the outbox on the device
 * first, and this says plainly whether it has all reached the server.
 */

export const TONE = {
  saved: { Icon: CircleCheck, className: 'text-success' },
  waiting: { Icon: CloudUpload, className: 'text-ink' },
  attention: { Icon: TriangleAlert, className: 'text-warning' },
} as const;

/**
 * The top bar's save state, in one short line (and "offline" under it with no signal); the app's live region for it.
 * The full sentence ("2 runs and 1 change waiting to upload") is what a screen reader says and what a pointer's
 * hover shows: beside the page links and the account, no width of the bar has room for its longest forms.
 */
export function SyncStatusBadge() {
  const entries = useOutboxEntries();
  const online = useOnlineStatus();
  const summary = summariseOutbox(entries);
  const { Icon, className } = TONE[summary.tone];
  return (
    <p role="status" title={summary.text} className={cn('grid min-w-0 grid-cols-[auto_1fr] items-center gap-x-1.5 text-sm font-semibold', className)}>
      <Icon aria-hidden="true" className="size-4" />
      <span aria-hidden="true" className="truncate">
        {summary.short}
      </span>
      <span className="sr-only">{summary.text}</span>
      {/* Said in words: "2 waiting" alone does not tell no signal from a slow upload. On a line of its own
          under the count, so a narrow phone's top bar never cuts the count short; in the plain ink, since
          "All saved" is in the colour of success and no signal is not. */}
      {!online ? <span className="col-start-2 text-ink">offline</span> : null}
    </p>
  );
}

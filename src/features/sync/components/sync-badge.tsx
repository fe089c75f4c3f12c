import { CircleCheck, CloudOff, CloudUpload, TriangleAlert } from 'lucide-react';
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

/** One short line for the top bar; the app's live region for the save state. */
export function SyncStatusBadge() {
  const entries = useOutboxEntries();
  const online = useOnlineStatus();
  const summary = summariseOutbox(entries);
  const { Icon, className } = TONE[summary.tone];
  const ShownIcon = summary.tone === 'saved' && !online ? CloudOff : Icon;
  return (
    <p role="status" className={cn('inline-flex min-w-0 items-center gap-1.5 text-sm font-semibold', className)}>
      <ShownIcon aria-hidden="true" className="size-4 shrink-0" />
      {/* A phone's top bar has room for the short form; the full sentence is read out everywhere. */}
      <span aria-hidden="true" className="truncate md:hidden">
        {summary.short}
      </span>
      <span className="sr-only md:not-sr-only md:truncate">{summary.text}</span>
      {/* Said in words: "2 waiting" alone does not tell no signal from a slow upload. */}
      {!online ? <span className="shrink-0"> · offline</span> : null}
    </p>
  );
}

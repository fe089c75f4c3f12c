import { CircleCheck, CloudOff } from 'lucide-react';
import { useOnlineStatus } from '@/hooks/use-online-status';

/*
 * The save state, always in view. Nothing is recorded on the device yet, so nothing can be
 * waiting to upload: the line says "All saved" and notes when the device is offline. Counts of
 * waiting runs arrive with the run outbox.
 */

/** One short line for the top bar; the app's live region for the save state. */
export function SyncStatusBadge() {
  const online = useOnlineStatus();
  const Icon = online ? CircleCheck : CloudOff;
  return (
    <p role="status" className={`inline-flex items-center gap-1.5 text-sm font-semibold ${online ? 'text-success' : 'text-ink-muted'}`}>
      <Icon aria-hidden="true" className="size-4 shrink-0" />
      {online ? 'All saved' : 'Offline · all saved'}
    </p>
  );
}

/** The longer form for a page section. */
export function SyncStatus() {
  const online = useOnlineStatus();
  const Icon = online ? CircleCheck : CloudOff;
  return (
    <div className="flex items-start gap-2">
      <Icon aria-hidden="true" className={`mt-0.5 size-5 shrink-0 ${online ? 'text-success' : 'text-ink-muted'}`} />
      <div>
        <p className="font-semibold">All saved</p>
        <p className="text-sm text-ink-muted">
          {online ? 'Nothing is waiting to upload.' : 'You are offline. Nothing is waiting to upload.'}
        </p>
      </div>
    </div>
  );
}

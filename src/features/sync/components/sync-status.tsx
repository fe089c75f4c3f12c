import { useState } from 'react';
import { CloudUpload } from 'lucide-react';
import type { OutboxEntry } from '@/lib/outbox';
import { useOutbox, useOutboxEntries } from '@/lib/outbox-context';
import { summariseOutbox } from '@/lib/outbox-summary';
import { refusalWords } from '@/features/sync/utils/refusal-words';
import { useOnlineStatus } from '@/hooks/use-online-status';
import { Link } from 'react-router-dom';
import { Button, buttonClasses } from '@/components/ui/button';
import { pathTo } from '@/config/paths';
import { cn } from '@/lib/cn';
import { TONE } from './sync-badge';

/** Where a refused run can be fixed: its event's page, for its car and driver, where "Fix" opens it. */
function fixPlace(entry: OutboxEntry): string | null {
  const { eventId, carId } = entry.scope;
  if (!entry.kind.startsWith('run.') || !eventId) return null;
  const driverId = (entry.body as { driverId?: unknown } | undefined)?.driverId;
  return `${pathTo.event(eventId, carId)}${typeof driverId === 'string' && carId ? `&driverId=${encodeURIComponent(driverId)}` : ''}`;
}

function FailedEntry({ entry }: { entry: OutboxEntry }) {
  const outbox = useOutbox();
  const [confirming, setConfirming] = useState(false);
  const fixAt = fixPlace(entry);
  return (
    <li className="flex flex-col gap-2 rounded border border-warning-line bg-warning-surface p-3">
      <p className="font-bold text-ink">{entry.label}</p>
      <p className="text-sm text-warning">
        Refused: {refusalWords(entry.error, 'the server did not accept it')}
      </p>
      <div className="flex flex-wrap gap-2">
        {confirming ? (
          <>
            <Button variant="secondary" onClick={() => void outbox.discard(entry.key)}>
              Yes, discard it
            </Button>
            <Button variant="quiet" onClick={() => setConfirming(false)}>
              Keep it
            </Button>
          </>
        ) : (
          <>
            {fixAt ? (
              <Link to={fixAt} className={buttonClasses('secondary')}>
                Open it to fix
              </Link>
            ) : (
              <Button variant="secondary" onClick={() => void outbox.retry(entry.key)}>
                Try again
              </Button>
            )}
            <Button variant="quiet" onClick={() => setConfirming(true)}>
              Discard…
            </Button>
          </>
        )}
      </div>
    </li>
  );
}

const SHOWN = 5;

/** The longer form for a page section: counts, why the last try failed, and what needs attention. */
export function SyncStatus() {
  const outbox = useOutbox();
  const entries = useOutboxEntries();
  const online = useOnlineStatus();
  const [trying, setTrying] = useState(false);
  const summary = summariseOutbox(entries);
  const reason = outbox.retryReason();
  const { Icon, className } = TONE[summary.tone];

  const tryNow = async () => {
    setTrying(true);
    try {
      await outbox.retryNow();
    } finally {
      setTrying(false);
    }
  };

  return (
    <div className="flex flex-col gap-3">
      <div className="flex items-start gap-2">
        <Icon aria-hidden="true" className={cn('mt-0.5 size-5 shrink-0', className)} />
        <div>
          <p className="font-semibold">{summary.text}</p>
          <p className="text-sm text-ink-muted">
            {summary.tone === 'saved'
              ? online
                ? 'Nothing is waiting to upload.'
                : 'You are offline. Nothing is waiting to upload.'
              : summary.waiting.length
                ? `Kept on this phone and uploaded by itself when there is signal.${reason ? ` Last try: ${reason}.` : ''}`
                : 'Fix or discard what the server refused; nothing is dropped without you.'}
          </p>
        </div>
      </div>
      {summary.waiting.length ? (
        <div className="flex flex-col gap-2">
          <ul className="flex flex-col gap-1 text-sm">
            {summary.waiting.slice(0, SHOWN).map((e) => (
              <li key={e.key} className="tabular-figures flex items-center gap-2">
                <CloudUpload aria-hidden="true" className="size-4 shrink-0 text-ink-muted" />
                {e.label}
              </li>
            ))}
            {summary.waiting.length > SHOWN ? <li className="text-ink-muted">and {summary.waiting.length - SHOWN} more</li> : null}
          </ul>
          <div>
            <Button variant="secondary" onClick={() => void tryNow()} isPending={trying} pendingLabel="Trying…">
              Try now
            </Button>
          </div>
        </div>
      ) : null}
      {summary.failed.length ? (
        <ul className="flex flex-col gap-2" aria-label="Needs attention">
          {summary.failed.map((e) => (
            <FailedEntry key={e.key} entry={e} />
          ))}
        </ul>
      ) : null}
    </div>
  );
}

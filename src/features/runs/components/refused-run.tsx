import { Button } from '@/components/ui/button';
import { useOutbox, useOutboxEntries } from '@/lib/outbox-context';
import { refusalWords } from '@/features/sync/utils/refusal-words';
import { toast } from '@/lib/toast-store';
import type { PendingState, RunRow } from '../utils/merge-runs';

interface RefusedRunProps {
  row: RunRow;
  failed: PendingState;
  onFix: () => void;
}

/**
 * What the server refused, and the ways out: fix it and send it again, or drop it. Dropping a run is one
 * tap beside "Fix", so it can be undone for as long as its toast shows (the run goes back in line, and the
 * server judges it again). Loaded only when a refusal is on screen.
 */
export function RefusedRun({ row, failed, onFix }: RefusedRunProps) {
  const outbox = useOutbox();
  const entries = useOutboxEntries();
  const created = failed.action === 'create';

  const discard = async () => {
    const entry = entries.find((e) => e.key === failed.entryKey);
    await outbox.discard(failed.entryKey);
    toast({
      tone: 'info',
      title: created ? `Run ${row.runNumber} discarded` : `Change to run ${row.runNumber} discarded`,
      description: created ? 'It was never on the server.' : 'The run stays as the server has it.',
      action: entry && {
        label: 'Undo',
        altText: `Undo: keep ${created ? '' : 'the change to '}run ${row.runNumber}`,
        onAction: () => void outbox.add(entry),
      },
    });
  };

  return (
    <div role="alert" className="flex flex-col gap-2 rounded border border-warning-line bg-warning-surface p-2 text-sm">
      <p className="font-semibold text-warning">
        {failed.action === 'delete' ? 'Could not delete: ' : 'Not accepted: '}
        {refusalWords(failed.error, 'the server refused it')}
      </p>
      <div className="flex flex-wrap gap-x-6 gap-y-2">
        {failed.action === 'delete' ? (
          <Button variant="secondary" onClick={() => void outbox.retry(failed.entryKey)}>
            Try again
          </Button>
        ) : (
          <Button variant="secondary" onClick={onFix}>
            Fix
          </Button>
        )}
        <Button variant="quiet" onClick={() => void discard()}>
          {created ? 'Discard this run' : 'Discard the change'}
        </Button>
      </div>
    </div>
  );
}

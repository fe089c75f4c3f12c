import { lazy, Suspense, useState, type ReactNode } from 'react';
import { shortName } from '@shared/auth/person-name';
import { formatRunTime } from '@shared/season/run-time';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { cn } from '@/lib/cn';
import { formatClock, isDayEnd } from '@/lib/dates';
import { formatPercent } from '@/lib/numbers';
import { useOutbox, useOutboxEntries } from '@/lib/outbox-context';
import { toast } from '@/lib/toast-store';
import { createRunEntry, useCreateRun, type CreateRunBody } from '../api/create-run';
import { deleteRunEntry, useDeleteRun } from '../api/delete-run';
import { updateRunEntry, useUpdateRun } from '../api/update-run';
import type { RunRow } from '../utils/merge-runs';
import { coneWords, STATUS_WORDS } from '../utils/run-words';
import { HotPressuresToggle } from './hot-pressures-toggle';
import type { RunChanges } from './run-edit-form';

// Loaded on the first "Edit" or "Fix", so logging runs stays a small download (the service worker keeps it for offline).
const RunEditForm = lazy(async () => ({ default: (await import('./run-edit-form')).RunEditForm }));
// Loaded when the server has refused something; a rare screen.
const RefusedRun = lazy(async () => ({ default: (await import('./refused-run')).RefusedRun }));

interface RunListProps {
  /** What the list is: "Today’s runs", or the runs of an earlier day. */
  label: string;
  rows: readonly RunRow[];
  /** The label of the setup each run ran on (saved tie, or worked out on the device). */
  setupLabelOf: (row: RunRow) => string | null;
  /** More beside a run's Edit button (its comments). */
  renderExtras?: (row: RunRow) => ReactNode;
}

/** The same run, posted again with the same id: the server re-creates a deleted run, or answers "already there". */
function recreateBody(row: RunRow): CreateRunBody {
  return {
    id: row.id,
    carId: row.carId,
    eventId: row.eventId,
    runNumber: row.runNumber,
    rawTimeSec: row.rawTimeSec,
    cones: row.cones,
    status: row.status,
    recordedAt: row.recordedAt,
    driverId: row.driver.id,
    ...(row.hotPressuresKpa ? { hotPressuresKpa: row.hotPressuresKpa } : {}),
    ...(row.notes ? { notes: row.notes } : {}),
  };
}

function Time({ label, seconds, strong }: { label: string; seconds: number | null; strong?: boolean }) {
  return (
    <div className="flex min-w-0 flex-col">
      <span className="text-xs font-semibold text-ink-muted">{label}</span>
      <span className={cn('tabular-figures text-time text-ink', strong ? 'font-extrabold' : 'font-semibold')}>
        {seconds === null ? '—' : formatRunTime(seconds)}
      </span>
    </div>
  );
}

/**
 * The runs of one car at an event, newest first: raw and adjusted time, cones, % off the driver's best,
 * each driver's best marked (a bar down its side and a badge saying whose it is), the setup each ran on, and what is still
 * waiting or was refused.
 */
export function RunList({ label, rows, setupLabelOf, renderExtras }: RunListProps) {
  const outbox = useOutbox();
  const entries = useOutboxEntries();
  const create = useCreateRun();
  const update = useUpdateRun();
  const remove = useDeleteRun();
  const [editing, setEditing] = useState<string | null>(null);

  if (rows.length === 0) return <EmptyState message="No runs yet. Your first one shows here the moment you save it." />;

  const save = async (row: RunRow, changes: RunChanges) => {
    const pending = row.pending;
    const entry = pending ? entries.find((e) => e.key === pending.entryKey) : undefined;
    if (pending?.state === 'failed' && entry && pending.action === 'create') {
      await outbox.retry(entry.key, { ...(entry.body as CreateRunBody), ...changes });
    } else if (pending?.state === 'failed' && entry && pending.action === 'update') {
      await outbox.retry(entry.key, { ...(entry.body as object), ...changes, version: row.version ?? 1 });
    } else {
      await update.mutateAsync(updateRunEntry(row, { ...changes, version: row.version ?? 1 }, { ...row, ...changes }));
    }
    setEditing(null);
  };

  const deleteRun = async (row: RunRow) => {
    // A run not uploaded yet is cancelled in the outbox; keep what it would have sent, to undo.
    const unsent = row.pending?.action === 'create' ? entries.find((e) => e.key === row.pending?.entryKey) : undefined;
    const restore = unsent ? (unsent.body as CreateRunBody) : recreateBody(row);
    const result = await remove.mutateAsync(deleteRunEntry(row));
    setEditing(null);
    toast({
      tone: 'info',
      title: `Run ${row.runNumber} deleted`,
      description: `${row.driver.displayName} · ${row.rawTimeSec !== null ? formatRunTime(row.rawTimeSec) : STATUS_WORDS[row.status]}`,
      action: {
        label: 'Undo',
        altText: `Undo: restore run ${row.runNumber}`,
        onAction: () => {
          const still = result ? outbox.getSnapshot().find((e) => e.key === result.key) : undefined;
          if (still && still.state === 'waiting' && still.attempts === 0) {
            // The deletion never left the phone: cancel it.
            void outbox.discard(still.key);
            return;
          }
          // Gone from the server (or cancelled with its upload): post the same run again, same id.
          void create.mutateAsync(createRunEntry(restore));
        },
      },
    });
  };

  return (
    <ol className="flex flex-col gap-2" aria-label={`${label}, newest first`}>
      {rows.map((row) => {
        const setup = setupLabelOf(row);
        const failed = row.pending?.state === 'failed' ? row.pending : null;
        const taken = rows.filter((r) => r.id !== row.id && r.driver.id === row.driver.id).map((r) => r.runNumber);
        const hot = row.hotPressuresKpa;
        // Each driver of a shared car is scored on their own runs: the best and the % off it say whose.
        const whose = `${shortName(row.driver.displayName)}’s best`;
        return (
          <li
            key={row.id}
            aria-label={`Run ${row.runNumber}, ${row.driver.displayName}${row.isBest ? ', best' : ''}`}
            className={cn(
              'flex flex-col gap-2 rounded border bg-surface p-3',
              row.isBest ? 'border-l-8 border-accent' : 'border-line',
              failed && 'border-warning-line',
            )}
          >
            <div className="flex flex-wrap items-center gap-x-3 gap-y-1">
              <span className="text-lg font-extrabold">Run {row.runNumber}</span>
              <span className="font-semibold text-ink-muted">{row.driver.displayName}</span>
              {/* A run typed in after its day has no known time of day. */}
              {isDayEnd(row.recordedAt) ? null : <span className="tabular-figures text-sm text-ink-muted">{formatClock(row.recordedAt)}</span>}
              {row.isBest ? (
                <span className="rounded bg-accent px-2 py-0.5 text-sm font-bold text-accent-ink">{whose}</span>
              ) : null}
              {row.pending ? <PendingBadge state={row.pending.state} /> : null}
            </div>
            <div className="grid grid-cols-2 gap-2">
              <Time label="Raw" seconds={row.rawTimeSec} />
              {row.status === 'finished' ? (
                <Time label="Adjusted" seconds={row.adjustedTimeSec} strong />
              ) : (
                <div className="flex flex-col">
                  <span className="text-xs font-semibold text-ink-muted">Result</span>
                  <span className="text-time font-extrabold">{STATUS_WORDS[row.status]}</span>
                </div>
              )}
            </div>
            <p className="tabular-figures flex flex-wrap gap-x-3 text-sm">
              {/* "Clean" is a finished run's word: a DNF with no cone was not a clean run. */}
              {row.cones || row.status === 'finished' ? <span>{row.cones ? `+${coneWords(row.cones)}` : 'Clean'}</span> : null}
              {row.pctOffBest !== null && !row.isBest ? <span>{`${formatPercent(row.pctOffBest)} off ${whose}`}</span> : null}
              <span className="text-ink-muted wrap-anywhere">Setup: {setup ?? 'none recorded'}</span>
            </p>
            {row.notes ? <p className="text-sm text-ink-muted">{row.notes}</p> : null}
            {hot ? <HotPressuresToggle kpa={hot} /> : null}
            {failed ? (
              <Suspense fallback={<p role="alert">Not accepted by the server…</p>}>
                <RefusedRun row={row} failed={failed} onFix={() => setEditing(row.id)} />
              </Suspense>
            ) : null}
            {editing === row.id ? (
              <Suspense fallback={<p className="text-ink-muted">Opening the run…</p>}>
                <RunEditForm
                  row={row}
                  takenNumbers={taken}
                  serverErrors={failed?.error?.fieldErrors}
                  numberTaken={failed?.error?.status === 409 && !!failed.error.fieldErrors?.runNumber}
                  submitLabel={failed ? 'Fix and send again' : 'Save changes'}
                  onSubmit={(changes) => save(row, changes)}
                  onCancel={() => setEditing(null)}
                  onDelete={failed?.action === 'create' ? undefined : () => void deleteRun(row)}
                />
              </Suspense>
            ) : failed ? null : (
              <div className="flex flex-wrap gap-1">
                <Button variant="quiet" className="px-2" onClick={() => setEditing(row.id)} aria-label={`Edit run ${row.runNumber}`}>
                  Edit
                </Button>
                {renderExtras?.(row)}
              </div>
            )}
          </li>
        );
      })}
    </ol>
  );
}

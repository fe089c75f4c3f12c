import { useState, type FormEvent } from 'react';
import { CHANGE_LOCATIONS, createChangeInputSchema, type ChangeLogEntry } from '@shared/season/change-log.schema';
import { ConfirmButton, refusalText } from '@/components/dialogs/confirm-button';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { PendingBadge } from '@/components/ui/pending-badge';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { formatDay, todayIsoDate } from '@/lib/dates';
import type { OutboxEntry } from '@/lib/outbox';
import { useOutbox } from '@/lib/outbox-context';
import { createChangeEntry, useCreateChange, type CreateChangeBody } from '../api/create-change';
import { useDeleteChange } from '../api/delete-change';

const LOCATION_WORDS: Record<(typeof CHANGE_LOCATIONS)[number], string> = {
  car: 'Whole car',
  front: 'Front',
  rear: 'Rear',
  lf: 'Left front',
  rf: 'Right front',
  lr: 'Left rear',
  rr: 'Right rear',
};

interface Row extends Pick<ChangeLogEntry, 'id' | 'changedOn' | 'what' | 'location' | 'notes' | 'fromVisit'> {
  by: string | null;
  pending: null | { state: 'waiting' | 'failed'; key: string; message?: string };
}

function mergeRows(saved: readonly ChangeLogEntry[], entries: readonly OutboxEntry[]): Row[] {
  const rows: Row[] = saved.map((e) => ({ ...e, by: e.createdBy.displayName, pending: null }));
  for (const entry of entries) {
    if (entry.kind !== 'change.create' || rows.some((r) => r.id === entry.recordId)) continue;
    const body = entry.body as CreateChangeBody;
    rows.push({
      id: body.id,
      changedOn: body.changedOn,
      what: body.what,
      location: body.location,
      notes: body.notes ?? null,
      fromVisit: false,
      by: null,
      pending: { state: entry.state === 'failed' ? 'failed' : 'waiting', key: entry.key, message: entry.error?.message },
    });
  }
  // Newest first to read; the server keeps them oldest first.
  return rows.sort((a, b) => b.changedOn.localeCompare(a.changedOn));
}

/** Deletes a saved entry logged by mistake, after asking; one a shop wrote at a handover is refused with the reason. */
function DeleteChangeButton({ carId, changeId, what }: { carId: string; changeId: string; what: string }) {
  const remove = useDeleteChange(carId);
  return (
    <ConfirmButton
      title={`Delete “${what}” from the log?`}
      destructive
      description="Comparisons made across this entry go with it; a setup it named stays. It cannot be undone."
      confirmLabel="Delete entry"
      pendingLabel="Deleting…"
      keepLabel="Keep"
      isPending={remove.isPending}
      onConfirm={(handlers) => remove.mutate(changeId, handlers)}
      failureText={refusalText}
    >
      Delete<span className="sr-only"> “{what}”</span>
    </ConfirmButton>
  );
}

/** Adds an entry to the car's log, through the outbox (it waits on the phone without signal). */
function AddChangeForm({ carId }: { carId: string }) {
  const write = useCreateChange();
  const [changedOn, setChangedOn] = useState(todayIsoDate);
  const [what, setWhat] = useState('');
  const [location, setLocation] = useState<(typeof CHANGE_LOCATIONS)[number]>('car');
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    const body: CreateChangeBody = {
      id: crypto.randomUUID(),
      changedOn,
      what: what.trim(),
      location,
      ...(notes.trim() ? { notes: notes.trim() } : {}),
    };
    const checked = createChangeInputSchema.safeParse(body);
    if (!checked.success) {
      const found: Record<string, string> = Object.fromEntries(checked.error.issues.map((i) => [i.path.map(String).join('.'), i.message]));
      // The date picker left empty: asked for plainly, not with the API's ISO example.
      if (!changedOn) found.changedOn = 'Pick a date';
      setErrors(found);
      return;
    }
    setErrors({});
    await write.mutateAsync(createChangeEntry(carId, body));
    setWhat('');
    setNotes('');
  };

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Add to the change log" className="flex flex-col gap-3 rounded border border-line p-3">
      <h3 className="font-bold">Add an entry</h3>
      <TextField label="What changed" placeholder="e.g. Fitted adjustable camber arms" maxLength={200} value={what} error={errors.what} onChange={(e) => setWhat(e.target.value)} />
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Date" type="date" value={changedOn} error={errors.changedOn} onChange={(e) => setChangedOn(e.target.value)} />
        <SelectField
          label="Where"
          value={location}
          options={CHANGE_LOCATIONS.map((l) => ({ value: l, label: LOCATION_WORDS[l] }))}
          onChange={(e) => setLocation(e.target.value as (typeof CHANGE_LOCATIONS)[number])}
        />
      </div>
      <TextField label="Notes (optional)" value={notes} maxLength={2000} onChange={(e) => setNotes(e.target.value)} />
      <div>
        <Button type="submit" isPending={write.isPending} pendingLabel="Saving…">
          Add to the log
        </Button>
      </div>
    </form>
  );
}

interface ChangeLogProps {
  carId: string;
  saved: readonly ChangeLogEntry[];
  entries: readonly OutboxEntry[];
  /** For a shop reading a customer's car: the entries, with no form and no delete. */
  readOnly?: boolean;
}

/** The car's change log — parts fitted, alignments, repairs — newest first, with a form to add one (not when read only). */
export function ChangeLog({ carId, saved, entries, readOnly = false }: ChangeLogProps) {
  const outbox = useOutbox();
  const rows = mergeRows(saved, entries);
  return (
    <div className="flex flex-col gap-4">
      {rows.length === 0 ? (
        <EmptyState message={`Nothing logged yet: ${readOnly ? 'the drivers log parts fitted, alignments and repairs here' : 'parts fitted, alignments and repairs go here'}.`} />
      ) : (
        <ol className="flex flex-col gap-2" aria-label="Change log, newest first">
          {rows.map((row) => (
            <li key={row.id} className="flex flex-col gap-1 rounded border border-line p-3">
              <div className="flex flex-wrap items-baseline justify-between gap-2">
                <span className="font-bold wrap-anywhere">{row.what}</span>
                {row.pending ? (
                  <PendingBadge state={row.pending.state} />
                ) : row.fromVisit ? (
                  <span className="text-sm text-ink-muted">From a shop visit</span>
                ) : readOnly ? null : (
                  <DeleteChangeButton carId={carId} changeId={row.id} what={row.what} />
                )}
              </div>
              <p className="tabular-figures text-sm text-ink-muted">
                {formatDay(row.changedOn)} · {LOCATION_WORDS[row.location]}
                {row.by ? ` · ${row.by}` : ''}
              </p>
              {row.notes ? <p className="text-sm">{row.notes}</p> : null}
              {row.pending?.state === 'failed' ? (
                <div className="flex flex-wrap items-center gap-2 text-sm">
                  <span className="font-semibold text-warning">Refused: {row.pending.message}</span>
                  <Button variant="secondary" onClick={() => void outbox.retry(row.pending!.key)}>
                    Try again
                  </Button>
                  <Button variant="quiet" onClick={() => void outbox.discard(row.pending!.key)}>
                    Discard
                  </Button>
                </div>
              ) : null}
            </li>
          ))}
        </ol>
      )}
      {readOnly ? null : <AddChangeForm carId={carId} />}
    </div>
  );
}

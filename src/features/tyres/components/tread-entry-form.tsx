import { useEffect, useId, useRef, useState, type FormEvent } from 'react';
import { TriangleAlert } from 'lucide-react';
import { Link } from 'react-router-dom';
import { convert, formatQuantity, SI_UNITS, unitFor } from '@shared/calc/units.calc';
import { CORNERS, type Corner } from '@shared/season/corners';
import { LIMITS } from '@shared/season/limits';
import { createTreadReadingInputSchema, type TreadCorner, type TyreSet } from '@shared/season/tyre.schema';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { FormAlert } from '@/components/ui/form-alert';
import { PendingBadge } from '@/components/ui/pending-badge';
import { TextField } from '@/components/ui/text-field';
import { pathTo } from '@/config/paths';
import { cn } from '@/lib/cn';
import { showFirstRefused } from '@/lib/show-first-refused';
import { formatDateTime, fromLocalInputValue, toLocalInputValue } from '@/lib/dates';
import { formatDelta, inputToSi, typeANumber, unitSymbol } from '@/lib/numbers';
import type { OutboxEntry } from '@/lib/outbox';
import { useOutbox, useOutboxEntries } from '@/lib/outbox-context';
import { useUnits } from '@/lib/units-context';
import { useWatchedEntry } from '@/lib/use-outbox-entry';
import { createTreadReadingEntry, useCreateTreadReading, type CreateTreadReadingBody } from '../api/create-tread-reading';
import { latestReading, POSITION_SHORT, POSITION_WORDS, positionsAcross, WEAR_BAR_MM, type TreadPosition } from '../utils/tread';
import { SAVE_BAR_CLASSES } from '@/components/layouts/save-bar';

type Texts = Record<Corner, Record<TreadPosition, string>>;
const emptyTexts = (): Texts =>
  Object.fromEntries(CORNERS.map((c) => [c, { innerMm: '', middleMm: '', outerMm: '' }])) as Texts;

interface TreadEntryFormProps {
  carId: string;
  sets: readonly TyreSet[];
  initialSetId?: string | null;
  /** Called once the server has the reading. */
  onUploaded: () => void;
}

/**
 * Tread depth across each tyre — outer, middle, inner as they sit on the car — in the user's
 * unit, with the change since the set's last reading beside each; saved through the outbox.
 */
const NEED_ATTENTION = 'Some readings need attention; they are marked above.';
const REFUSED_MARKED = 'The server refused some readings; they are marked above.';
const MARKED_ABOVE = new Set([NEED_ATTENTION, REFUSED_MARKED]);
const capitalise = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);
/** More than this deeper than the last reading of the same spot is worth a second look, in mm. */
const DEEPER_THAN_LAST_MM = 0.5;

export function TreadEntryForm({ carId, sets, initialSetId, onUploaded }: TreadEntryFormProps) {
  const units = useUnits();
  const outbox = useOutbox();
  const entries = useOutboxEntries();
  const write = useCreateTreadReading();
  const unitId = useId();
  const [setId, setSetId] = useState<string>(initialSetId && sets.some((s) => s.id === initialSetId) ? initialSetId : (sets[0]?.id ?? ''));
  const [texts, setTexts] = useState<Texts>(emptyTexts);
  const [takenAt, setTakenAt] = useState(() => toLocalInputValue(new Date()));
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const formRef = useRef<HTMLFormElement>(null);
  const [formError, setFormError] = useState<string | null>(null);
  const [recordId, setRecordId] = useState(() => crypto.randomUUID());
  const [entryKey, setEntryKey] = useState<string | null>(null);
  const watched = useWatchedEntry(entryKey);
  const set = sets.find((s) => s.id === setId) ?? null;
  const last = set ? latestReading(set, entries.filter((e: OutboxEntry) => e.recordId !== recordId)) : null;
  const unit = unitSymbol('treadDepth', units);

  // The server's refusal, when it comes, goes on the inputs it names; nothing typed is lost.
  const refusal = watched.status === 'failed' ? watched.entry.error : undefined;
  const shown = useRef<unknown>(null);
  useEffect(() => {
    if (!refusal || shown.current === refusal) return;
    shown.current = refusal;
    setErrors(Object.fromEntries(Object.entries(refusal.fieldErrors ?? {}).map(([k, v]) => [k, v.join(' ')])));
    setFormError(refusal.fieldErrors ? REFUSED_MARKED : refusal.message);
  }, [refusal]);
  const uploaded = watched.status === 'delivered';
  const told = useRef(false);
  useEffect(() => {
    if (!uploaded || told.current) return;
    told.current = true;
    onUploaded();
  }, [uploaded, onUploaded]);

  const setText = (corner: Corner, pos: TreadPosition, value: string) => {
    setTexts((t) => ({ ...t, [corner]: { ...t[corner], [pos]: value } }));
    setErrors((e) => ({ ...e, [`corners.${corner}.${pos}`]: '', [`corners.${corner}`]: '' }));
  };

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    if (!set) return;
    const found: Record<string, string> = {};
    const corners: Partial<Record<Corner, TreadCorner>> = {};
    for (const corner of CORNERS) {
      const values: Partial<TreadCorner> = {};
      const typed = (['innerMm', 'middleMm', 'outerMm'] as const).filter((p) => texts[corner][p].trim() !== '');
      if (typed.length === 0) continue;
      if (typed.length < 3) {
        found[`corners.${corner}`] = `${CORNER_NAMES[corner]}: enter all three (outer, middle, inner) or none`;
      }
      for (const pos of typed) {
        const si = inputToSi(texts[corner][pos], 'treadDepth', units);
        const path = `corners.${corner}.${pos}`;
        if (si === 'invalid' || si === null) found[path] = typeANumber();
        else if (si < LIMITS.treadMm.min || si > LIMITS.treadMm.max) {
          found[path] = `${texts[corner][pos].trim()} is out of range: enter ${formatQuantity(LIMITS.treadMm.min, 'treadDepth', units)} to ${formatQuantity(LIMITS.treadMm.max, 'treadDepth', units)}`;
        } else if (pos === 'middleMm' && set.startTreadMm !== null && si > set.startTreadMm + LIMITS.treadAboveStartMm) {
          found[path] = `Deeper than this set was new (${formatQuantity(set.startTreadMm, 'treadDepth', units)}); check the reading`;
        } else values[pos] = si;
      }
      if (typed.length === 3 && values.innerMm !== undefined && values.middleMm !== undefined && values.outerMm !== undefined) {
        corners[corner] = values as TreadCorner;
      }
    }
    const takenAtIso = fromLocalInputValue(takenAt);
    if (!takenAtIso) found.takenAt = 'Pick when the reading was taken';
    if (Object.keys(found).length === 0 && Object.keys(corners).length === 0) found._ = 'Enter at least one corner: outer, middle and inner.';
    if (Object.keys(found).length) {
      setErrors(found);
      setFormError(found._ ?? NEED_ATTENTION);
      showFirstRefused(formRef.current);
      return;
    }
    const body: CreateTreadReadingBody = {
      id: recordId,
      takenAt: takenAtIso!,
      corners,
      ...(notes.trim() ? { notes: notes.trim() } : {}),
    };
    const checked = createTreadReadingInputSchema.safeParse(body);
    if (!checked.success) {
      setFormError(checked.error.issues.map((i) => i.message).join('. '));
      return;
    }
    if (entryKey && watched.status === 'failed') {
      await outbox.retry(entryKey, body);
      return;
    }
    const entry = await write.mutateAsync(createTreadReadingEntry(carId, set.id, set.label, body));
    if (entry) setEntryKey(entry.key);
  };

  const waiting = watched.status === 'waiting';
  const reason = outbox.retryReason();
  const toUnit = (mm: number) => convert(mm, SI_UNITS.treadDepth, unitFor('treadDepth', units));

  // At or below the wear bars: a depth that can be real (0 or more) and is not refused; a refused one (−2) has its
  // own message and is no tyre's wear.
  const atWearBars = (si: unknown, path: string): si is number => typeof si === 'number' && si >= 0 && si <= WEAR_BAR_MM && !errors[path];
  // Every position typed at or below the wear bars, in words: said in text, not by colour alone.
  const worn = CORNERS.flatMap((corner) =>
    positionsAcross(corner).flatMap((pos) => {
      const si = inputToSi(texts[corner][pos], 'treadDepth', units);
      return atWearBars(si, `corners.${corner}.${pos}`) ? [`${CORNER_NAMES[corner].toLowerCase()} ${POSITION_WORDS[pos]} (${formatQuantity(si, 'treadDepth', units)})`] : [];
    }),
  );

  // Deeper than the last reading by more than a gauge's reading varies from one spot of a rib to the next (a few
  // tenths of a mm; from memory): tread does not grow, so the reading, the spot or the set is worth a second look.
  // Said, not refused: the driver knows what was measured.
  const deeper = CORNERS.flatMap((corner) =>
    positionsAcross(corner).flatMap((pos) => {
      const si = inputToSi(texts[corner][pos], 'treadDepth', units);
      const before = last?.corners[corner]?.[pos];
      return typeof si === 'number' && typeof before === 'number' && !errors[`corners.${corner}.${pos}`] && si - before > DEEPER_THAN_LAST_MM
        ? [`${CORNER_NAMES[corner].toLowerCase()} ${POSITION_WORDS[pos]} (${formatDelta(si - before, 'treadDepth', units)})`]
        : [];
    }),
  );

  return (
    <form ref={formRef} onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Tread reading" className="flex flex-col gap-5">
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-2 font-bold">Tyre set</legend>
        {sets.map((s) => (
          <label
            key={s.id}
            className={cn(
              'flex min-h-tap cursor-pointer items-center gap-3 rounded border px-3 py-2 font-semibold',
              s.id === setId ? 'border-2 border-accent bg-accent-soft' : 'border-line-strong bg-surface',
            )}
          >
            <input
              type="radio"
              name="tyre-set"
              className="size-5"
              checked={s.id === setId}
              disabled={waiting}
              onChange={() => {
                setSetId(s.id);
                setRecordId(crypto.randomUUID());
                setEntryKey(null);
              }}
            />
            <span className="min-w-0">
              {s.label}
              {s.size && !s.label.includes(s.size) ? <span className="font-normal text-ink-muted"> · {s.size}</span> : null}
            </span>
          </label>
        ))}
      </fieldset>

      <p className="tabular-figures flex flex-wrap items-center gap-2 text-sm text-ink-muted">
        {last ? (
          <>
            Compared with the last reading, {formatDateTime(last.takenAt)}
            {last.pending ? <PendingBadge state={last.pending.state} /> : null}
          </>
        ) : (
          'No earlier reading of this set: this one becomes the baseline.'
        )}
      </p>

      <div className="flex flex-col gap-1">
        <p id={unitId} className="font-semibold">
          Tread depth <span className="font-normal text-ink-muted">in {unit} · outer, middle, inner as on the car</span>
        </p>
        <CornerGrid
          dense
          label={`Tread depth (${unit})`}
          title={null}
          cornerNote={() => unit}
          cornerInvalid={(c) => Boolean(errors[`corners.${c}`]) || positionsAcross(c).some((p) => errors[`corners.${c}.${p}`])}
          renderCorner={(corner) => (
            <div className="flex flex-col gap-1">
              <div className="grid grid-cols-3 gap-1">
                {positionsAcross(corner).map((pos) => {
                  const path = `corners.${corner}.${pos}`;
                  const si = inputToSi(texts[corner][pos], 'treadDepth', units);
                  const before = last?.corners[corner]?.[pos];
                  // No change is worked out from a reading that is refused (out of range, deeper than new).
                  const change = typeof si === 'number' && before !== undefined && !errors[path] ? formatDelta(si - before, 'treadDepth', units) : null;
                  const low = atWearBars(si, path);
                  return (
                    <div key={pos} className="flex min-w-0 flex-col items-stretch gap-0.5 text-center">
                      <span className="text-xs font-semibold text-ink-muted" aria-hidden="true">
                        {POSITION_SHORT[pos]}
                      </span>
                      <input
                        type="text"
                        inputMode="decimal"
                        autoComplete="off"
                        aria-label={`${CORNER_NAMES[corner]} ${POSITION_WORDS[pos]}`}
                        aria-describedby={`${unitId} ${path}-change`}
                        aria-invalid={errors[path] ? true : undefined}
                        value={texts[corner][pos]}
                        onChange={(e) => setText(corner, pos, e.target.value)}
                        className={cn(
                          'tabular-figures min-h-tap w-full min-w-0 rounded border bg-surface px-0.5 text-center text-base text-ink',
                          errors[path] ? 'border-2 border-warning' : 'border-line-strong',
                        )}
                      />
                      <span id={`${path}-change`} className={cn('tabular-figures text-xs', low ? 'font-bold text-warning' : 'text-ink-muted')}>
                        {/* Before anything is typed, the last reading, in full ink-muted (readable in sun, and never taken for a typed value). */}
                        {change ?? (before !== undefined && !texts[corner][pos].trim() ? `was ${toUnit(before).toFixed(1)}` : '\u00a0')}
                        {low ? <span className="sr-only"> (at or below the wear bars)</span> : null}
                      </span>
                    </div>
                  );
                })}
              </div>
              {errors[`corners.${corner}`] || positionsAcross(corner).some((p) => errors[`corners.${corner}.${p}`]) ? (
                // One line per message, each reading's named: "Middle: 40 is out of range…".
                <ul className="flex flex-col gap-0.5 text-xs font-semibold text-warning">
                  {[errors[`corners.${corner}`], ...positionsAcross(corner).map((p) => errors[`corners.${corner}.${p}`] && `${capitalise(POSITION_WORDS[p])}: ${errors[`corners.${corner}.${p}`]}`)]
                    .filter(Boolean)
                    .map((message) => (
                      <li key={message}>{message}</li>
                    ))}
                </ul>
              ) : null}
            </div>
          )}
        />
        <p className="text-xs text-ink-muted">Under each box: the last reading (“was”) until you type, then ▲/▼, the change since it.</p>
        {worn.length > 0 ? (
          <p role="status" className="mt-1 flex items-start gap-2 rounded border-2 border-warning-line bg-warning-surface px-3 py-2 text-sm font-semibold text-warning">
            <TriangleAlert aria-hidden="true" className="mt-0.5 size-5 shrink-0" />
            <span>
              At or below the wear bars ({formatQuantity(WEAR_BAR_MM, 'treadDepth', units)}): {worn.join(', ')}. A tyre worn to them is done: follow your local
              law and the tyre maker’s advice.
            </span>
          </p>
        ) : null}
        {deeper.length > 0 ? (
          <p role="status" className="mt-1 text-sm font-semibold">
            Deeper than the last reading: {deeper.join(', ')}. Tread does not grow back; check the gauge, the spot measured and that this is the
            same set.
          </p>
        ) : null}
      </div>

      <TextField label="Taken at" type="datetime-local" value={takenAt} error={errors.takenAt} onChange={(e) => setTakenAt(e.target.value)} />
      <TextField label="Note (optional)" value={notes} maxLength={2000} onChange={(e) => setNotes(e.target.value)} />

      <Caution title="Wear limit">
        <p>
          Tyre wear indicators sit at {formatQuantity(WEAR_BAR_MM, 'treadDepth', units)} ({units.treadDepth === 'mm' ? '2/32 in' : '1.6 mm'}). A
          tyre worn to them is done: follow your local law and the tyre maker’s advice.
        </p>
      </Caution>

      <div className={SAVE_BAR_CLASSES}>
        {/* A message that points at marked readings goes once none is marked any more. */}
        <FormAlert message={formError && (!MARKED_ABOVE.has(formError) || Object.values(errors).some(Boolean)) ? formError : null} />
        {waiting ? (
          <p className="text-sm font-semibold">
            Saved on this phone. {reason ? `Waiting to upload (${reason}) — it goes by itself; you can leave this page.` : 'Uploading…'}{' '}
            <Link to={pathTo.car(carId)} className="text-link underline">
              Back to the car
            </Link>
          </p>
        ) : null}
        <Button type="submit" className="min-h-tap-lg w-full text-lg" disabled={!set || waiting || uploaded} isPending={write.isPending} pendingLabel="Saving…">
          {watched.status === 'failed' ? 'Fix and send again' : 'Save tread reading'}
        </Button>
      </div>
    </form>
  );
}

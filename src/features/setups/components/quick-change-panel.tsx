import { useState, type FormEvent } from 'react';
import { Minus, Plus, Trash2 } from 'lucide-react';
import { fromDisplay, type Quantity, type UnitPreferences } from '@shared/calc/units.calc';
import { axleOf, CORNERS, type Corner } from '@shared/season/corners';
import type { Car } from '@shared/season/car.schema';
import { adjusterFor, clickDirection, cornersWithAdjuster, isClickField, type ClickField } from '@shared/season/damper-clicks';
import { QUICK_CHANGE_FIELDS, quickChangeInputSchema, type QuickChangeInput } from '@shared/season/setup.schema';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { FormAlert } from '@/components/ui/form-alert';
import { SelectField } from '@/components/ui/select-field';
import { cn } from '@/lib/cn';
import { formatSigned, parseDecimal, tidy, typeANumber, unitSymbol } from '@/lib/numbers';
import { toast } from '@/lib/toast-store';
import { useUnits } from '@/lib/units-context';
import { quickChangeEntry, useQuickChange, type QuickChangeBody } from '../api/quick-change';
import { FIELD_INFO, formatFieldValue } from '@/lib/setup-fields';
import { QUICK_CHANGE_PREFIX, setupInForce, type AppliedQuickChange, type SetupView } from '../utils/setup-views';
import { checkedQuickChange } from '../utils/checked-quick-change';

type QuickField = (typeof QUICK_CHANGE_FIELDS)[number];

interface ChangeLine {
  id: number;
  field: QuickField;
  corners: Corner[];
  mode: 'delta' | 'value';
  amount: string;
}

const PRESETS: { label: string; corners: Corner[] }[] = [
  { label: 'All four', corners: ['lf', 'rf', 'lr', 'rr'] },
  { label: 'Front', corners: ['lf', 'rf'] },
  { label: 'Rear', corners: ['lr', 'rr'] },
];

/** A sensible nudge per field and unit: one click, half a psi, a tenth of a degree. */
function stepOf(field: QuickField, units: UnitPreferences): number {
  const quantity = FIELD_INFO[field].quantity;
  if (!quantity) return 1;
  const unit = units[quantity as keyof UnitPreferences];
  const steps: Record<string, number> = { kPa: 1, bar: 0.05, psi: 0.5, deg: 0.1, mm: field === 'toeMm' ? 0.5 : 1, in: field === 'toeMm' ? 0.02 : 0.05 };
  return steps[unit] ?? 1;
}

/** The amount typed, in SI: deltas of pressure and length scale by the unit's factor like values do. */
function toSi(value: number, quantity: Quantity | null, units: UnitPreferences): number {
  return quantity ? tidy(fromDisplay(value, quantity, units)) : value;
}

const FIELD_OPTIONS = QUICK_CHANGE_FIELDS.map((f) => ({ value: f, label: FIELD_INFO[f].label }));

function whereWords(corners: Corner[]): string {
  const preset = PRESETS.find((p) => p.corners.length === corners.length && p.corners.every((c) => corners.includes(c)));
  if (preset) return preset.label.toLowerCase();
  return CORNERS.filter((c) => corners.includes(c))
    .map((c) => c.toUpperCase())
    .join('+');
}

function describeLine(line: ChangeLine, amount: number, units: UnitPreferences): string {
  const { label, quantity } = FIELD_INFO[line.field];
  const text =
    line.mode === 'value'
      ? `= ${formatFieldValue(line.field, quantity ? toSi(amount, quantity, units) : amount, units)}`
      : quantity
        ? formatSigned(amount, quantity, units)
        : `${amount > 0 ? '+' : '−'}${Math.abs(amount)}`;
  return `${whereWords(line.corners)} ${label.toLowerCase()} ${text}`;
}

/** Which axles have adjustable dampers: the car's own count of clicks, left empty where they are fixed. */
type AdjustableDampers = { front: boolean; rear: boolean };

/**
 * Which way a line moves the clicks: "stiffer" or "softer" when every chosen corner goes the same way on an adjuster
 * the car describes, null when a corner's clicks are not known before or after, or the corners go different ways.
 */
function clicksWay(adjusters: Car['damperAdjusters'], line: ChangeLine, before: SetupView | null, after: AppliedQuickChange | null) {
  if (!isClickField(line.field) || !after || after.problems.length > 0) return null;
  const moves = line.corners.map((c) => {
    const from = before?.corners[c]?.[line.field] ?? null;
    const to = after.corners[c][line.field] ?? null;
    return from === null || to === null ? Number.NaN : Math.sign(to - from);
  });
  const [move = 0] = moves;
  return moves.every((m) => m === move) ? clickDirection(adjusters, line.corners, move, line.field) : null;
}

/**
 * The first thing offered: clicks on the axles whose dampers adjust (the commonest change between heats), or,
 * on a car with fixed dampers, cold pressures all round.
 */
function firstChange(dampers: AdjustableDampers): Pick<ChangeLine, 'field' | 'corners'> {
  const adjustable = CORNERS.filter((c) => dampers[axleOf(c)]);
  return adjustable.length > 0 ? { field: 'damperClicks', corners: adjustable } : { field: 'coldPressureKpa', corners: [...CORNERS] };
}

/** "Change by" where a chosen corner records the value to change from; "Set to" where none does (nothing to add to). */
function modeFor(base: Pick<SetupView, 'corners'> | null, field: QuickField, corners: readonly Corner[]): ChangeLine['mode'] {
  return corners.some((c) => typeof base?.corners[c]?.[field] === 'number') ? 'delta' : 'value';
}

let nextLineId = 1;
const newLine = (dampers: AdjustableDampers, base: SetupView | null): ChangeLine => {
  const first = firstChange(dampers);
  return { id: nextLineId++, ...first, mode: modeFor(base, first.field, first.corners), amount: '' };
};

interface QuickChangePanelProps {
  carId: string;
  /** The car's damper adjusters: clicks are offered only where they exist (a car with none starts on pressures), and say which way they go. */
  adjusters: Car['damperAdjusters'];
  /** Saved and pending snapshots of the car, newest first. */
  setups: readonly SetupView[];
  onDone: () => void;
}

/**
 * A small change between runs — clicks, pressures, camber — saved as a new snapshot derived from
 * the one in force, through the outbox, stamped with the time of the tap.
 */
export function QuickChangePanel({ carId, adjusters, setups, onDone }: QuickChangePanelProps) {
  const units = useUnits();
  const dampers: AdjustableDampers = { front: adjusters.front !== null, rear: adjusters.rear !== null };
  const write = useQuickChange();
  const base = setupInForce(setups, new Date().toISOString());
  const [lines, setLines] = useState<ChangeLine[]>(() => [newLine(dampers, base)]);
  const [notes, setNotes] = useState('');
  const [errors, setErrors] = useState<Record<number, string>>({});
  const [formError, setFormError] = useState<string | null>(null);
  // Clicks where the dampers have them (fixed dampers none, unless the setup in force records some all the same), and
  // rebound clicks where the car describes a rebound adjuster or that setup records them, as the shop's suggestion form
  // offers them.
  const fieldOptions = FIELD_OPTIONS.filter((o) => !isClickField(o.value) || cornersWithAdjuster(adjusters, base?.corners ?? {}, o.value).length > 0);

  const update = (id: number, patch: Partial<ChangeLine>) => {
    setLines((ls) => ls.map((l) => (l.id === id ? { ...l, ...patch } : l)));
    setErrors((e) => ({ ...e, [id]: '' }));
    setFormError(null);
  };

  const amountOf = (line: ChangeLine): number | null => {
    const parsed = parseDecimal(line.amount);
    return parsed.kind === 'number' ? parsed.value : null;
  };

  const toChanges = (): { changes: QuickChangeInput['changes']; words: string[] } | null => {
    const lineErrors: Record<number, string> = {};
    const changes: QuickChangeInput['changes'] = [];
    const words: string[] = [];
    for (const line of lines) {
      const amount = amountOf(line);
      const { quantity } = FIELD_INFO[line.field];
      if (line.corners.length === 0) lineErrors[line.id] = 'Pick at least one corner';
      else if (amount === null) lineErrors[line.id] = line.amount.trim() ? typeANumber() : 'Choose how much to change';
      else if (line.mode === 'delta' && amount === 0) lineErrors[line.id] = 'A change of 0 changes nothing';
      else if (!quantity && !Number.isInteger(amount)) lineErrors[line.id] = 'Clicks are whole numbers';
      if (lineErrors[line.id] || amount === null) continue;
      const si = toSi(amount, quantity, units);
      // Set to what every chosen corner already has: no change, and its words would name one that was not made.
      if (line.mode === 'value' && line.corners.every((c) => Math.abs((base?.corners[c]?.[line.field] ?? Number.NaN) - si) < 1e-6)) {
        lineErrors[line.id] = 'Each corner chosen already has this value: that changes nothing';
        continue;
      }
      changes.push({ field: line.field, corners: CORNERS.filter((c) => line.corners.includes(c)), ...(line.mode === 'delta' ? { delta: si } : { value: si }) });
      words.push(describeLine(line, amount, units));
    }
    setErrors(lineErrors);
    return Object.values(lineErrors).some(Boolean) ? null : { changes, words };
  };

  const onSubmit = async (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    const built = toChanges();
    if (!built) return;
    const { problems } = checkedQuickChange(base, built.changes);
    if (problems.length) {
      setFormError(problems.join('. '));
      return;
    }
    const label = `${QUICK_CHANGE_PREFIX}${built.words.join(', ')}`;
    const body: QuickChangeBody = {
      id: crypto.randomUUID(),
      label: label.length > 80 ? `${label.slice(0, 79)}…` : label,
      // The device time of the tap: the runs after it belong to the new setup even when it is uploaded later.
      effectiveFrom: new Date().toISOString(),
      changes: built.changes,
      ...(notes.trim() ? { notes: notes.trim() } : {}),
    };
    const checked = quickChangeInputSchema.safeParse(body);
    if (!checked.success) {
      setFormError(checked.error.issues.map((i) => i.message).join('. '));
      return;
    }
    await write.mutateAsync(quickChangeEntry(carId, body));
    toast({ tone: 'success', title: 'Quick change saved', description: body.label });
    setLines([newLine(dampers, base)]);
    setNotes('');
    onDone();
  };

  return (
    <form onSubmit={(e) => void onSubmit(e)} noValidate aria-label="Quick change" className="flex flex-col gap-4">
      <p className="text-sm text-ink-muted">
        {base ? (
          <>
            Changes <span className="font-semibold text-ink">{base.label}</span> and starts a new setup now.
          </>
        ) : (
          'No setup is recorded for this car yet: use “Set to” to give values.'
        )}
      </p>
      {lines.map((line, index) => {
        const { quantity, label } = FIELD_INFO[line.field];
        const unit = quantity ? unitSymbol(quantity, units) : 'clicks';
        const amount = amountOf(line);
        const step = stepOf(line.field, units);
        const errorId = `qc-${line.id}-error`;
        const preview = amount !== null ? checkedQuickChange(base, [{ field: line.field, corners: line.corners, ...(line.mode === 'delta' ? { delta: toSi(amount, quantity, units) } : { value: toSi(amount, quantity, units) }) }]) : null;
        // What this change would leave out of range is said as it is typed, not only on Save.
        const lineError = errors[line.id] || (preview?.problems.length ? preview.problems.join('. ') : '');
        const way = clicksWay(adjusters, line, base, preview);
        return (
          <fieldset key={line.id} className="flex flex-col gap-3 rounded border border-line p-3" aria-describedby={lineError ? errorId : undefined}>
            <legend className="px-1 font-bold">Change {index + 1}</legend>
            <div className="flex items-end gap-2">
              <SelectField
                className="flex-1"
                label="What"
                value={line.field}
                options={fieldOptions}
                onChange={(e) => {
                  const field = e.target.value as QuickField;
                  update(line.id, { field, mode: modeFor(base, field, line.corners), amount: '' });
                }}
              />
              {lines.length > 1 ? (
                <Button variant="quiet" aria-label={`Remove change ${index + 1}`} onClick={() => setLines((ls) => ls.filter((l) => l.id !== line.id))}>
                  <Trash2 aria-hidden="true" className="size-5" />
                </Button>
              ) : null}
            </div>
            <div className="flex flex-col gap-2">
              <p className="text-sm font-semibold">Where</p>
              <div className="flex gap-2">
                {PRESETS.map((p) => {
                  const on = p.corners.length === line.corners.length && p.corners.every((c) => line.corners.includes(c));
                  return (
                    <button
                      key={p.label}
                      type="button"
                      aria-pressed={on}
                      onClick={() => update(line.id, { corners: p.corners })}
                      className={cn(
                        'min-h-tap flex-1 rounded border px-2 font-bold',
                        on ? 'border-accent bg-accent text-accent-ink' : 'border-line-strong bg-surface text-ink hover:bg-surface-raised',
                      )}
                    >
                      {p.label}
                    </button>
                  );
                })}
              </div>
              <CornerGrid
                label={`Corners for change ${index + 1}`}
                title={null}
                renderCorner={(corner) => {
                  const on = line.corners.includes(corner);
                  const before = base?.corners[corner]?.[line.field];
                  const after = preview?.corners[corner][line.field];
                  return (
                    <button
                      type="button"
                      aria-pressed={on}
                      aria-label={CORNER_NAMES[corner]}
                      onClick={() =>
                        update(line.id, { corners: on ? line.corners.filter((c) => c !== corner) : [...line.corners, corner] })
                      }
                      className={cn(
                        'tabular-figures flex min-h-tap w-full flex-col items-center justify-center rounded border px-1 text-sm',
                        on ? 'border-2 border-accent bg-accent-soft font-bold text-ink' : 'border-line-strong bg-surface text-ink-muted',
                      )}
                    >
                      <span aria-hidden="true">{on ? '✓ ' : ''}{formatFieldValue(line.field, before, units)}</span>
                      {on && after !== undefined && after !== before ? (
                        <span aria-hidden="true">→ {formatFieldValue(line.field, after, units)}</span>
                      ) : null}
                    </button>
                  );
                }}
              />
            </div>
            <div className="flex flex-col gap-2">
              <div className="flex gap-2" role="group" aria-label="Change by or set to">
                {(['delta', 'value'] as const).map((mode) => (
                  <button
                    key={mode}
                    type="button"
                    aria-pressed={line.mode === mode}
                    onClick={() => update(line.id, { mode, amount: '' })}
                    className={cn(
                      'min-h-tap flex-1 rounded border px-2 font-bold',
                      line.mode === mode ? 'border-accent bg-accent-soft text-ink' : 'border-line-strong bg-surface text-ink-muted',
                    )}
                  >
                    {mode === 'delta' ? 'Change by' : 'Set to'}
                  </button>
                ))}
              </div>
              <div className="flex items-center gap-2">
                {line.mode === 'delta' ? (
                  <button
                    type="button"
                    className="inline-flex size-tap-lg shrink-0 items-center justify-center rounded border border-line-strong bg-surface hover:bg-surface-raised"
                    aria-label={`Less ${label.toLowerCase()}`}
                    onClick={() => update(line.id, { amount: String(tidy((amount ?? 0) - step)) })}
                  >
                    <Minus aria-hidden="true" className="size-6" />
                  </button>
                ) : null}
                <label className="flex min-h-tap-lg min-w-0 flex-1 items-center rounded border border-line-strong bg-surface focus-within:outline-3 focus-within:outline-offset-2 focus-within:outline-focus">
                  <span className="sr-only">
                    {line.mode === 'delta' ? `Change ${label.toLowerCase()} by` : `Set ${label.toLowerCase()} to`} ({unit})
                  </span>
                  <input
                    type="text"
                    inputMode={line.mode === 'delta' || FIELD_INFO[line.field].signed ? 'text' : 'decimal'}
                    autoComplete="off"
                    value={line.amount}
                    placeholder={line.mode === 'delta' ? `±${step}` : ''}
                    onChange={(e) => update(line.id, { amount: e.target.value })}
                    aria-invalid={lineError ? true : undefined}
                    aria-describedby={lineError ? errorId : undefined}
                    className="tabular-figures min-h-tap-lg w-full min-w-0 bg-transparent px-3 text-center text-2xl font-bold outline-none"
                  />
                  <span className="shrink-0 pr-3 font-semibold text-ink-muted">{unit}</span>
                </label>
                {line.mode === 'delta' ? (
                  <button
                    type="button"
                    className="inline-flex size-tap-lg shrink-0 items-center justify-center rounded border border-line-strong bg-surface hover:bg-surface-raised"
                    aria-label={`More ${label.toLowerCase()}`}
                    onClick={() => update(line.id, { amount: String(tidy((amount ?? 0) + step)) })}
                  >
                    <Plus aria-hidden="true" className="size-6" />
                  </button>
                ) : null}
              </div>
              {/* Always there, so a screen reader hears the words change; out of the layout while it has none. */}
              <p className={way ? 'text-sm font-semibold' : 'sr-only'} aria-live="polite">
                {way
                  ? `${way === 'stiffer' ? 'Stiffer' : 'Softer'} (${label.toLowerCase()} count from ${adjusterFor(adjusters, axleOf(line.corners[0]!), line.field as ClickField)?.countFrom === 'full_soft' ? 'full soft' : 'full stiff'})`
                  : ''}
              </p>
              {lineError ? (
                <p id={errorId} className="text-sm font-semibold text-warning">
                  {lineError}
                </p>
              ) : null}
            </div>
          </fieldset>
        );
      })}
      <div>
        <Button variant="quiet" onClick={() => setLines((ls) => [...ls, newLine(dampers, base)])}>
          <Plus aria-hidden="true" className="size-5" /> Another change
        </Button>
      </div>
      <label className="flex flex-col gap-1">
        <span className="font-semibold">Note (optional)</span>
        <input
          type="text"
          value={notes}
          maxLength={2000}
          onChange={(e) => setNotes(e.target.value)}
          className="min-h-tap rounded border border-line-strong bg-surface px-3 text-base"
        />
      </label>
      <Caution title="Before you change the car">
        <p>
          Set pressures with a gauge you trust, and let hot tyres cool before comparing with cold figures. Change camber, toe or ride
          height only with the car on stands on firm, level ground, never under a car held only by a jack; have the alignment checked
          afterwards. Stay within the manufacturer’s data and your event’s rules.
        </p>
      </Caution>
      <FormAlert message={formError} />
      <div className="flex gap-2">
        <Button type="submit" className="min-h-tap-lg flex-1 text-lg" isPending={write.isPending} pendingLabel="Saving…">
          Save quick change
        </Button>
        <Button variant="secondary" className="min-h-tap-lg" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

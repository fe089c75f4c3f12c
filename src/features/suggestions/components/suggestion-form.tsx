import { useState, type FormEvent } from 'react';
import { Plus, Trash2 } from 'lucide-react';
import { createSuggestionInputSchema, type Suggestion, type SuggestionChange } from '@shared/collab/suggestion.schema';
import type { Car } from '@shared/season/car.schema';
import { CORNERS, type Corner } from '@shared/season/corners';
import { CLICK_FIELDS, cornersWithAdjuster, isClickField, type ClickField } from '@shared/season/damper-clicks';
import { SETUP_CORNER_FIELDS, type Setup, type SetupCornerField } from '@shared/season/setup.schema';
import { CornerGrid } from '@/components/corner-grid/corner-grid';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { FormAlert } from '@/components/ui/form-alert';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { SelectField } from '@/components/ui/select-field';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { isApiError } from '@/lib/api-client';
import { cn } from '@/lib/cn';
import { formatDateTime } from '@/lib/dates';
import { unitSymbol } from '@/lib/numbers';
import { FIELD_INFO, formatFieldValue } from '@/lib/setup-fields';
import { useUnits } from '@/lib/units-context';
import { useCreateSuggestion, type CreateSuggestionBody } from '../api/create-suggestion';
import { CORNER_SETS, newChangeRow, outOfRange, previewChanges, rowToChange, type ChangeRow } from '../utils/change-rows';
import { deltaHint, examplePlaceholder } from '../utils/delta-hint';
import { FromTo } from './change-preview';
import { TextArea } from '@/components/ui/text-area';
import { UnusualValues } from './unusual-values';

type Errors = Record<string, string>;

const MODE_OPTIONS = [
  { value: 'delta', label: 'Change by' },
  { value: 'value', label: 'Set to' },
] as const;

const sameSet = (a: readonly string[], b: readonly string[]) => a.length === b.length && a.every((x) => b.includes(x));

/** Server or schema field errors as one message per field. */
function flatten(fieldErrors: Record<string, string[]>): Errors {
  return Object.fromEntries(Object.entries(fieldErrors).map(([k, v]) => [k, v.join(' ')]));
}

/** The values the shop may change, named as the setups name them: clicks only where the car's dampers have that adjuster. */
type Offered = { fields: { value: SetupCornerField; label: string }[]; corners: (field: SetupCornerField) => readonly Corner[] };

function offeredFor(adjusters: Car['damperAdjusters'], base: Setup): Offered {
  const clickCorners = Object.fromEntries(CLICK_FIELDS.map((f) => [f, cornersWithAdjuster(adjusters, base.corners, f)])) as Record<ClickField, Corner[]>;
  const corners = (field: SetupCornerField) => (isClickField(field) ? clickCorners[field] : CORNERS);
  return {
    fields: SETUP_CORNER_FIELDS.filter((f) => corners(f).length > 0).map((f) => ({ value: f, label: FIELD_INFO[f].label })),
    corners,
  };
}

/** "Only the front dampers have this adjuster on this car." when one axle's do; null when all four corners do. */
function onlyWhere(corners: readonly Corner[]): string | null {
  if (corners.length === CORNERS.length) return null;
  return `Only the ${corners.includes('lf') ? 'front' : 'rear'} dampers have this adjuster on this car.`;
}

interface RowEditorProps {
  row: ChangeRow;
  index: number;
  count: number;
  base: Setup;
  offered: Offered;
  /** The changes before this row, in SI, so the preview builds on them. */
  before: readonly SuggestionChange[];
  errors: Errors;
  onChange: (patch: Partial<ChangeRow>) => void;
  onRemove: () => void;
}

function RowEditor({ row, index, count, base, offered, before, errors, onChange, onRemove }: RowEditorProps) {
  const units = useUnits();
  const { label, quantity, signed } = FIELD_INFO[row.field];
  const corners = offered.corners(row.field);
  const where = onlyWhere(corners);
  const unit = quantity ? unitSymbol(quantity, units) : 'clicks';
  const { change } = rowToChange(row, units);
  const cells = change ? previewChanges(base, [...before, change]).slice(-change.corners.length) : [];
  const at = `changes.${index}`;
  const cornerError = errors[`${at}.corners`];
  // A value the change would take out of range is said as it is typed, not only when the server refuses it.
  const rangeError = outOfRange(cells).join('. ') || undefined;
  const amountError = errors[`${at}.${row.mode}`] ?? errors[`${at}.delta`] ?? errors[`${at}.value`] ?? errors[`${at}.field`] ?? rangeError;
  const name = `change ${index + 1}`;

  return (
    <fieldset className="flex flex-col gap-3 rounded border border-line p-3">
      <legend className="px-1 font-bold">Change {index + 1}</legend>
      <div className="flex items-end gap-2">
        <SelectField
          className="flex-1"
          label="What"
          value={row.field}
          options={offered.fields}
          onChange={(e) => {
            const field = e.target.value as SetupCornerField;
            // Corners without this adjuster are let go of.
            onChange({ field, amount: '', corners: row.corners.filter((c) => offered.corners(field).includes(c)) });
          }}
        />
        {count > 1 ? (
          <Button variant="quiet" aria-label={`Remove ${name}`} onClick={onRemove}>
            <Trash2 aria-hidden="true" className="size-5" />
          </Button>
        ) : null}
      </div>
      {FIELD_INFO[row.field].note ? <p className="text-sm text-ink-muted">{FIELD_INFO[row.field].note}</p> : null}
      <div className="flex flex-col gap-2">
        <p className="text-sm font-semibold">Corners</p>
        <div className="flex flex-wrap gap-2" role="group" aria-label={`Corner shortcuts for ${name}`}>
          {CORNER_SETS.map((set) => (
            <button
              key={set.label}
              type="button"
              aria-pressed={sameSet(row.corners, set.corners)}
              disabled={!set.corners.every((c) => corners.includes(c))}
              onClick={() => onChange({ corners: [...set.corners] })}
              className={cn(
                'min-h-tap flex-1 rounded border px-2 font-bold disabled:opacity-50',
                sameSet(row.corners, set.corners) ? 'border-accent bg-accent text-accent-ink' : 'border-line-strong bg-surface text-ink hover:bg-surface-raised',
              )}
            >
              {set.label}
            </button>
          ))}
        </div>
        <CornerGrid
          label={`Corners for ${name}`}
          title={null}
          cornerInvalid={() => Boolean(cornerError)}
          renderCorner={(corner) => {
            const on = row.corners.includes(corner);
            const cell = cells.find((c) => c.corner === corner);
            return (
              <button
                type="button"
                aria-pressed={on}
                disabled={!corners.includes(corner)}
                onClick={() => onChange({ corners: on ? row.corners.filter((c) => c !== corner) : [...row.corners, corner] })}
                className={cn(
                  'flex min-h-tap w-full flex-col items-stretch justify-center rounded border px-2 py-1 disabled:opacity-50',
                  on ? 'border-2 border-accent bg-accent-soft text-ink' : 'border-line-strong bg-surface text-ink-muted',
                )}
              >
                <span className="text-left text-sm font-bold">
                  <span aria-hidden="true">{on ? '✓ ' : ''}</span>
                  {corner.toUpperCase()}
                </span>
                {on && cell ? (
                  <FromTo cell={cell} />
                ) : (
                  <span className="tabular-figures text-right text-sm">{formatFieldValue(row.field, base.corners[corner]?.[row.field], units)}</span>
                )}
              </button>
            );
          }}
        />
        {where ? <p className="text-sm text-ink-muted">{where}</p> : null}
        {cornerError ? <p className="text-sm font-semibold text-warning">{cornerError}</p> : null}
      </div>
      <SegmentedControl
        label={`How to change ${label.toLowerCase()}`}
        hideLabel
        options={MODE_OPTIONS}
        value={row.mode}
        onChange={(mode) => onChange({ mode, amount: '' })}
      />
      <UnitInput
        label={row.mode === 'delta' ? `Change ${label.toLowerCase()} by` : `Set ${label.toLowerCase()} to`}
        unit={unit}
        signed={signed || row.mode === 'delta'}
        value={row.amount}
        placeholder={row.mode === 'delta' ? examplePlaceholder(row.field, units) : ''}
        onChange={(e) => onChange({ amount: e.target.value })}
        hint={row.mode === 'delta' ? deltaHint(row.field, base, row.corners, units) : undefined}
        error={amountError}
      />
    </fieldset>
  );
}

interface SuggestionFormProps {
  carId: string;
  /** The car's damper adjusters: clicks are offered only on the axles whose dampers have them. */
  adjusters: Car['damperAdjusters'];
  /** The snapshot the changes are worked out against. */
  base: Setup;
  onCreated: (suggestion: Pick<Suggestion, 'id'>) => void;
}

/**
 * Shop staff propose setup changes against one snapshot: typed in the user's units, sent in SI,
 * with each corner's from → to shown as they type.
 */
export function SuggestionForm({ carId, adjusters, base, onCreated }: SuggestionFormProps) {
  const units = useUnits();
  const offered = offeredFor(adjusters, base);
  const create = useCreateSuggestion(carId);
  const [id, setId] = useState(() => crypto.randomUUID());
  const [title, setTitle] = useState('');
  const [rationale, setRationale] = useState('');
  const [rows, setRows] = useState<ChangeRow[]>(() => [newChangeRow()]);
  const [errors, setErrors] = useState<Errors>({});
  const [formError, setFormError] = useState<string | null>(null);

  const clear = (...keys: string[]) =>
    setErrors((e) => {
      const next = { ...e };
      for (const k of Object.keys(next)) if (keys.some((key) => k === key || k.startsWith(`${key}.`))) delete next[k];
      return next;
    });

  const updateRow = (index: number, patch: Partial<ChangeRow>) => {
    setRows((rs) => rs.map((r, i) => (i === index ? { ...r, ...patch } : r)));
    clear(`changes.${index}`, 'changes');
  };

  // The changes that are complete so far, for each row's preview to build on.
  const built = rows.map((r) => rowToChange(r, units).change);
  const beforeRow = (index: number) => built.slice(0, index).filter((c): c is SuggestionChange => c !== null);
  const complete = built.filter((c): c is SuggestionChange => c !== null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    const found: Errors = {};
    const changes: SuggestionChange[] = [];
    rows.forEach((row, i) => {
      const { change, problems } = rowToChange(row, units);
      for (const p of problems) found[`changes.${i}.${p.path}`] ??= p.message;
      if (!change) return;
      const range = outOfRange(previewChanges(base, [...changes, change]).slice(-change.corners.length));
      if (range.length) found[`changes.${i}.${row.mode}`] ??= range.join('. ');
      changes.push(change);
    });
    const body: CreateSuggestionBody = { id, baseSetupId: base.id, title, rationale, changes };
    const checked = createSuggestionInputSchema.safeParse(body);
    // Keyed like the server's field errors ("title", "changes.0.delta"), so both land on the same inputs.
    for (const issue of checked.error?.issues ?? []) {
      const key = issue.path.join('.') || 'changes';
      // A row with its own problem is not missing: it is only not finished.
      if (key === 'changes' && Object.keys(found).length) continue;
      found[key] ??= issue.message;
    }
    setErrors(found);
    if (Object.keys(found).length > 0 || !checked.success) {
      setFormError('Some answers need another look; they are marked above.');
      return;
    }
    create.mutate(
      { ...checked.data, id },
      {
        onSuccess: (suggestion) => {
          setId(crypto.randomUUID());
          onCreated({ id: suggestion?.id ?? id });
        },
        onError: (error) => {
          if (isApiError(error) && error.code === 'network') {
            setFormError('No connection. Everything you typed is still here; send it again when you have signal.');
          } else if (isApiError(error) && error.hasFieldErrors) {
            setErrors(flatten(error.fieldErrors));
            setFormError('The server could not take some answers; they are marked above.');
          } else {
            setFormError(isApiError(error) ? error.message : 'Something went wrong. Everything you typed is still here; try again.');
          }
        },
      },
    );
  };

  return (
    <form onSubmit={submit} noValidate aria-label="Suggest a setup change" className="flex flex-col gap-5">
      <p className="text-sm text-ink-muted">
        For the setup “<span className="font-semibold text-ink">{base.label}</span>”, in force from {formatDateTime(base.effectiveFrom)}.
        {errors.baseSetupId ? <span className="block font-semibold text-warning">{errors.baseSetupId}</span> : null}
      </p>
      <TextField
        label="Title"
        hint="One line the driver sees first, e.g. “More front camber for the tight sections”."
        value={title}
        maxLength={120}
        error={errors.title}
        onChange={(e) => {
          setTitle(e.target.value);
          clear('title');
        }}
      />
      <TextArea
        label="Why"
        hint="What you saw in the times or the tread, and what the driver should feel."
        value={rationale}
        maxLength={4000}
        error={errors.rationale}
        onChange={(v) => {
          setRationale(v);
          clear('rationale');
        }}
      />
      {rows.map((row, index) => (
        <RowEditor
          key={row.key}
          row={row}
          index={index}
          count={rows.length}
          base={base}
          offered={offered}
          before={beforeRow(index)}
          errors={errors}
          onChange={(patch) => updateRow(index, patch)}
          onRemove={() => {
            setRows((rs) => rs.filter((_, i) => i !== index));
            setErrors({});
          }}
        />
      ))}
      {errors.changes ? <p className="text-sm font-semibold text-warning">{errors.changes}</p> : null}
      {rows.length < 20 ? (
        <div>
          <Button variant="quiet" onClick={() => setRows((rs) => [...rs, newChangeRow()])}>
            <Plus aria-hidden="true" className="size-5" /> Another change
          </Button>
        </div>
      ) : null}
      <UnusualValues side="shop" changes={complete} current={base.corners} />
      <Caution>
        <p>
          Alignment, suspension and pressure changes must stay within the vehicle and tyre makers’ data and the event’s rules, and
          be made by someone competent to do them. The driver decides whether to make them.
        </p>
      </Caution>
      <FormAlert message={formError} />
      <div>
        <Button type="submit" className="min-h-tap-lg" isPending={create.isPending} pendingLabel="Sending…">
          Send the suggestion
        </Button>
      </div>
    </form>
  );
}

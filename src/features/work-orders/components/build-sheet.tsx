import { useState } from 'react';
import { TriangleAlert } from 'lucide-react';
import { formatQuantity, type Quantity, type UnitPreferences } from '@shared/calc/units.calc';
import { CORNERS, type Corner } from '@shared/season/corners';
import {
  BUILD_SHEET_FIELDS,
  type BuildSheetCorner,
  type BuildSheetCornerChecks,
  type BuildSheetField,
  type BuildSheetInput,
  type WorkOrder,
} from '@shared/service/work-order.schema';
import { CORNER_NAMES, CornerGrid } from '@/components/corner-grid/corner-grid';
import { Button } from '@/components/ui/button';
import { Caution } from '@/components/ui/caution';
import { FormAlert } from '@/components/ui/form-alert';
import { SegmentedControl } from '@/components/ui/segmented-control';
import { TextField } from '@/components/ui/text-field';
import { UnitInput } from '@/components/ui/unit-input';
import { inputToSi, parseDecimal, toInputText, typeANumber, unitSymbol } from '@/lib/numbers';
import { useUnits } from '@/lib/units-context';
import { usePutBuildSheet } from '../api/edit-work-order';
import { checkLines, isBlankCorner } from '../utils/build-sheet-checks';
import { attentionMessage, splitErrors, useShowRefused } from '../utils/field-errors';

type FieldKind = { kind: 'quantity'; quantity: Quantity } | { kind: 'clicks' } | { kind: 'text'; max: number };

/** Each build-sheet field: its name and how it is typed. */
const FIELD_INFO: Record<BuildSheetField, { label: string } & FieldKind> = {
  damperFreeLengthMm: { label: 'Damper free length', kind: 'quantity', quantity: 'length' },
  damperCompressedLengthMm: { label: 'Damper compressed length', kind: 'quantity', quantity: 'length' },
  referenceCompressedLengthMm: { label: 'Reference compressed length', kind: 'quantity', quantity: 'length' },
  strokeMm: { label: 'Stroke', kind: 'quantity', quantity: 'length' },
  bodyLengthSetting: { label: 'Body length setting', kind: 'text', max: 40 },
  mainSpringRateNPerMm: { label: 'Main spring rate', kind: 'quantity', quantity: 'springRate' },
  mainSpringFreeLengthMm: { label: 'Main spring free length', kind: 'quantity', quantity: 'length' },
  helperSpringRateNPerMm: { label: 'Helper spring rate', kind: 'quantity', quantity: 'springRate' },
  helperSpringFreeLengthMm: { label: 'Helper spring free length', kind: 'quantity', quantity: 'length' },
  perchPositionMm: { label: 'Perch position', kind: 'quantity', quantity: 'length' },
  preloadMm: { label: 'Preload', kind: 'quantity', quantity: 'length' },
  bumpClicks: { label: 'Bump clicks as delivered', kind: 'clicks' },
  reboundClicks: { label: 'Rebound clicks as delivered', kind: 'clicks' },
  wheelLoadKg: { label: 'Static wheel load', kind: 'quantity', quantity: 'mass' },
  wheelDroopMm: { label: 'Wheel droop from ride height', kind: 'quantity', quantity: 'length' },
  bumpStopMm: { label: 'Bump stop length', kind: 'quantity', quantity: 'length' },
  notes: { label: 'Notes', kind: 'text', max: 500 },
};

function valueText(field: BuildSheetField, value: string | number | null, units: UnitPreferences): string {
  const info = FIELD_INFO[field];
  if (value === null) return '—';
  if (info.kind === 'quantity') return formatQuantity(value as number, info.quantity, units);
  return String(value);
}

/** A helper spring is written on the corner's sheet. */
const hasHelper = (sheet: BuildSheetCorner | null) => sheet !== null && (sheet.helperSpringRateNPerMm !== null || sheet.helperSpringFreeLengthMm !== null);

/**
 * The server's checks for one corner, in plain words. A failed check reads as a warning, by eye (colour and icon)
 * and by ear (it begins "Warning:"); on paper the word is printed too, for a printer without colour.
 */
export function CornerChecks({ checks, toleranceMm, sheet }: { checks: BuildSheetCornerChecks | null; toleranceMm: number; sheet: BuildSheetCorner | null }) {
  const units = useUnits();
  const lines = checkLines(checks, toleranceMm, units, hasHelper(sheet));
  if (lines.length === 0) return null;
  return (
    <ul className="flex flex-col gap-1 text-sm" aria-label="Checks">
      {lines.map((l) =>
        l.failed ? (
          <li key={l.text} className="flex items-start gap-1 font-semibold text-warning">
            <TriangleAlert aria-hidden="true" className="mt-0.5 size-4 shrink-0" />
            <span>
              <span className="sr-only print:not-sr-only">Warning: </span>
              {l.text}
            </span>
          </li>
        ) : (
          <li key={l.text}>{l.text}</li>
        ),
      )}
    </ul>
  );
}

/** The usual cautions beside coilover work. */
export function BuildSheetCautions() {
  return (
    <Caution>
      <ul className="list-disc pl-4">
        <li>Use proper spring compressors; a loaded spring can fly off.</li>
        <li>Support the car on stands on firm, level ground — never work under a car held up by a jack alone.</li>
        <li>Check clearances with the spring removed and the suspension compressed through its full travel.</li>
        <li>Follow the damper maker’s data for lengths, preload and settings.</li>
      </ul>
    </Caution>
  );
}

/** The build sheet as everyone reads it: each corner's values and checks. */
export function BuildSheetView({ workOrder }: { workOrder: WorkOrder }) {
  const { corners } = workOrder.buildSheet;
  if (CORNERS.every((c) => isBlankCorner(corners[c]))) return <p className="text-ink-muted">No build sheet for this visit.</p>;
  return (
    <>
      {/* A phone reads one corner at a time; a wider screen and paper compare the corners across a row. */}
      <div className="md:hidden print:hidden">
        <BuildSheetGrid workOrder={workOrder} />
      </div>
      <div className="hidden md:block print:block">
        <BuildSheetTable workOrder={workOrder} />
      </div>
    </>
  );
}

/**
 * On a wide screen and on paper: one row per value, one column per corner, so the whole sheet
 * fits on the handover page beside the measurements; each corner's checks follow the table.
 */
function BuildSheetTable({ workOrder }: { workOrder: WorkOrder }) {
  const units = useUnits();
  const { corners, checks } = workOrder.buildSheet;
  const tolerance = workOrder.shop.compressedLengthToleranceMm;
  const fields = BUILD_SHEET_FIELDS.filter((f) => CORNERS.some((c) => (corners[c]?.[f] ?? null) !== null));
  return (
    <div className="flex flex-col gap-1">
      <table className="tabular-figures w-full text-left text-sm">
        <caption className="sr-only">Build sheet</caption>
        <thead>
          <tr className="border-b border-line">
            <th scope="col" className="py-1">
              Value
            </th>
            {CORNERS.map((c) => (
              <th key={c} scope="col" className="py-1 text-right">
                {CORNER_NAMES[c]}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {fields.map((f) => (
            <tr key={f} className="border-b border-line">
              <th scope="row" className="py-1 pr-2 font-normal text-ink-muted">
                {FIELD_INFO[f].label}
              </th>
              {CORNERS.map((c) => (
                <td key={c} className="py-1 pl-2 text-right wrap-anywhere">
                  {valueText(f, corners[c]?.[f] ?? null, units)}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      {CORNERS.map((c) => {
        const blank = isBlankCorner(corners[c]);
        // A corner with no checks to show has no line: a corner name with nothing after it reads as a mistake.
        if (!blank && checkLines(checks[c], tolerance, units, hasHelper(corners[c])).length === 0) return null;
        return (
          <div key={c} className="flex gap-1 text-sm">
            <span className="shrink-0 font-bold">{CORNER_NAMES[c]}:</span>
            {blank ? <span className="text-ink-muted">Not filled in.</span> : <CornerChecks checks={checks[c]} toleranceMm={tolerance} sheet={corners[c]} />}
          </div>
        );
      })}
    </div>
  );
}

function BuildSheetGrid({ workOrder }: { workOrder: WorkOrder }) {
  const units = useUnits();
  const { corners, checks } = workOrder.buildSheet;
  return (
    <CornerGrid
      label="Build sheet, per corner"
      renderCorner={(corner) => {
        const sheet = corners[corner];
        if (!sheet || isBlankCorner(sheet)) return <p className="text-sm text-ink-muted">Not filled in.</p>;
        return (
          <div className="flex flex-col gap-2">
            {/* Each value under its label: side by side, half a phone's width left each a column a word wide. */}
            <dl className="tabular-figures flex flex-col gap-1.5 text-sm">
              {BUILD_SHEET_FIELDS.filter((f) => sheet[f] !== null).map((f) => (
                <div key={f}>
                  <dt className="text-ink-muted">{FIELD_INFO[f].label}</dt>
                  <dd className="font-semibold wrap-anywhere">{valueText(f, sheet[f], units)}</dd>
                </div>
              ))}
            </dl>
            <CornerChecks checks={checks[corner]} toleranceMm={workOrder.shop.compressedLengthToleranceMm} sheet={sheet} />
          </div>
        );
      }}
    />
  );
}

type Texts = Record<Corner, Record<BuildSheetField, string>>;

function toText(field: BuildSheetField, value: string | number | null | undefined, units: UnitPreferences): string {
  const info = FIELD_INFO[field];
  if (value === null || value === undefined) return '';
  if (info.kind === 'quantity') return toInputText(value as number, info.quantity, units);
  return String(value);
}

/** Staff fill the sheet one corner at a time; it is sent in SI. */
export function BuildSheetEditor({ workOrder }: { workOrder: WorkOrder }) {
  const units = useUnits();
  const [corner, setCorner] = useState<Corner>('lf');
  const [texts, setTexts] = useState<Texts>(
    () =>
      Object.fromEntries(
        CORNERS.map((c) => [c, Object.fromEntries(BUILD_SHEET_FIELDS.map((f) => [f, toText(f, workOrder.buildSheet.corners[c]?.[f], units)]))]),
      ) as Texts,
  );
  const [localErrors, setLocalErrors] = useState<Record<string, string>>({});
  const save = usePutBuildSheet(workOrder.id);
  const server = splitErrors(save.error);
  const errorOf = (c: Corner, f: BuildSheetField) => localErrors[`corners.${c}.${f}`] ?? server.fields[`corners.${c}.${f}`];
  const { formRef, refused } = useShowRefused();

  const submit = () => {
    const errors: Record<string, string> = {};
    const corners: BuildSheetInput['corners'] = {};
    for (const c of CORNERS) {
      const out: Record<string, string | number | null> = {};
      for (const f of BUILD_SHEET_FIELDS) {
        const info = FIELD_INFO[f];
        const text = texts[c][f];
        if (info.kind === 'text') out[f] = text.trim() || null;
        else if (info.kind === 'clicks') {
          const n = parseDecimal(text);
          if (n.kind === 'invalid' || (n.kind === 'number' && !Number.isInteger(n.value))) errors[`corners.${c}.${f}`] = 'Enter a whole number';
          out[f] = n.kind === 'number' ? n.value : null;
        } else {
          const si = inputToSi(text, info.quantity, units);
          if (si === 'invalid') errors[`corners.${c}.${f}`] = typeANumber();
          out[f] = si === 'invalid' ? null : si;
        }
      }
      corners[c] = out as BuildSheetInput['corners'][Corner];
    }
    setLocalErrors(errors);
    const first = CORNERS.find((c) => BUILD_SHEET_FIELDS.some((f) => errors[`corners.${c}.${f}`]));
    if (first) {
      setCorner(first);
      refused();
      return;
    }
    save.mutate(
      { corners },
      {
        // The server refused a value: turn to the first corner it names, which may not be the one on screen.
        onError: (error) => {
          const marked = splitErrors(error).fields;
          const at = CORNERS.find((c) => BUILD_SHEET_FIELDS.some((f) => marked[`corners.${c}.${f}`]));
          if (at) setCorner(at);
          refused();
        },
      },
    );
  };

  return (
    <div className="flex flex-col gap-3">
      <BuildSheetView workOrder={workOrder} />
      <form
        ref={formRef}
        aria-label="Edit the build sheet"
        className="flex flex-col gap-3 print:hidden"
        onSubmit={(e) => {
          e.preventDefault();
          submit();
        }}
      >
        <SegmentedControl
          label="Corner to edit"
          options={CORNERS.map((c) => ({ value: c, label: c.toUpperCase() }))}
          value={corner}
          onChange={setCorner}
        />
        {/* Boxes on one line line up at the bottom, even when one label wraps and its neighbour's does not. */}
        <fieldset className="grid grid-cols-2 items-end gap-2" aria-label={CORNER_NAMES[corner]}>
          <legend className="col-span-2 font-bold">{CORNER_NAMES[corner]}</legend>
          {BUILD_SHEET_FIELDS.map((f) => {
            const info = FIELD_INFO[f];
            const common = {
              label: info.label,
              value: texts[corner][f],
              error: errorOf(corner, f),
              onChange: (e: { target: { value: string } }) => {
                const value = e.target.value;
                setTexts((t) => ({ ...t, [corner]: { ...t[corner], [f]: value } }));
              },
            };
            if (info.kind === 'text') return <TextField key={`${corner}-${f}`} {...common} maxLength={info.max} className="col-span-2" />;
            return (
              <UnitInput
                key={`${corner}-${f}`}
                {...common}
                unit={info.kind === 'clicks' ? 'clicks' : unitSymbol(info.quantity, units)}
              />
            );
          })}
        </fieldset>
        <FormAlert message={attentionMessage(server.form, Object.keys({ ...server.fields, ...localErrors }).length)} />
        <Button type="submit" isPending={save.isPending} pendingLabel="Saving…" className="self-start">
          Save the build sheet
        </Button>
        {save.isSuccess && !save.isPending ? <p role="status" className="text-sm text-ink-muted">Saved.</p> : null}
      </form>
    </div>
  );
}

import { fromDisplay, type UnitPreferences } from '@shared/calc/units.calc';
import type { SuggestionChange } from '@shared/collab/suggestion.schema';
import { CORNERS, type Corner } from '@shared/season/corners';
import type { Setup, SetupCornerField } from '@shared/season/setup.schema';
import { parseDecimal, tidy, typeANumber } from '@/lib/numbers';
import { cornerProblems } from '@/lib/setup-corner-problems';
import { FIELD_INFO } from '@/lib/setup-fields';

export const CORNER_SETS: readonly { label: string; corners: readonly Corner[] }[] = [
  { label: 'Front pair', corners: ['lf', 'rf'] },
  { label: 'Rear pair', corners: ['lr', 'rr'] },
  { label: 'All four', corners: CORNERS },
];

/** One change as typed: the amount is text in the user's units until it is sent. */
export interface ChangeRow {
  key: string;
  field: SetupCornerField;
  corners: Corner[];
  mode: 'delta' | 'value';
  amount: string;
}

let nextKey = 1;
export const newChangeRow = (): ChangeRow => ({ key: `row-${nextKey++}`, field: 'camberDeg', corners: [], mode: 'delta', amount: '' });

/** The input's own problem, under the same name the server uses (`corners`, `delta`, `value`). */
export type RowProblem = { path: 'corners' | 'delta' | 'value'; message: string };

/**
 * A typed row as the API wants it: SI units (a camber change in degrees, a pressure change in kPa,
 * clicks as counted), corners in grid order. Differences convert by the same factor as values.
 */
export function rowToChange(row: ChangeRow, units: UnitPreferences): { change: SuggestionChange | null; problems: RowProblem[] } {
  const problems: RowProblem[] = [];
  if (row.corners.length === 0) problems.push({ path: 'corners', message: 'Pick at least one corner' });
  const parsed = parseDecimal(row.amount);
  const { quantity } = FIELD_INFO[row.field];
  if (parsed.kind === 'empty') problems.push({ path: row.mode, message: row.mode === 'delta' ? 'Say how much to change it by' : 'Say what to set it to' });
  else if (parsed.kind === 'invalid') problems.push({ path: row.mode, message: typeANumber('-0.5') });
  else if (row.mode === 'delta' && parsed.value === 0) problems.push({ path: 'delta', message: 'A change of 0 changes nothing' });
  else if (!quantity && !Number.isInteger(parsed.value)) problems.push({ path: row.mode, message: 'Clicks are whole numbers' });
  if (problems.length > 0 || parsed.kind !== 'number') return { change: null, problems };
  const si = quantity ? tidy(fromDisplay(parsed.value, quantity, units)) : parsed.value;
  const corners = CORNERS.filter((c) => row.corners.includes(c));
  return { change: { field: row.field, corners, ...(row.mode === 'delta' ? { delta: si } : { value: si }) }, problems };
}

export interface PreviewCell {
  field: SetupCornerField;
  corner: Corner;
  from: number | null;
  to: number | null;
}

/**
 * Each change worked out against the base snapshot, in order (a later change to the same value
 * builds on the earlier one). A change by an amount to a value that was never recorded has no result.
 */
export function previewChanges(base: Pick<Setup, 'corners'> | null, changes: readonly SuggestionChange[]): PreviewCell[] {
  const working = new Map<string, number | null>();
  const current = (field: SetupCornerField, corner: Corner) => {
    const key = `${corner}.${field}`;
    return working.has(key) ? (working.get(key) ?? null) : (base?.corners[corner]?.[field] ?? null);
  };
  const cells: PreviewCell[] = [];
  for (const change of changes) {
    for (const corner of change.corners) {
      const from = current(change.field, corner);
      const to = change.value !== undefined ? change.value : from === null ? null : tidy(from + (change.delta ?? 0));
      working.set(`${corner}.${change.field}`, to);
      cells.push({ field: change.field, corner, from, to });
    }
  }
  return cells;
}

/** Each corner the changes would take outside what a snapshot may hold, said as the server says it. */
export function outOfRange(cells: readonly PreviewCell[]): string[] {
  return cells.flatMap((cell) => (cell.to === null ? [] : cornerProblems(cell.corner, { [cell.field]: cell.to })));
}

import type { UnitPreferences } from '@shared/calc/units.calc';
import type { SuggestionChange } from '@shared/collab/suggestion.schema';
import { CORNERS } from '@shared/season/corners';
import { formatSigned } from '@/lib/numbers';
import { clicks, FIELD_INFO, formatFieldValue } from '@/lib/setup-fields';
import { toDisplay } from '@shared/calc/units.calc';
import { CORNER_SETS } from './change-rows';

/** "Front pair", "All four", or "LF + RR". */
export function cornerWords(corners: readonly string[]): string {
  const set = CORNER_SETS.find((s) => s.corners.length === corners.length && s.corners.every((c) => corners.includes(c)));
  if (set) return set.label;
  return CORNERS.filter((c) => corners.includes(c))
    .map((c) => c.toUpperCase())
    .join(' + ');
}

/** One change in words, in the user's units: "Front pair camber: change by −0.50°", "Rear pair clicks: set to 6 clicks". */
export function describeChange(change: SuggestionChange, units: UnitPreferences): string {
  // The value named as the setups name it ("Clicks", "Rebound clicks").
  const { label, quantity } = FIELD_INFO[change.field];
  const what = `${cornerWords(change.corners)} ${label.toLowerCase()}`;
  if (change.value !== undefined) return `${what}: set to ${formatFieldValue(change.field, change.value, units)}`;
  const delta = change.delta ?? 0;
  const amount = quantity ? formatSigned(toDisplay(delta, quantity, units), quantity, units) : `${delta > 0 ? '+' : '−'}${clicks(Math.abs(delta))}`;
  return `${what}: change by ${amount}`;
}

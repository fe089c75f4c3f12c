import type { Car } from '@shared/season/car.schema';
import { clickDirection, isClickField } from '@shared/season/damper-clicks';
import type { SetupChange, SetupCornerField } from '@shared/season/setup.schema';
import type { UnitPreferences } from '@shared/calc/units.calc';
import { useUnits } from '@/lib/units-context';
import { groupChanges, type ChangeGroup } from '../utils/group-changes';
import { camberChangeWords, FIELD_INFO, formatFieldChange, formatFieldDelta, formatFieldValue } from '@/lib/setup-fields';

function fieldWords(field: SetupCornerField | 'antiRollBar') {
  return field === 'antiRollBar' ? 'anti-roll bar' : FIELD_INFO[field].label.toLowerCase();
}

function valueText(group: ChangeGroup, value: number | string | null, units: UnitPreferences): string {
  if (value === null) return '—';
  if (group.field === 'antiRollBar' || typeof value === 'string') return String(value);
  return formatFieldValue(group.field, value, units);
}

interface SetupChangeListProps {
  changes: readonly SetupChange[];
  emptyText?: string;
  /** The car's adjusters: a change of clicks then says whether it went stiffer or softer. */
  adjusters?: Car['damperAdjusters'] | undefined;
}

/** What changed from one snapshot to the next, one line per field, amount and natural set of corners, in the user's units. */
export function SetupChangeList({ changes, emptyText = 'No values changed.', adjusters }: SetupChangeListProps) {
  const units = useUnits();
  const groups = groupChanges(changes);
  if (groups.length === 0) return <p className="text-sm text-ink-muted">{emptyText}</p>;
  return (
    <ul className="flex flex-col gap-1">
      {groups.map((g) => (
        <li key={g.key} className="tabular-figures flex flex-wrap items-baseline gap-x-2">
          <span className="font-semibold">
            {g.where} {fieldWords(g.field)}
          </span>
          {g.delta !== null && g.field !== 'antiRollBar' ? (
            <>
              {/* With its two ends shown, the change is the one between them as shown (each rounded in the user's unit). */}
              <span className="font-bold">
                {g.sameEnds && typeof g.from === 'number' && typeof g.to === 'number'
                  ? formatFieldChange(g.field, g.from, g.to, units)
                  : g.field === 'camberDeg'
                    ? camberChangeWords(g.delta, g.ends.flatMap((e) => [e.from, e.to].filter((v): v is number => v !== null)), units)
                    : formatFieldDelta(g.field, g.delta, units)}
              </span>
              {isClickField(g.field) && adjusters ? (
                <span className="font-semibold">{clickDirection(adjusters, g.corners, g.delta, g.field)}</span>
              ) : null}
              {g.sameEnds ? (
                <span className="text-sm text-ink-muted">
                  ({valueText(g, g.from, units)} → {valueText(g, g.to, units)})
                </span>
              ) : (
                // Corners that started from different values: each with its own two ends.
                <span className="text-sm text-ink-muted">
                  ({g.ends.map((e) => `${e.corner.toUpperCase()} ${valueText(g, e.from, units)} → ${valueText(g, e.to, units)}`).join(', ')})
                </span>
              )}
            </>
          ) : g.from === null ? (
            <span>set to {valueText(g, g.to, units)}</span>
          ) : g.to === null ? (
            <span>cleared (was {valueText(g, g.from, units)})</span>
          ) : (
            <span>
              {valueText(g, g.from, units)} → {valueText(g, g.to, units)}
            </span>
          )}
        </li>
      ))}
    </ul>
  );
}

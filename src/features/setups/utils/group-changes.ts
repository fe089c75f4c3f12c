import { CORNERS, type Corner } from '@shared/season/corners';
import type { SetupChange, SetupCornerField } from '@shared/season/setup.schema';

/** One corner's value before and after. */
export interface CornerEnds {
  corner: Corner;
  from: number | null;
  to: number | null;
}

/**
 * Changes of one field that moved the same way on corners that belong together (an axle, a side, all four), read as
 * one line ("Rear clicks ▲ 2"); any other corner is a line of its own.
 */
export interface ChangeGroup {
  key: string;
  /** "All four", "Front", "Rear", "Left side", "Right side" or one corner ("LF"); for axle values "Front" or "Rear". */
  where: string;
  /** The corners it covers; none for an axle's value. */
  corners: Corner[];
  field: SetupCornerField | 'antiRollBar';
  delta: number | null;
  /** The values before and after, when every corner of the group had the same ones. */
  from: number | string | null;
  to: number | string | null;
  sameEnds: boolean;
  /** Each corner's own values, for a group whose corners started from different ones. */
  ends: CornerEnds[];
}

/** Corners that belong together, in the order they are tried: both axles before either side. */
const NATURAL_SETS: readonly { where: string; corners: readonly Corner[] }[] = [
  { where: 'All four', corners: CORNERS },
  { where: 'Front', corners: ['lf', 'rf'] },
  { where: 'Rear', corners: ['lr', 'rr'] },
  { where: 'Left side', corners: ['lf', 'lr'] },
  { where: 'Right side', corners: ['rf', 'rr'] },
];

/** Splits corners into natural sets and single corners: LF + RR (a diagonal) stays two lines. */
function naturalSets(corners: readonly Corner[]): { where: string; corners: Corner[] }[] {
  const left = new Set(corners);
  const out: { where: string; corners: Corner[] }[] = [];
  for (const set of NATURAL_SETS) {
    if (set.corners.every((c) => left.has(c))) {
      out.push({ where: set.where, corners: [...set.corners] });
      for (const c of set.corners) left.delete(c);
    }
  }
  for (const c of CORNERS) if (left.has(c)) out.push({ where: c.toUpperCase(), corners: [c] });
  return out;
}

/** Groups a diff's corner changes by field and amount, over natural sets of corners only; axle changes stay one line each. */
export function groupChanges(changes: readonly SetupChange[]): ChangeGroup[] {
  const groups = new Map<string, { field: SetupCornerField; delta: number | null; items: SetupChange[] }>();
  const out: ChangeGroup[] = [];
  for (const change of changes) {
    if (change.corner === null) continue;
    // Changes with no amount (a value added or removed) group only when their ends match.
    const key = `${change.field}|${change.delta ?? `${String(change.from)}>${String(change.to)}`}`;
    const group = groups.get(key) ?? { field: change.field as SetupCornerField, delta: change.delta, items: [] };
    group.items.push(change);
    groups.set(key, group);
  }
  for (const [key, group] of groups) {
    for (const set of naturalSets(group.items.map((c) => c.corner!))) {
      const items = set.corners.map((corner) => group.items.find((c) => c.corner === corner)!);
      const first = items[0]!;
      const sameEnds = items.every((c) => c.from === first.from && c.to === first.to);
      out.push({
        key: `${key}|${set.corners.join('+')}`,
        where: set.where,
        corners: set.corners,
        field: group.field,
        delta: group.delta,
        from: sameEnds ? first.from : null,
        to: sameEnds ? first.to : null,
        sameEnds,
        ends: items.map((c) => ({ corner: c.corner!, from: typeof c.from === 'number' ? c.from : null, to: typeof c.to === 'number' ? c.to : null })),
      });
    }
  }
  for (const change of changes) {
    if (change.axle === null) continue;
    out.push({
      key: change.path,
      where: change.axle === 'front' ? 'Front' : 'Rear',
      corners: [],
      field: 'antiRollBar',
      delta: null,
      from: change.from,
      to: change.to,
      sameEnds: true,
      ends: [],
    });
  }
  return out;
}

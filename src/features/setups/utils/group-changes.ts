import type { Corner } from '@shared/season/corners';
import type { SetupChange, SetupCornerField } from '@shared/season/setup.schema';

/** Changes of one field that moved the same way on several corners, read as one line ("Rear clicks ▲ 2"). */
export interface ChangeGroup {
  key: string;
  /** "All four", "Front", "Rear", "LF", "LF + RR"; for axle values "Front" or "Rear". */
  where: string;
  /** The corners it covers; none for an axle's value. */
  corners: Corner[];
  field: SetupCornerField | 'antiRollBar';
  delta: number | null;
  /** The values before and after, when every corner of the group had the same ones. */
  from: number | string | null;
  to: number | string | null;
  sameEnds: boolean;
}

function describeCorners(corners: Corner[]): string {
  const set = new Set(corners);
  if (set.size === 4) return 'All four';
  if (set.size === 2 && set.has('lf') && set.has('rf')) return 'Front';
  if (set.size === 2 && set.has('lr') && set.has('rr')) return 'Rear';
  return corners.map((c) => c.toUpperCase()).join(' + ');
}

/** Groups a diff's corner changes by field and amount; axle changes stay one line each. */
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
    const first = group.items[0]!;
    const sameEnds = group.items.every((c) => c.from === first.from && c.to === first.to);
    out.push({
      key,
      where: describeCorners(group.items.map((c) => c.corner!)),
      corners: group.items.map((c) => c.corner!),
      field: group.field,
      delta: group.delta,
      from: sameEnds ? first.from : null,
      to: sameEnds ? first.to : null,
      sameEnds,
    });
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
    });
  }
  return out;
}

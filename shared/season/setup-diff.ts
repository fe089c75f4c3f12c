import { CORNERS, AXLES } from './corners';
import { SETUP_CORNER_FIELDS, type Setup, type SetupChange } from './setup.schema';

const round = (n: number) => Math.round(n * 1e6) / 1e6;

/** What changed from one snapshot to another, corner fields first, then axles. */
export function diffSetups(from: Pick<Setup, 'corners' | 'axles'>, to: Pick<Setup, 'corners' | 'axles'>): SetupChange[] {
  const changes: SetupChange[] = [];
  for (const corner of CORNERS) {
    for (const field of SETUP_CORNER_FIELDS) {
      const a = from.corners[corner]?.[field] ?? null;
      const b = to.corners[corner]?.[field] ?? null;
      if (a === b) continue;
      changes.push({
        path: `corners.${corner}.${field}`,
        corner,
        axle: null,
        field,
        from: a,
        to: b,
        delta: a !== null && b !== null ? round(b - a) : null,
      });
    }
  }
  for (const axle of AXLES) {
    const a = from.axles[axle]?.antiRollBar ?? null;
    const b = to.axles[axle]?.antiRollBar ?? null;
    if (a === b) continue;
    changes.push({ path: `axles.${axle}.antiRollBar`, corner: null, axle, field: 'antiRollBar', from: a, to: b, delta: null });
  }
  return changes;
}

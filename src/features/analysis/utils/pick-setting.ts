import { SCATTER_PARAM_FIELD, SCATTER_PARAMS, type CornerOrAxle, type ScatterParam } from '@shared/analysis/analysis.schema';
import type { Setup } from '@shared/season/setup.schema';

const AXLES = { front: ['lf', 'rf'], rear: ['lr', 'rr'] } as const;

/**
 * The setting and axle the season review plots first: the first setting, in the list's order and front before
 * rear, that took more than one value over the car's setups (an axle's value is the mean of its two corners).
 * A setting that never changed can draw no line, so opening on one would only say "not enough data". Camber at
 * the front when nothing changed.
 */
export function firstVariedSetting(setups: readonly Pick<Setup, 'corners'>[]): { param: ScatterParam; corner: CornerOrAxle } {
  for (const param of SCATTER_PARAMS) {
    const field = SCATTER_PARAM_FIELD[param];
    for (const axle of ['front', 'rear'] as const) {
      const values = new Set<number>();
      for (const setup of setups) {
        const [a, b] = AXLES[axle].map((c) => setup.corners[c][field]);
        if (a !== null && a !== undefined && b !== null && b !== undefined) values.add((a + b) / 2);
      }
      if (values.size > 1) return { param, corner: axle };
    }
  }
  return { param: 'camber', corner: 'front' };
}

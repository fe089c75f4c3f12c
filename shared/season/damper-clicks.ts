/**
 * Which way a change of damper clicks goes. An adjuster's clicks are counted from one end of its travel: from full
 * stiff (the usual way, 0 = fully closed) more clicks are softer; from full soft more clicks are stiffer (common
 * practice; the damper maker's manual says which end its clicks count from).
 */
import { axleOf, type Corner } from './corners';
import type { Car } from './car.schema';

export type ClickDirection = 'stiffer' | 'softer';

/**
 * "stiffer" or "softer" for a change of `delta` clicks at these corners, when every one of them counts from the same
 * end; null for no change, no corners, or an adjuster the car does not describe.
 */
export function clickDirection(adjusters: Car['damperAdjusters'], corners: readonly Corner[], delta: number): ClickDirection | null {
  if (delta === 0 || corners.length === 0) return null;
  const ends = new Set(corners.map((c) => adjusters[axleOf(c)]?.countFrom ?? null));
  const [end] = ends;
  if (ends.size !== 1 || !end) return null;
  return (end === 'full_soft') === delta > 0 ? 'stiffer' : 'softer';
}

/**
 * Damper clicks: which corners have which adjuster, and which way a change goes. An adjuster's clicks are counted from one end of its travel: from full
 * stiff (the usual way, 0 = fully closed) more clicks are softer; from full soft more clicks are stiffer (common
 * practice; the damper maker's manual says which end its clicks count from).
 */
import { axleOf, CORNERS, type Axle, type Corner } from './corners';
import type { ClickAdjuster, DamperAdjusterInput } from './car.schema';

export type ClickDirection = 'stiffer' | 'softer';

/** The two click values a corner's setup can hold: clicks (bump, or a damper's only adjuster) and rebound clicks. */
export const CLICK_FIELDS = ['damperClicks', 'damperReboundClicks'] as const;
export type ClickField = (typeof CLICK_FIELDS)[number];

export const isClickField = (field: string): field is ClickField => (CLICK_FIELDS as readonly string[]).includes(field);

/** A car's adjusters per axle, as it holds them or as a request or season file gives them. */
type Adjusters = { readonly [A in Axle]?: DamperAdjusterInput | null };

/**
 * The adjuster that sets this value on an axle: rebound clicks are the rebound adjuster's where the car describes one
 * (double-adjustable dampers), else the damper's one adjuster's; undefined where the axle has none.
 */
export const adjusterFor = (adjusters: Adjusters, axle: Axle, field: ClickField): ClickAdjuster | undefined =>
  (field === 'damperReboundClicks' && adjusters[axle]?.rebound) || adjusters[axle] || undefined;

/**
 * "stiffer" or "softer" for a change of `delta` clicks of this value at these corners, when every one of them counts
 * from the same end; null for no change, no corners, or an adjuster the car does not describe.
 */
export function clickDirection(adjusters: Adjusters, corners: readonly Corner[], delta: number, field: ClickField): ClickDirection | null {
  if (delta === 0 || corners.length === 0) return null;
  const ends = new Set(corners.map((c) => adjusterFor(adjusters, axleOf(c), field)?.countFrom));
  const [end] = ends;
  if (ends.size !== 1 || !end) return null;
  return (end === 'full_soft') === delta > 0 ? 'stiffer' : 'softer';
}

/**
 * The corners whose dampers have this adjuster, in grid order. Clicks are where the car describes an adjuster on the
 * axle; rebound clicks where it describes a rebound adjuster there. Either is also where the setup records it all the
 * same (and clicks where it records rebound clicks), so a value already written can still be changed.
 */
export function cornersWithAdjuster(
  adjusters: Adjusters,
  setupCorners: Partial<Record<Corner, Partial<Record<ClickField, number | null>> | undefined>>,
  field: ClickField,
): Corner[] {
  const records = (axle: Axle, f: ClickField) => CORNERS.some((c) => axleOf(c) === axle && typeof setupCorners[c]?.[f] === 'number');
  const has = (axle: Axle) =>
    field === 'damperReboundClicks'
      ? !!adjusters[axle]?.rebound || records(axle, 'damperReboundClicks')
      : !!adjusters[axle] || records(axle, 'damperClicks') || records(axle, 'damperReboundClicks');
  return CORNERS.filter((c) => has(axleOf(c)));
}

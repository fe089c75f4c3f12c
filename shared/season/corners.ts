import * as z from '../zod';

/** Corners as seen from above, front at the top: left front, right front, left rear, right rear. */
export const CORNERS = ['lf', 'rf', 'lr', 'rr'] as const;
export type Corner = (typeof CORNERS)[number];

export const AXLES = ['front', 'rear'] as const;
export type Axle = (typeof AXLES)[number];

export const axleOf = (corner: Corner): Axle => (corner === 'lf' || corner === 'rf' ? 'front' : 'rear');

/** `{ lf, rf, lr, rr }` of one schema; each corner optional unless `required`. */
export function perCorner<T extends z.ZodMiniType>(schema: T) {
  return z.strictObject({ lf: z.optional(schema), rf: z.optional(schema), lr: z.optional(schema), rr: z.optional(schema) });
}
export type PerCorner<T> = Partial<Record<Corner, T>>;

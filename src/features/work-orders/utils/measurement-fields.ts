import type { Quantity } from '@shared/calc/units.calc';
import type { MeasurementField, Stage } from '@shared/service/work-order.schema';

/** Each measured value: what people call it, and which quantity it is (for the user's units). */
export const MEASUREMENT_INFO: Record<MeasurementField, { label: string; quantity: Quantity; signed: boolean }> = {
  camberDeg: { label: 'Camber', quantity: 'angle', signed: true },
  toeMm: { label: 'Toe (in +)', quantity: 'length', signed: true },
  casterDeg: { label: 'Caster', quantity: 'angle', signed: true },
  rideHeightMm: { label: 'Ride height', quantity: 'length', signed: false },
  cornerWeightKg: { label: 'Corner weight', quantity: 'mass', signed: false },
};

export const STAGE_WORDS: Record<Stage, string> = { before: 'Before', after: 'After' };

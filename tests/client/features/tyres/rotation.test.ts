import { describe, expect, it } from 'vitest';
import { applyPreset, rotationFormSchema, type RotationPreset } from '@/features/tyres/utils/rotation';

const START = { lf: 1, rf: 2, lr: 3, rr: 4 };
const ROTATED = { lf: 3, rf: 4, lr: 2, rr: 1 };

// Rotation patterns as tyre makers' rotation charts describe them (common practice): "front to rear" keeps each
// tyre on its side; "cross rear to front" (the rearward cross) moves the rears to the opposite front and the fronts
// straight back; "side to side" swaps left and right on each axle.
const CASES: { preset: RotationPreset; from: typeof START; to: typeof START }[] = [
  { preset: 'frontToRear', from: START, to: { lf: 3, rf: 4, lr: 1, rr: 2 } },
  { preset: 'crossRearToFront', from: START, to: { lf: 4, rf: 3, lr: 1, rr: 2 } },
  { preset: 'sideToSide', from: START, to: { lf: 2, rf: 1, lr: 4, rr: 3 } },
  // From a set already rotated once, the pattern moves the tyres where they sit now.
  { preset: 'frontToRear', from: ROTATED, to: { lf: 2, rf: 1, lr: 3, rr: 4 } },
  { preset: 'crossRearToFront', from: ROTATED, to: { lf: 1, rf: 2, lr: 3, rr: 4 } },
  { preset: 'sideToSide', from: ROTATED, to: { lf: 4, rf: 3, lr: 1, rr: 2 } },
];

describe('rotation patterns', () => {
  it.each(CASES)('when $preset is applied to $from, then the tyres sit at $to', ({ preset, from, to }) => {
    expect(applyPreset(preset, from)).toEqual(to);
  });

  it('when side to side is applied twice, then every tyre is back where it started', () => {
    expect(applyPreset('sideToSide', applyPreset('sideToSide', ROTATED))).toEqual(ROTATED);
  });
});

describe('rotation form schema', () => {
  const texts = (p: typeof START) => Object.fromEntries(Object.entries(p).map(([k, v]) => [k, String(v)])) as Record<keyof typeof START, string>;

  it('when the tyres are where they already sit, then it is refused as no rotation', () => {
    const result = rotationFormSchema(START).safeParse({ mountedAt: '2026-06-12T09:30', positions: texts(START) });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.path.join('.'))).toEqual(['positions']);
  });

  it('when a tyre is on two corners, then both corners carry an error', () => {
    const result = rotationFormSchema(START).safeParse({ mountedAt: '2026-06-12T09:30', positions: texts({ lf: 3, rf: 2, lr: 3, rr: 4 }) });
    expect(result.error?.issues.map((i) => [i.path.join('.'), i.message])).toEqual([
      ['positions.lf', 'Tyre 3 is also on the left rear'],
      ['positions.lr', 'Tyre 3 is also on the left front'],
    ]);
  });

  it('when a real rotation is given, then it becomes the mountings body with an ISO time', () => {
    const result = rotationFormSchema(START).safeParse({ mountedAt: '2026-06-12T09:30', positions: texts({ lf: 4, rf: 3, lr: 1, rr: 2 }) });
    expect(result.success).toBe(true);
    expect(result.data?.positions).toEqual({ lf: 4, rf: 3, lr: 1, rr: 2 });
    expect(new Date(result.data!.mountedAt).getTime()).toBe(new Date('2026-06-12T09:30').getTime());
  });
});

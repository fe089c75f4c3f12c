import { describe, expect, it } from 'vitest';
import { clickDirection, cornersWithAdjuster } from '../../../shared/season/damper-clicks';

// Clicks count from one end of the adjuster's travel; counted from full stiff, more clicks are softer, and from
// full soft, stiffer (common practice: damper makers' adjustment instructions).
const FROM_STIFF = { positions: 12, countFrom: 'full_stiff' as const };
const FROM_SOFT = { positions: 24, countFrom: 'full_soft' as const };

describe('clickDirection', () => {
  it.each([
    [FROM_STIFF, 2, 'softer'],
    [FROM_STIFF, -1, 'stiffer'],
    [FROM_SOFT, 2, 'stiffer'],
    [FROM_SOFT, -3, 'softer'],
  ] as const)('when counted from %o and the clicks change by %d, then the damper is %s', (adjuster, delta, word) => {
    expect(clickDirection({ front: adjuster, rear: null }, ['lf', 'rf'], delta, 'damperClicks')).toBe(word);
  });

  it('when the corners count from different ends, or the adjuster is not described, or nothing changed, then no direction is claimed', () => {
    const mixed = { front: FROM_STIFF, rear: FROM_SOFT };
    expect(clickDirection(mixed, ['lf', 'lf', 'rr'], 1, 'damperClicks')).toBeNull();
    expect(clickDirection(mixed, ['lr', 'rr'], 1, 'damperClicks')).toBe('stiffer');
    expect(clickDirection({ front: FROM_STIFF, rear: null }, ['lr'], 1, 'damperClicks')).toBeNull();
    expect(clickDirection(mixed, ['lf'], 0, 'damperClicks')).toBeNull();
    expect(clickDirection(mixed, [], 2, 'damperClicks')).toBeNull();
  });

  // Double-adjustable dampers: bump counted from full stiff, rebound from full soft. Each adjuster's clicks go the way
  // its own end says (common practice: damper makers' adjustment instructions).
  it.each([
    [2, 'stiffer'],
    [-1, 'softer'],
  ] as const)('when the bump clicks count from full stiff, the rebound adjuster\'s from full soft, and the rebound clicks change by %d, then the damper is %s', (delta, word) => {
    const double = { front: { ...FROM_STIFF, rebound: FROM_SOFT }, rear: null };
    expect(clickDirection(double, ['lf', 'rf'], delta, 'damperReboundClicks')).toBe(word);
    // The bump clicks still go the way their own end says.
    expect(clickDirection(double, ['lf', 'rf'], delta, 'damperClicks')).toBe(word === 'stiffer' ? 'softer' : 'stiffer');
  });

  it('when the front has a rebound adjuster from full soft and the rear only its one adjuster from full stiff, then rebound clicks on all four claim no direction and on the rear go by the one adjuster', () => {
    const mixed = { front: { ...FROM_STIFF, rebound: FROM_SOFT }, rear: { ...FROM_STIFF, rebound: null } };
    expect(clickDirection(mixed, ['lf', 'rf', 'lr', 'rr'], 1, 'damperReboundClicks')).toBeNull();
    expect(clickDirection(mixed, ['lr', 'rr'], 1, 'damperReboundClicks')).toBe('softer');
    expect(clickDirection(mixed, ['lf', 'rf', 'lr', 'rr'], 1, 'damperClicks')).toBe('softer');
  });
});

describe('cornersWithAdjuster', () => {
  const both = { front: FROM_STIFF, rear: FROM_SOFT };
  const clicksOnly = { lf: { damperClicks: 4 }, rf: { damperClicks: 4 }, lr: { damperClicks: 6 }, rr: { damperClicks: 6 } };

  it('when the car describes an adjuster on each axle and the setup records no rebound clicks, then clicks are on all four and rebound clicks nowhere', () => {
    expect(cornersWithAdjuster(both, clicksOnly, 'damperClicks')).toEqual(['lf', 'rf', 'lr', 'rr']);
    expect(cornersWithAdjuster(both, clicksOnly, 'damperReboundClicks')).toEqual([]);
  });

  it('when the setup records rebound clicks on one axle, then rebound clicks are on that axle only', () => {
    const frontDouble = { ...clicksOnly, lf: { damperClicks: 4, damperReboundClicks: 9 }, rf: { damperClicks: 4, damperReboundClicks: null } };
    expect(cornersWithAdjuster(both, frontDouble, 'damperReboundClicks')).toEqual(['lf', 'rf']);
  });

  it('when the car describes a rebound adjuster on the rear dampers, then rebound clicks are on the rear even with none recorded yet', () => {
    const rearDouble = { front: { ...FROM_STIFF, rebound: null }, rear: { ...FROM_SOFT, rebound: FROM_STIFF } };
    expect(cornersWithAdjuster(rearDouble, clicksOnly, 'damperReboundClicks')).toEqual(['lr', 'rr']);
    expect(cornersWithAdjuster(rearDouble, {}, 'damperReboundClicks')).toEqual(['lr', 'rr']);
    // Where the setup records rebound clicks all the same, they stay offered.
    expect(cornersWithAdjuster(rearDouble, { lf: { damperReboundClicks: 3 } }, 'damperReboundClicks')).toEqual(['lf', 'rf', 'lr', 'rr']);
  });

  it('when the rear dampers are fixed, then clicks are on the front only, unless the setup records rear clicks all the same', () => {
    const frontOnly = { front: FROM_STIFF, rear: null };
    expect(cornersWithAdjuster(frontOnly, { lf: { damperClicks: 4 }, rf: { damperClicks: 4 }, lr: {}, rr: { damperClicks: null } }, 'damperClicks')).toEqual(['lf', 'rf']);
    expect(cornersWithAdjuster(frontOnly, clicksOnly, 'damperClicks')).toEqual(['lf', 'rf', 'lr', 'rr']);
    expect(cornersWithAdjuster({ front: null, rear: null }, {}, 'damperClicks')).toEqual([]);
  });
});

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
    expect(clickDirection({ front: adjuster, rear: null }, ['lf', 'rf'], delta)).toBe(word);
  });

  it('when the corners count from different ends, or the adjuster is not described, or nothing changed, then no direction is claimed', () => {
    const mixed = { front: FROM_STIFF, rear: FROM_SOFT };
    expect(clickDirection(mixed, ['lf', 'lf', 'rr'], 1)).toBeNull();
    expect(clickDirection(mixed, ['lr', 'rr'], 1)).toBe('stiffer');
    expect(clickDirection({ front: FROM_STIFF, rear: null }, ['lr'], 1)).toBeNull();
    expect(clickDirection(mixed, ['lf'], 0)).toBeNull();
    expect(clickDirection(mixed, [], 2)).toBeNull();
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

  it('when the rear dampers are fixed, then clicks are on the front only, unless the setup records rear clicks all the same', () => {
    const frontOnly = { front: FROM_STIFF, rear: null };
    expect(cornersWithAdjuster(frontOnly, { lf: { damperClicks: 4 }, rf: { damperClicks: 4 }, lr: {}, rr: { damperClicks: null } }, 'damperClicks')).toEqual(['lf', 'rf']);
    expect(cornersWithAdjuster(frontOnly, clicksOnly, 'damperClicks')).toEqual(['lf', 'rf', 'lr', 'rr']);
    expect(cornersWithAdjuster({ front: null, rear: null }, {}, 'damperClicks')).toEqual([]);
  });
});

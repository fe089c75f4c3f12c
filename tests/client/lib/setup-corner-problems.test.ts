import { describe, expect, it } from 'vitest';
import { LIMITS } from '../../../shared/season/limits';
import { setupCornerSchema } from '../../../shared/season/setup.schema';
import { cornerProblems } from '@/lib/setup-corner-problems';
import { checkedQuickChange } from '@/features/setups/utils/checked-quick-change';
import { outOfRange, previewChanges } from '@/features/suggestions/utils/change-rows';

// The messages are the server's own (the shared schema's), so the server is the reference for each case.
const serverSays = (values: object) => {
  const checked = setupCornerSchema.safeParse(values);
  return checked.success ? [] : checked.error.issues.map((i) => i.message);
};

describe('cornerProblems', () => {
  it('when every value is within the limits, then nothing is said', () => {
    expect(cornerProblems('lf', { camberDeg: LIMITS.camberDeg.min, coldPressureKpa: LIMITS.pressureKpa.max, damperClicks: null })).toEqual([]);
  });

  it('when a whole corner has two values out of range, then each is said after the corner’s name, in the order of the values', () => {
    const corner = { camberDeg: LIMITS.camberDeg.max + 1, toeMm: 0, coldPressureKpa: LIMITS.pressureKpa.min - 1 };
    const said = cornerProblems('rr', corner);
    expect(said).toHaveLength(2);
    expect(said).toEqual(serverSays(corner).map((m) => `Right rear: ${m}`));
    expect(said[0]).toMatch(/^Right rear: Camber /);
    expect(said[1]).toMatch(/^Right rear: Pressure /);
  });

  it('when one value is checked alone, then only it is said', () => {
    expect(cornerProblems('lr', { damperClicks: LIMITS.damperClicks.max + 1 })).toEqual([`Left rear: ${serverSays({ damperClicks: 101 })[0]}`]);
  });
});

describe('the quick change and a suggested change say a value out of range the same way', () => {
  it('when both take the left front camber past its limit, then both say it in the same words', () => {
    const base = { corners: { lf: { camberDeg: -2 }, rf: { camberDeg: -2 }, lr: {}, rr: {} } };
    const quick = checkedQuickChange(base, [{ field: 'camberDeg', corners: ['lf'], delta: -9 }]).problems;
    const suggested = outOfRange(previewChanges(base, [{ field: 'camberDeg', corners: ['lf'], delta: -9 }]));
    expect(quick).toEqual(cornerProblems('lf', { camberDeg: -11 }));
    expect(suggested).toEqual(quick);
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { handoverLabel, SETUP_LABEL_MAX, shortenAtWord } from '../../../shared/service/handover-label';

describe('shortenAtWord', () => {
  it('when the text fits, then it comes back with its runs of white space made one space', () => {
    expect(shortenAtWord('  Corner   weights\nand  toe ', 80)).toBe('Corner weights and toe');
  });

  it('when the text is too long, then it ends on the last whole word that fits, without a trailing comma, and an ellipsis', () => {
    const work = 'Kettle Lane Chassis Works: Fit adjustable-body coilovers, set ride height and align to the sheet';
    expect(shortenAtWord(work, 80)).toBe('Kettle Lane Chassis Works: Fit adjustable-body coilovers, set ride height and…');
    expect(shortenAtWord('Coilovers, springs, arms, bushes', 20)).toBe('Coilovers, springs…');
  });

  it('when one word is longer than half the room, then it is cut inside the word rather than leaving almost nothing', () => {
    expect(shortenAtWord('Re-torque everything-on-the-front-subframe-and-steering-rack', 24)).toBe('Re-torque everything-on…');
  });

  it('for any text and room, then the result fits, begins the text, and is the whole text exactly when that fits', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 200 }), fc.integer({ min: 2, max: 120 }), (text, max) => {
        const clean = text.replace(/\s+/g, ' ').trim();
        const out = shortenAtWord(text, max);
        expect(out.length).toBeLessThanOrEqual(max);
        if (clean.length <= max) expect(out).toBe(clean);
        else {
          expect(out.endsWith('…')).toBe(true);
          expect(clean.startsWith(out.slice(0, -1))).toBe(true);
        }
      }),
      { seed: 20261205 },
    );
  });
});

describe('handoverLabel', () => {
  it('when the shop and the work fit in a setup label, then they are "<shop>: <work>"; when not, shortened to the label\'s limit', () => {
    expect(handoverLabel('Bump Steer Bench', 'Four-wheel alignment')).toBe('Bump Steer Bench: Four-wheel alignment');
    const long = handoverLabel('Bump Steer Bench', 'word '.repeat(40));
    expect(long.length).toBeLessThanOrEqual(SETUP_LABEL_MAX);
    expect(long).toMatch(/^Bump Steer Bench: (word )+word…$/);
  });
});

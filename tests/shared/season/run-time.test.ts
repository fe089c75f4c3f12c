import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { formatRunTime, parseRunTime, readRunTimeBox } from '../../../shared/season/run-time';

// Times are to the millisecond because timing gear reports thousandths (common practice).
// Minutes:seconds with two-digit seconds is the usual way lap and stage times are written (common practice).

describe('parseRunTime: accepted', () => {
  it.each<[string, number]>([
    ['45.678', 45.678],
    ['45', 45],
    ['45.6', 45.6],
    ['45.60', 45.6],
    ['0.001', 0.001],
    ['1:05.432', 65.432],
    ['1:05', 65],
    ['0:45.000', 45],
    ['01:05.432', 65.432],
    ['10:00', 600],
    ['29:59.999', 1799.999],
    ['1799.999', 1799.999],
    ['125.5', 125.5],
    ['  45.678  ', 45.678],
    ['\t45.678\n', 45.678],
    ['45,678', 45.678],
    ['1:05,432', 65.432],
    ['1 : 05.432', 65.432],
    ['45 . 678', 45.678],
    ['\u00a045.678\u2009', 45.678],
  ])('when "%s" is typed, then %s s (common practice: seconds or m:ss.sss)', (text, seconds) => {
    expect(parseRunTime(text)).toEqual({ ok: true, seconds });
  });

  it('when 1:05.432 is typed, then exactly 65.432, with no float artefact such as 65.43199999', () => {
    const result = parseRunTime('1:05.432');
    expect(result.ok && result.seconds).toBe(65.432);
    expect(String(result.ok && result.seconds)).toBe('65.432');
  });
});

describe('parseRunTime: refused', () => {
  it.each<[string, RegExp]>([
    ['', /Enter the time/],
    ['   ', /Enter the time/],
    ['-45.678', /negative/],
    ['−45.678', /negative/],
    ['0', /above 0/],
    ['0.000', /above 0/],
    ['0:00.000', /above 0/],
    ['1800.0', /under 30 min/],
    ['1800.000', /under 30 min/],
    ['30:00.000', /under 30 min/],
    ['45:00', /under 30 min/],
    ['99999999999.9', /under 30 min/],
    // A point missed on the keypad (common practice: timing gear gives thousandths).
    ['45678', /^No decimal point: for 45\.678, type the point$/],
    ['104567', /^No decimal point: for 104\.567, type the point$/],
    ['4567', /^No decimal point\. Type the time as 45\.678 or 1:05\.432$/],
    ['1800', /^No decimal point\./],
    ['45.6789', /3 decimals.*thousandths/],
    ['1:05.4321', /3 decimals.*thousandths/],
    ['abc', /digits only/],
    ['45.678s', /digits only/],
    ['4S.678', /digits only/],
    ['1e3', /digits only/],
    ['+45', /digits only/],
    ['1:5.4', /seconds as two digits/],
    ['1:5', /seconds as two digits/],
    ['1:005.4', /seconds as two digits/],
    ['1:', /seconds as two digits/],
    ['1:60.000', /under 60/],
    ['1:75', /under 60/],
    [':45', /minutes before the colon/],
    [':45.678', /minutes before the colon/],
    ['1:02:03.456', /one colon/],
    ['1::05', /one colon/],
    ['45.6.7', /one decimal point/],
    ['1,045.678', /one decimal point/],
    ['45.', /digits after the decimal point/],
    ['.678', /0 before the decimal point/],
    ['4 5.678', /space inside the number/],
    ['1 05.432', /space inside the number/],
    ['.', /Enter the time/],
  ])('when "%s" is typed, then it is refused with a message matching %s', (text, message) => {
    const result = parseRunTime(text);
    expect(result.ok).toBe(false);
    if (!result.ok) expect(result.error).toMatch(message);
  });
});

describe('formatRunTime', () => {
  it.each<[number, string]>([
    [45.678, '45.678'],
    [45, '45.000'],
    [5.1, '5.100'],
    [0.001, '0.001'],
    [59.999, '59.999'],
    [60, '1:00.000'],
    [59.9996, '1:00.000'],
    [65.432, '1:05.432'],
    [125.5, '2:05.500'],
    [600, '10:00.000'],
    [1799.999, '29:59.999'],
    [45.6784, '45.678'],
  ])('when %s s is shown, then "%s" (seconds to three decimals, minutes only past 60 s)', (seconds, text) => {
    expect(formatRunTime(seconds)).toBe(text);
  });

  it.each([-1, NaN, Infinity])('when %s is shown, then a RangeError', (seconds) => {
    expect(() => formatRunTime(seconds)).toThrow(RangeError);
  });
});

describe('parseRunTime / formatRunTime: properties', () => {
  const anyMillisecondTime = fc.integer({ min: 1, max: 1_799_999 }).map((ms) => ms / 1000);

  it('when any millisecond time 0.001..1799.999 is shown and read back, then exactly the same number (property)', () => {
    fc.assert(
      fc.property(anyMillisecondTime, (t) => {
        expect(parseRunTime(formatRunTime(t))).toEqual({ ok: true, seconds: t });
      }),
      { numRuns: 5000 },
    );
  });

  it('when any time is shown, then it matches m:ss.sss or s.sss with two-digit seconds after minutes (property)', () => {
    fc.assert(
      fc.property(anyMillisecondTime, (t) => {
        const text = formatRunTime(t);
        expect(text).toMatch(/^(\d+:)?\d{1,2}\.\d{3}$/);
        if (text.includes(':')) expect(text).toMatch(/^\d+:\d{2}\.\d{3}$/);
        expect(text.includes(':')).toBe(t >= 60);
      }),
      { numRuns: 5000 },
    );
  });

  it('when a time is typed with a comma or surrounding spaces, then it reads the same as with a point (property)', () => {
    fc.assert(
      fc.property(anyMillisecondTime, fc.constantFrom('', ' ', '  ', '\t'), (t, pad) => {
        const text = formatRunTime(t);
        expect(parseRunTime(`${pad}${text.replace('.', ',')}${pad}`)).toEqual(parseRunTime(text));
      }),
    );
  });

  it('when any whole number of milliseconds is typed as seconds, then the result has at most three decimals (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 1799 }), fc.integer({ min: 0, max: 999 }), (whole, frac) => {
        fc.pre(whole + frac > 0);
        const result = parseRunTime(`${whole}.${String(frac).padStart(3, '0')}`);
        expect(result.ok).toBe(true);
        if (result.ok) expect(Math.round(result.seconds * 1000) / 1000).toBe(result.seconds);
      }),
    );
  });
});

describe('readRunTimeBox: the time box read with the run status', () => {
  it('when the box is empty, then a DNF or an off-course run has no time and a finished run is refused with the way out', () => {
    expect(readRunTimeBox('', 'dnf')).toEqual({ ok: true, seconds: null });
    expect(readRunTimeBox('   ', 'off_course')).toEqual({ ok: true, seconds: null });
    expect(readRunTimeBox(' ', 'finished')).toEqual({ ok: false, error: 'Enter the time, or choose DNF or Off course. Type the time as 45.678 or 1:05.432' });
  });

  it('when a time is typed, then it is read as parseRunTime reads it, whatever the status', () => {
    fc.assert(
      fc.property(fc.string({ maxLength: 12 }), fc.constantFrom('finished' as const, 'dnf' as const, 'off_course' as const), (text, status) => {
        fc.pre(text.trim() !== '');
        expect(readRunTimeBox(text, status)).toEqual(parseRunTime(text));
      }),
    );
  });
});

import { describe, expect, it } from 'vitest';
import { parseConesCell, parseTimeCell } from '../../../shared/import/time';

// Club results write a run as its raw time with the cones after a plus sign ("45.678+2" is 45.678 s and
// 2 cones), and a run that did not count as DNF, OFF (off course) or DSQ (disqualified) — common practice
// in autocross results sheets. Minutes:seconds past a minute ("1:05.432") — common practice for lap times.

describe('parseTimeCell: accepted', () => {
  it.each<[string, ReturnType<typeof parseTimeCell>]>([
    ['45.678', { kind: 'time', rawSec: 45.678, cones: 0 }],
    ['45.678+2', { kind: 'time', rawSec: 45.678, cones: 2 }],
    ['45.678 +2', { kind: 'time', rawSec: 45.678, cones: 2 }],
    ['45.678 + 2', { kind: 'time', rawSec: 45.678, cones: 2 }],
    ['45.678+0', { kind: 'time', rawSec: 45.678, cones: 0 }],
    ['1:05.432', { kind: 'time', rawSec: 65.432, cones: 0 }],
    ['1:05.432+1', { kind: 'time', rawSec: 65.432, cones: 1 }],
    ['  47.1  ', { kind: 'time', rawSec: 47.1, cones: 0 }],
    ['52', { kind: 'time', rawSec: 52, cones: 0 }],
    ['DNF', { kind: 'dnf' }],
    ['dnf', { kind: 'dnf' }],
    [' Dnf ', { kind: 'dnf' }],
    ['OFF', { kind: 'off_course' }],
    ['off', { kind: 'off_course' }],
    ['DSQ', { kind: 'dsq' }],
    ['dsq', { kind: 'dsq' }],
    ['', { kind: 'empty' }],
    ['   ', { kind: 'empty' }],
  ])('when the cell is "%s", then %o', (text, expected) => {
    expect(parseTimeCell(text)).toEqual(expected);
  });

  it('when 1:05.432 is read, then exactly 65.432 s (60 + 5.432), with no float artefact', () => {
    const cell = parseTimeCell('1:05.432');
    expect(cell.kind === 'time' && String(cell.rawSec)).toBe('65.432');
  });

  it('when the file separates fields with ";" and the cell is "45,678+1", then the comma is a decimal comma', () => {
    expect(parseTimeCell('45,678+1', { decimalComma: true })).toEqual({ kind: 'time', rawSec: 45.678, cones: 1 });
  });
});

describe('parseTimeCell: refused, with a reason', () => {
  it.each([
    ['45.67.8', /decimal point/],
    ['-3', /negative/],
    ['1:75.000', /under 60/],
    ['abc', /not a time/],
    ['45.678+', /whole number/],
    ['45.678+x', /whole number/],
    ['45.678+2.5', /whole number/],
    ['45.678+51', /at most 50 cones/],
    ['45.1234', /3 decimals/],
    ['1800.0', /30 min/],
    ['45678', /No decimal point: for 45\.678/],
    ['0', /above 0/],
  ])('when the cell is "%s", then it is invalid (%s)', (text, reason) => {
    const cell = parseTimeCell(text);
    expect(cell.kind).toBe('invalid');
    expect(cell.kind === 'invalid' && cell.reason).toMatch(reason);
  });

  it('when a comma-separated file has "45,678" in a cell, then the comma is not taken for a decimal point', () => {
    expect(parseTimeCell('45,678')).toMatchObject({ kind: 'invalid', reason: expect.stringMatching(/comma/) });
  });
});

describe('parseConesCell', () => {
  it.each<[string, number]>([['', 0], ['0', 0], ['3', 3], ['+2', 2], [' 1 ', 1]])('when "%s", then %i cones', (text, cones) => {
    expect(parseConesCell(text)).toEqual({ ok: true, cones });
  });
  it.each(['x', '1.5', '-1', '99'])('when "%s", then refused', (text) => {
    expect(parseConesCell(text).ok).toBe(false);
  });
});

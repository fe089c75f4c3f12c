/**
 * One cell of a club's timing sheet: a raw time with optional cones ("45.678+2"),
 * a non-finish word (DNF, OFF, DSQ), or nothing (no run).
 */
import { parseRunTime } from '../season/run-time';
import { LIMITS } from '../season/limits';

export type TimeCell =
  | { kind: 'empty' }
  | { kind: 'time'; rawSec: number; cones: number }
  | { kind: 'dnf' }
  | { kind: 'off_course' }
  | { kind: 'dsq' }
  | { kind: 'invalid'; reason: string };

const WORDS: Record<string, 'dnf' | 'off_course' | 'dsq'> = {
  dnf: 'dnf',
  off: 'off_course',
  'off course': 'off_course',
  dsq: 'dsq',
  dq: 'dsq',
};

export interface ParseTimeOptions {
  /** The file uses ";" between fields, so "45,678" is a decimal comma. Otherwise a comma is refused. */
  decimalComma?: boolean;
}

/**
 * Reads "45.678", "45.678+2" or "45.678 +2" (2 cones), "1:05.432", "DNF", "OFF", "DSQ"
 * (any case, spaces around ignored) and "" (no run). Anything else is `invalid` with a reason.
 */
export function parseTimeCell(text: string, { decimalComma = false }: ParseTimeOptions = {}): TimeCell {
  const s = String(text ?? '').replace(/\u00a0/g, ' ').trim();
  if (s === '') return { kind: 'empty' };
  const word = WORDS[s.toLowerCase().replace(/\s+/g, ' ')];
  if (word) return { kind: word };

  const match = /^([^+]*?)\s*(?:\+\s*(\S*))?$/.exec(s);
  const timeText = match?.[1] ?? s;
  const conesText = match?.[2];
  if (timeText.includes(',') && !decimalComma) {
    return { kind: 'invalid', reason: `"${s}" has a comma; write the time as 45.678` };
  }
  if (/^[-−–]/.test(timeText)) return { kind: 'invalid', reason: `"${s}" is negative; a time must be above 0` };
  if (!/^\d[\d:.,]*$/.test(timeText)) return { kind: 'invalid', reason: `"${s}" is not a time, DNF, OFF or DSQ` };
  const time = parseRunTime(timeText);
  if (!time.ok) return { kind: 'invalid', reason: `"${s}": ${time.error}` };

  let cones = 0;
  if (conesText !== undefined) {
    if (!/^\d+$/.test(conesText)) return { kind: 'invalid', reason: `"${s}": the cones after "+" must be a whole number` };
    cones = Number(conesText);
    if (cones > LIMITS.cones.max) return { kind: 'invalid', reason: `"${s}": at most ${LIMITS.cones.max} cones` };
  }
  return { kind: 'time', rawSec: time.seconds, cones };
}

/** A separate cones/penalty cell: empty is 0, otherwise a whole number. */
export function parseConesCell(text: string): { ok: true; cones: number } | { ok: false; reason: string } {
  const s = String(text ?? '').trim().replace(/^\+/, '');
  if (s === '') return { ok: true, cones: 0 };
  if (!/^\d+$/.test(s)) return { ok: false, reason: `"${text.trim()}" is not a whole number of cones` };
  const cones = Number(s);
  if (cones > LIMITS.cones.max) return { ok: false, reason: `At most ${LIMITS.cones.max} cones` };
  return { ok: true, cones };
}

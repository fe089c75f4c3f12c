/**
 * Run times as typed at the car (keypad) or pasted from a timing sheet:
 * seconds ("45.678") or minutes:seconds ("1:05.432"), to the millisecond —
 * the resolution timing gear reports.
 */
import { LIMITS } from './limits';
import type { RunStatus } from './run.schema';

export type RunTimeParseResult = { ok: true; seconds: number } | { ok: false; error: string };

const EXAMPLE = 'Type the time as 45.678 or 1:05.432';
const MAX_SEC = LIMITS.rawTimeSec.maxExclusive; // 1800 s

const fail = (error: string): RunTimeParseResult => ({ ok: false, error });

/**
 * Reads a run time. Accepts "45.678", "45", "45.6", "1:05.432", "1:05", a comma as the
 * decimal separator ("45,678"), surrounding spaces and spaces next to ':' or the decimal
 * separator ("1 : 05. 432"). A space between two digits is refused rather than guessed at.
 * The result is exact to the millisecond (65.432, never 65.43199999).
 */
export function parseRunTime(text: string): RunTimeParseResult {
  let s = String(text ?? '').trim();
  if (s === '') return fail(`Enter the time. ${EXAMPLE}`);
  if (/^[-−–]/.test(s)) return fail('A time cannot be negative');
  s = s.replace(/\s*([:.,])\s*/g, '$1').replace(/,/g, '.');
  if (/\d\s+\d/.test(s)) return fail(`Remove the space inside the number. ${EXAMPLE}`);
  if (/[^\d:.]/.test(s)) return fail(`Use digits only. ${EXAMPLE}`);
  if (!/\d/.test(s)) return fail(`Enter the time. ${EXAMPLE}`);

  const parts = s.split(':');
  if (parts.length > 2) return fail(`Use at most one colon, between minutes and seconds. ${EXAMPLE}`);
  const [first = '', second] = parts;
  const minutesText = second === undefined ? null : first;
  const secondsText = second ?? first;
  if (minutesText !== null && !/^\d+$/.test(minutesText)) return fail(`Put the minutes before the colon, e.g. 1:05.432`);

  const dots = secondsText.split('.');
  if (dots.length > 2) return fail(`Use one decimal point. ${EXAMPLE}`);
  const [whole = '', fraction] = dots;
  if (minutesText !== null) {
    if (!/^\d\d$/.test(whole)) return fail('After the minutes, give the seconds as two digits, e.g. 1:05.432');
  } else if (whole === '') {
    return fail('Put a 0 before the decimal point, e.g. 0.5');
  }
  if (fraction === '') return fail('Add the digits after the decimal point, or leave the point out');
  if (fraction !== undefined && fraction.length > 3) {
    return fail('Use at most 3 decimals: timing gear reports thousandths of a second');
  }
  // Four digits or more and no point or colon: a point missed on the keypad (45678 for 45.678), not a
  // run of a quarter of an hour; with five or more, the last three are the thousandths timing gear gives.
  if (minutesText === null && fraction === undefined && whole.length >= 4) {
    return fail(whole.length >= 5 ? `No decimal point: for ${whole.slice(0, -3)}.${whole.slice(-3)}, type the point` : `No decimal point. ${EXAMPLE}`);
  }
  if (minutesText !== null && Number(whole) >= 60) {
    return fail('The seconds must be under 60 when minutes are given, e.g. 1:05.432');
  }

  // Whole milliseconds as an integer, then one division: the nearest double to the typed decimal.
  const ms = (Number(minutesText ?? '0') * 60 + Number(whole)) * 1000 + Number((fraction ?? '').padEnd(3, '0'));
  if (ms === 0) return fail('The time must be above 0');
  if (!(ms < MAX_SEC * 1000)) return fail('The time must be under 30 min (1800 s)');
  return { ok: true, seconds: ms / 1000 };
}

/**
 * A run's time box as a form reads it with the run's status: left empty, a DNF or an off-course run has no
 * time (null) and a finished one is refused; anything typed must read as a time.
 */
export function readRunTimeBox(text: string, status: RunStatus): { ok: true; seconds: number | null } | { ok: false; error: string } {
  if (text.trim()) return parseRunTime(text);
  if (status === 'finished') return fail(`Enter the time, or choose DNF or Off course. ${EXAMPLE}`);
  return { ok: true, seconds: null };
}

/**
 * Shows a run time to the millisecond: "45.678", or minutes:seconds past 60 s ("1:05.432").
 * Rounds to the nearest millisecond first, so 59.9996 shows as "1:00.000".
 * @throws RangeError for a negative or non-finite value.
 */
export function formatRunTime(seconds: number): string {
  if (!Number.isFinite(seconds) || seconds < 0) throw new RangeError(`Cannot show ${String(seconds)} as a run time`);
  const ms = Math.round(seconds * 1000);
  const minutes = Math.floor(ms / 60_000);
  const rest = ms - minutes * 60_000;
  const sec = Math.floor(rest / 1000);
  const thousandths = String(rest % 1000).padStart(3, '0');
  return minutes === 0 ? `${sec}.${thousandths}` : `${minutes}:${String(sec).padStart(2, '0')}.${thousandths}`;
}

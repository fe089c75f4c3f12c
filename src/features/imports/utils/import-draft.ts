import { formatRunTime } from '@shared/season/run-time';
import type { ImportRow, ImportRun } from '@shared/import/mapping';
import type { ImportFailure, ImportRunItem } from '@shared/import/import.schema';

/** Which rows are the user's: a car number to match exactly and/or words of the driver's name. */
export interface WhoseFilter {
  carNumber: string;
  driverName: string;
}

const words = (s: string) => s.toLowerCase().split(/[\s,.]+/).filter(Boolean);

/**
 * A row matches when its car number equals the one given (if any) and its driver name holds every
 * word given (if any), in any order, so "Nell Ashdown" finds "Ashdown, Nell". An empty filter matches all.
 */
export function matchesWhose(row: ImportRow, filter: WhoseFilter): boolean {
  const number = filter.carNumber.trim().replace(/^#\s*/, '').toLowerCase();
  if (number && row.carNumber.trim().toLowerCase() !== number) return false;
  const wanted = words(filter.driverName);
  const have = words(row.driverName);
  return wanted.every((w) => have.includes(w));
}

/** The runs of the chosen rows, as the server takes them; runs the sheet could not give are listed apart. */
export function runsToSend(rows: readonly ImportRow[]): { runs: ImportRunItem[]; notSent: ImportFailure[] } {
  const runs: ImportRunItem[] = [];
  const notSent: ImportFailure[] = [];
  for (const row of rows) {
    if (row.error) notSent.push({ line: row.line, runNumber: 0, reason: row.error });
    for (const run of row.runs) {
      if (run.error) notSent.push({ line: row.line, runNumber: run.runNumber, reason: run.error });
      else runs.push({ line: row.line, runNumber: run.runNumber, status: run.status, rawTimeSec: run.rawSec, cones: run.cones });
    }
  }
  return { runs, notSent };
}

/** "46.210 +1", "DNF", "Off course", "DSQ" — one run as the page shows it. */
export function describeRun(run: ImportRun): string {
  if (run.error) return 'cannot be read';
  const time = run.rawSec === null ? null : formatRunTime(run.rawSec);
  const cones = run.cones > 0 ? ` +${run.cones}` : '';
  switch (run.status) {
    case 'finished':
      return `${time ?? ''}${cones}`;
    case 'dnf':
      return time ? `DNF (${time})` : 'DNF';
    case 'off_course':
      return time ? `Off course (${time})` : 'Off course';
    case 'dsq':
      return time ? `DSQ (${time})` : 'DSQ';
  }
}

/** Noon on the event's date where this browser is, as the time run 1 is taken to have started. */
export function localNoon(date: string): string | undefined {
  const at = new Date(`${date}T12:00:00`);
  return Number.isNaN(at.getTime()) ? undefined : at.toISOString();
}

/**
 * The file's text: UTF-8 (or UTF-16, with its byte-order mark or without) when it is that, else Windows-1252, what a
 * spreadsheet on Windows saves a CSV in ("José" as one byte E9). Read through FileReader, which every browser we
 * support has.
 */
export function readFileText(file: Blob): Promise<string> {
  return new Promise((resolve, reject) => {
    const reader = new FileReader();
    reader.onload = () => resolve(decodeSheet(new Uint8Array(reader.result as ArrayBuffer)));
    reader.onerror = () => reject(reader.error ?? new Error('The file could not be read'));
    reader.readAsArrayBuffer(file);
  });
}

/**
 * UTF-16 with no byte-order mark: text that is mostly ASCII has a zero in every other byte, the high byte of each
 * character (after it in little-endian, before it in big-endian).
 */
function utf16Without(bytes: Uint8Array): 'utf-16le' | 'utf-16be' | null {
  const n = Math.min(bytes.length, 1024) & ~1;
  if (n < 4) return null;
  let evenZeros = 0;
  let oddZeros = 0;
  for (let i = 0; i < n; i += 2) {
    if (bytes[i] === 0) evenZeros++;
    if (bytes[i + 1] === 0) oddZeros++;
  }
  const pairs = n / 2;
  if (oddZeros > pairs * 0.8 && evenZeros < pairs * 0.1) return 'utf-16le';
  if (evenZeros > pairs * 0.8 && oddZeros < pairs * 0.1) return 'utf-16be';
  return null;
}

function decodeSheet(bytes: Uint8Array): string {
  if (bytes[0] === 0xff && bytes[1] === 0xfe) return new TextDecoder('utf-16le').decode(bytes);
  if (bytes[0] === 0xfe && bytes[1] === 0xff) return new TextDecoder('utf-16be').decode(bytes);
  const wide = utf16Without(bytes);
  if (wide) return new TextDecoder(wide).decode(bytes);
  try {
    return new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  } catch {
    return new TextDecoder('windows-1252').decode(bytes);
  }
}

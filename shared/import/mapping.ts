/**
 * Which column holds what, guessed from the column names and correctable by the user,
 * and the runs each row of a sheet stands for under that mapping.
 */
import { penaltyColumnNumber, runColumnNumber, type Sheet, type SheetShape } from './sheet';
import { parseConesCell, parseTimeCell } from './time';

export const IMPORT_FIELDS = ['driverName', 'carNumber', 'classCode', 'runNumber', 'time', 'cones', 'status'] as const;
export type ImportField = (typeof IMPORT_FIELDS)[number];
/** The fields a wide sheet maps by column; its runs come from `runColumns`. */
export const WIDE_FIELDS: readonly ImportField[] = ['driverName', 'carNumber', 'classCode'];

export interface RunColumn {
  runNumber: number;
  /** Column index of the run's time. */
  time: number;
  /** Column index of the run's own cones/penalty column, if the sheet has one. */
  cones: number | null;
}

export interface ColumnMapping {
  shape: SheetShape;
  /** Column index per field; null when the sheet has no such column. */
  columns: Record<ImportField, number | null>;
  /** Wide sheets only: one entry per run column, in run order. */
  runColumns: RunColumn[];
}

export type ImportRunStatus = 'finished' | 'dnf' | 'off_course' | 'dsq';

export interface ImportRun {
  runNumber: number;
  rawSec: number | null;
  cones: number;
  status: ImportRunStatus;
  /** Why this run cannot be imported as it stands. */
  error?: string;
}

export interface ImportRow {
  line: number;
  driverName: string;
  carNumber: string;
  classCode: string;
  runs: ImportRun[];
  /** Why the row as a whole cannot be read (e.g. its run number is not a number). */
  error?: string;
}

/** Names clubs use for each field, compared after lower-casing and dropping punctuation other than '#'. */
const NAMES: Record<ImportField, string[]> = {
  driverName: ['driver', 'driver name', 'name', 'entrant', 'competitor', 'full name', 'participant'],
  carNumber: ['car #', 'car#', 'car no', 'car number', 'number', 'num', '#', 'no', 'nr', 'car'],
  classCode: ['class', 'cls', 'car class', 'category', 'group'],
  runNumber: ['run', 'run #', 'run#', 'run no', 'run number', 'heat', 'attempt', 'run nr'],
  time: ['time', 'raw', 'raw time', 'rawtime', 'run time', 'elapsed', 'seconds', 'time s'],
  cones: ['cones', 'cone', 'pen', 'penalty', 'penalties', 'pylons'],
  status: ['status', 'result', 'flag', 'dnf'],
};
/** Words that, inside a longer name, point at a field ("Driver (first last)", "Raw time s"). */
const WORDS: Record<ImportField, RegExp> = {
  driverName: /\b(driver|name|entrant|competitor)\b/,
  carNumber: /\b(car\s*#|car\s*no|number)\b|^#$/,
  classCode: /\b(class|cls)\b/,
  runNumber: /\b(run|heat)\s*(#|no|number)?$/,
  time: /\b(time|raw)\b/,
  cones: /\b(cones?|pen(alty|alties)?)\b/,
  status: /\bstatus\b/,
};

const normalise = (name: string) => name.toLowerCase().replace(/[^a-z0-9# ]+/g, ' ').replace(/\s+/g, ' ').trim();

/** The wide sheet's run columns, each with its penalty column if one has the same number. */
export function findRunColumns(header: readonly string[]): RunColumn[] {
  const out: RunColumn[] = [];
  header.forEach((name, i) => {
    const n = runColumnNumber(name);
    if (n !== null && !out.some((r) => r.runNumber === n)) out.push({ runNumber: n, time: i, cones: null });
  });
  header.forEach((name, i) => {
    const n = penaltyColumnNumber(name);
    const run = out.find((r) => r.runNumber === n);
    if (run && run.cones === null) run.cones = i;
  });
  return out.sort((a, b) => a.runNumber - b.runNumber);
}

/** Guesses each field's column from the header names; a column serves one field at most. */
export function guessMapping(header: readonly string[], shape: SheetShape): ColumnMapping {
  const runColumns = shape === 'wide' ? findRunColumns(header) : [];
  const taken = new Set<number>(runColumns.flatMap((r) => (r.cones === null ? [r.time] : [r.time, r.cones])));
  const fields = shape === 'wide' ? WIDE_FIELDS : IMPORT_FIELDS;
  const columns = Object.fromEntries(IMPORT_FIELDS.map((f) => [f, null])) as Record<ImportField, number | null>;
  const names = header.map(normalise);
  // Exact names first, for every field, so "Car #" is the car number before "Car" could be anything else.
  for (const pass of ['exact', 'word'] as const) {
    for (const field of fields) {
      if (columns[field] !== null) continue;
      const free = (idx: number) => !taken.has(idx);
      // Exact names in the order listed (the likelier name first); then any name holding the field's word.
      const i =
        pass === 'exact'
          ? (NAMES[field].map((want) => names.findIndex((n, idx) => free(idx) && n === want)).find((idx) => idx >= 0) ?? -1)
          : names.findIndex((n, idx) => free(idx) && WORDS[field].test(n));
      if (i >= 0) {
        columns[field] = i;
        taken.add(i);
      }
    }
  }
  return { shape, columns, runColumns };
}

const STATUS_WORDS: Record<string, ImportRunStatus> = {
  '': 'finished', ok: 'finished', finished: 'finished', fin: 'finished', clean: 'finished', valid: 'finished',
  dnf: 'dnf', 'did not finish': 'dnf',
  off: 'off_course', 'off course': 'off_course', oc: 'off_course', 'wrong course': 'off_course', wc: 'off_course',
  dsq: 'dsq', dq: 'dsq', disqualified: 'dsq',
};

export interface RowsToRunsOptions {
  /** "45,678" is a decimal comma (semicolon-separated files). */
  decimalComma?: boolean;
}

/** One run from a time cell, an optional cones cell and an optional status cell. */
function readRun(runNumber: number, timeText: string, conesText: string | null, statusText: string | null, decimalComma: boolean): ImportRun | null {
  const cell = parseTimeCell(timeText, { decimalComma });
  const statusKey = (statusText ?? '').trim().toLowerCase().replace(/\s+/g, ' ');
  const statusWord = STATUS_WORDS[statusKey];
  if (cell.kind === 'empty' && (statusKey === '' || statusWord === 'finished')) return null;
  const run: ImportRun = { runNumber, rawSec: null, cones: 0, status: 'finished' };
  if (cell.kind === 'invalid') return { ...run, error: cell.reason };
  if (cell.kind === 'time') {
    run.rawSec = cell.rawSec;
    run.cones = cell.cones;
  } else if (cell.kind !== 'empty') {
    run.status = cell.kind;
  }
  if (conesText !== null && conesText.trim() !== '') {
    const cones = parseConesCell(conesText);
    if (!cones.ok) return { ...run, error: cones.reason };
    run.cones = cones.cones;
  }
  if (statusWord === undefined) return { ...run, error: `"${statusText?.trim()}" is not a status we know (use DNF, OFF or DSQ)` };
  if (statusWord !== 'finished') run.status = statusWord;
  if (run.status === 'finished' && run.rawSec === null) return { ...run, error: 'A finished run needs its time' };
  return run;
}

/** "Class SS" or a short heading such as "HS" names the block's class; a long title does not. */
function classFromHeading(heading: string | null): string {
  if (!heading) return '';
  const m = /^class\b\s*:?\s*(.+)$/i.exec(heading);
  if (m) return m[1]!.trim();
  return heading.length <= 12 ? heading : '';
}

/** The runs of each row under `mapping`. Rows with no runs at all (every run cell empty) are left out. */
export function rowsToRuns(sheet: Pick<Sheet, 'rows' | 'lines' | 'sections' | 'delimiter'>, mapping: ColumnMapping, options: RowsToRunsOptions = {}): ImportRow[] {
  const decimalComma = options.decimalComma ?? sheet.delimiter === ';';
  const cell = (row: string[], i: number | null) => (i === null ? '' : (row[i] ?? ''));
  const nthOf = new Map<string, number>();
  const out: ImportRow[] = [];
  sheet.rows.forEach((row, r) => {
    const base: ImportRow = {
      line: sheet.lines[r] ?? r + 1,
      driverName: cell(row, mapping.columns.driverName),
      carNumber: cell(row, mapping.columns.carNumber).replace(/^#\s*/, ''),
      classCode: cell(row, mapping.columns.classCode) || classFromHeading(sheet.sections[r] ?? null),
      runs: [],
    };
    if (mapping.shape === 'wide') {
      for (const rc of mapping.runColumns) {
        const run = readRun(rc.runNumber, cell(row, rc.time), rc.cones === null ? null : cell(row, rc.cones), null, decimalComma);
        if (run) base.runs.push(run);
      }
    } else {
      const { runNumber: runCol, time, cones, status } = mapping.columns;
      let runNumber: number;
      if (runCol === null) {
        // No run column: the rows of one driver and car are their runs in order.
        const key = `${base.driverName.toLowerCase()}|${base.carNumber.toLowerCase()}`;
        runNumber = (nthOf.get(key) ?? 0) + 1;
        nthOf.set(key, runNumber);
      } else {
        const m = /^(?:run|r|#)?\s*(\d{1,3})$/i.exec(cell(row, runCol).trim());
        if (!m || Number(m[1]) < 1) {
          out.push({ ...base, error: `The run number "${cell(row, runCol)}" is not a whole number from 1` });
          return;
        }
        runNumber = Number(m[1]);
      }
      if (time === null) {
        out.push({ ...base, error: 'Choose the column that holds the time' });
        return;
      }
      const run = readRun(runNumber, cell(row, time), cones === null ? null : cell(row, cones), status === null ? null : cell(row, status), decimalComma);
      if (run) base.runs.push(run);
    }
    if (base.runs.length > 0 || base.error) out.push(base);
  });
  return out;
}

/**
 * Reads a club's timing sheet (CSV or TSV) into a header and result rows, setting aside
 * what is not a result: blank lines, the header repeated at the top of each class block,
 * heading lines ("Class SR") and summary lines at the end ("Total entries: 24").
 */
import Papa from 'papaparse';

export type SheetShape = 'long' | 'wide';
export type Delimiter = ',' | ';' | '\t';

export interface SkippedLine {
  line: number;
  reason: string;
}

export interface Sheet {
  header: string[];
  /** Result rows, each cell trimmed, padded to the header's length. */
  rows: string[][];
  /** The line in the file of each row (1-based; a quoted field spanning lines counts once). */
  lines: number[];
  /** The heading line above each row's block (e.g. "Class SR"), when the file has such lines. */
  sections: (string | null)[];
  skipped: SkippedLine[];
  delimiter: Delimiter;
  /** Long: one row per run. Wide: one row per driver, a column per run. */
  shape: SheetShape;
}

/** A run column of a wide sheet: "Run 1", "R2", "Run #3". */
export const RUN_COLUMN = /^(?:run|r)\s*#?\s*(\d{1,3})$/i;
/** A per-run penalty column: "Pen 1", "P1", "Cones 1", "Run 1 cones", "R2 pen". */
export const PENALTY_COLUMN =
  /^(?:(?:pen(?:alty|alties)?|p|cones?)\s*#?\s*(\d{1,3})|(?:run|r)\s*#?\s*(\d{1,3})\s*(?:pen(?:alty|alties)?|cones?))$/i;

const SUMMARY_WORDS = /^(?:total|totals|entries|entrants|starters|generated|printed|produced|timing by|results by|page\s+\d|average|count|fastest)\b/i;

export function runColumnNumber(name: string): number | null {
  const m = RUN_COLUMN.exec(name.trim());
  return m ? Number(m[1]) : null;
}

export function penaltyColumnNumber(name: string): number | null {
  const m = PENALTY_COLUMN.exec(name.trim());
  return m ? Number(m[1] ?? m[2]) : null;
}

/** Wide when at least two header cells name a run ("Run 1", "R2"). */
export function detectShape(header: readonly string[]): SheetShape {
  return header.filter((h) => runColumnNumber(h) !== null).length >= 2 ? 'wide' : 'long';
}

/** Same cells, ignoring letter case and empty cells at the end. */
const same = (a: readonly string[], b: readonly string[]) => {
  const x = trimEnd([...a]);
  const y = trimEnd([...b]);
  return x.length === y.length && x.every((c, i) => c.toLowerCase() === y[i]!.toLowerCase());
};
const filled = (row: readonly string[]) => row.filter((c) => c !== '').length;

export class SheetError extends Error {}

/**
 * A file that is not text, read as text: a workbook saved as .xlsx or .ods is a zip archive, whose first
 * bytes are "PK\x03\x04" (the ZIP local file header, PKWARE APPNOTE 4.3.7); a PDF starts "%PDF-"; an older
 * .xls or a picture holds NUL bytes, which no text file does (accented letters in another encoding are not a
 * sign: a CSV saved as Windows-1252 is text).
 */
function notTextProblem(text: string): string | null {
  if (text.startsWith('PK\u0003\u0004')) {
    return 'This is a spreadsheet workbook (such as .xlsx or .ods), not text. Open it in your spreadsheet app, save it as CSV, and pick that file.';
  }
  // eslint-disable-next-line no-control-regex -- matching NUL is the point
  if (text.startsWith('%PDF-') || (text.slice(0, 4096).match(/\u0000/g) ?? []).length > 4) {
    return 'This file is not text: it may be an older workbook (.xls), a PDF or a picture. Save the results as CSV and pick that file.';
  }
  return null;
}

/**
 * Parses the text of a CSV/TSV file. Separator: comma, semicolon or tab, whichever the file
 * uses consistently. A byte-order mark is dropped. Quoted fields may hold separators.
 * @throws SheetError when the file is not text (a workbook) or no header line (two or more named columns) is found.
 */
export function parseSheet(text: string): Sheet {
  const clean = text.replace(/^\uFEFF/, '');
  const notText = notTextProblem(clean);
  if (notText) throw new SheetError(notText);
  const result = Papa.parse<string[]>(clean, { delimitersToGuess: [',', ';', '\t'], skipEmptyLines: false });
  const delimiter = (([',', ';', '\t'] as const).find((d) => d === result.meta.delimiter) ?? ',') satisfies Delimiter;
  const records = result.data.map((r) => r.map((c) => String(c ?? '').replace(/\u00a0/g, ' ').trim()));

  const skipped: SkippedLine[] = [];
  let header: string[] | null = null;
  let firstSection: string | null = null;
  const body: { line: number; cells: string[] }[] = [];
  records.forEach((cells, i) => {
    const line = i + 1;
    if (filled(cells) === 0) {
      // A blank last line (the file's final newline) is not worth mentioning.
      if (i < records.length - 1) skipped.push({ line, reason: 'Blank line' });
      return;
    }
    if (!header) {
      if (filled(cells) >= 2) {
        header = trimEnd(cells);
      } else {
        // The last such line may head the first block ("Class SS").
        firstSection = cells.find((c) => c !== '')!;
        skipped.push({ line, reason: 'Title line above the column names' });
      }
      return;
    }
    if (same(cells, header)) {
      skipped.push({ line, reason: 'The column names again (a new block)' });
      return;
    }
    body.push({ line, cells });
  });
  if (!header) throw new SheetError('No line with column names was found. The first line should name the columns, e.g. Driver, Car, Run 1.');
  const head: string[] = header;

  // Summary lines at the end: a summary word, or too few cells to be a result.
  let end = body.length;
  while (end > 0) {
    const { cells } = body[end - 1]!;
    if (isSummary(cells) || filled(cells) <= 1) end -= 1;
    else break;
  }
  for (const { line } of body.slice(end)) skipped.push({ line, reason: 'Summary line after the results' });

  const rows: string[][] = [];
  const lines: number[] = [];
  const sections: (string | null)[] = [];
  let section: string | null = firstSection;
  for (const { line, cells } of body.slice(0, end)) {
    if (isSummary(cells)) {
      skipped.push({ line, reason: 'Summary line, not a result' });
      continue;
    }
    if (filled(cells) === 1) {
      section = cells.find((c) => c !== '')!;
      skipped.push({ line, reason: `Heading line "${section}"` });
      continue;
    }
    rows.push(head.map((_, i) => cells[i] ?? ''));
    lines.push(line);
    sections.push(section);
  }
  skipped.sort((a, b) => a.line - b.line);
  return { header: head, rows, lines, sections, skipped, delimiter, shape: detectShape(head) };
}

function isSummary(cells: readonly string[]): boolean {
  const first = cells.find((c) => c !== '');
  return first !== undefined && SUMMARY_WORDS.test(first);
}

function trimEnd(cells: string[]): string[] {
  let n = cells.length;
  while (n > 0 && cells[n - 1] === '') n -= 1;
  return cells.slice(0, n);
}

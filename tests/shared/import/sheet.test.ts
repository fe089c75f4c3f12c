import { describe, expect, it } from 'vitest';
import { detectShape, parseSheet, SheetError } from '../../../shared/import/sheet';

// Fixtures are written the way club result files come: exported from a spreadsheet or the timing
// laptop (common practice: a byte-order mark from spreadsheet "UTF-8 CSV" exports, semicolons where the
// decimal mark is a comma, tab-separated text copied from a results page). Clubs and people are invented.

describe('parseSheet: separators, byte-order mark and quoting', () => {
  it('when the file starts with a byte-order mark, then the first column name has no stray character', () => {
    const sheet = parseSheet('\uFEFFDriver,Car #,Run,Time\nNell Ashdown,42,1,46.210\n');
    expect(sheet.header).toEqual(['Driver', 'Car #', 'Run', 'Time']);
    expect(sheet.rows).toEqual([['Nell Ashdown', '42', '1', '46.210']]);
    expect(sheet.skipped).toEqual([]);
  });

  it('when fields are separated by semicolons, then the semicolon is the separator and commas stay inside cells', () => {
    const sheet = parseSheet('Fahrer;Nr;Lauf;Zeit\nNell Ashdown;42;1;46,210\nIvo Parrish;7;1;45,980\n');
    expect(sheet.delimiter).toBe(';');
    expect(sheet.rows).toEqual([
      ['Nell Ashdown', '42', '1', '46,210'],
      ['Ivo Parrish', '7', '1', '45,980'],
    ]);
  });

  it('when fields are separated by tabs, then each tab starts a new cell', () => {
    const sheet = parseSheet('Driver\tCar\tRun 1\tRun 2\nNell Ashdown\t42\t46.210+1\t45.874\n');
    expect(sheet.delimiter).toBe('\t');
    expect(sheet.rows).toEqual([['Nell Ashdown', '42', '46.210+1', '45.874']]);
    expect(sheet.shape).toBe('wide');
  });

  it('when a quoted field holds a comma or a quote, then it stays one cell', () => {
    const sheet = parseSheet('Driver,Car,Run,Time\n"Ashdown, Nell",42,1,46.210\n"Parrish, Ivo ""Fast""",7,1,45.980\n');
    expect(sheet.rows.map((r) => r[0])).toEqual(['Ashdown, Nell', 'Parrish, Ivo "Fast"']);
    expect(sheet.rows[0]).toHaveLength(4);
  });
});

describe('parseSheet: lines that are not results', () => {
  it('when there are blank lines, then they are skipped and each row keeps its line number in the file', () => {
    const sheet = parseSheet('Driver,Car,Run,Time\n\nNell Ashdown,42,1,46.210\n,,,\nIvo Parrish,7,1,45.980\n');
    expect(sheet.rows.map((r) => r[0])).toEqual(['Nell Ashdown', 'Ivo Parrish']);
    expect(sheet.lines).toEqual([3, 5]);
    expect(sheet.skipped).toEqual([
      { line: 2, reason: 'Blank line' },
      { line: 4, reason: 'Blank line' },
    ]);
  });

  it('when each class has its own block with a heading and the column names again, then only result rows remain, each with its block heading', () => {
    const text = [
      'Cedar Flats Motor Club - Round 3', // a title above the column names
      'Class SS',
      'Driver,Car,Run 1,Run 2',
      'Nell Ashdown,42,46.210,45.874',
      'Ivo Parrish,7,45.980,DNF',
      '',
      'Class HS',
      'Driver,Car,Run 1,Run 2',
      'Mira Tallis,15,49.002+1,48.511',
    ].join('\r\n');
    const sheet = parseSheet(text);
    expect(sheet.header).toEqual(['Driver', 'Car', 'Run 1', 'Run 2']);
    expect(sheet.rows.map((r) => r[0])).toEqual(['Nell Ashdown', 'Ivo Parrish', 'Mira Tallis']);
    expect(sheet.sections).toEqual(['Class SS', 'Class SS', 'Class HS']);
    expect(sheet.skipped).toEqual([
      { line: 1, reason: 'Title line above the column names' },
      { line: 2, reason: 'Title line above the column names' },
      { line: 6, reason: 'Blank line' },
      { line: 7, reason: 'Heading line "Class HS"' },
      { line: 8, reason: 'The column names again (a new block)' },
    ]);
  });

  it('when summary lines follow the results, then they are set aside and not read as results', () => {
    const text = [
      'Driver,Car,Class,Run,Time',
      'Nell Ashdown,42,SS,1,46.210',
      'Ivo Parrish,7,SS,1,45.980',
      'Total entries,2,,,',
      'Fastest,,,,45.980',
      'Generated 2026-04-12 15:02 by the timing laptop',
    ].join('\n');
    const sheet = parseSheet(text);
    expect(sheet.rows).toHaveLength(2);
    expect(sheet.skipped).toEqual([
      { line: 4, reason: 'Summary line after the results' },
      { line: 5, reason: 'Summary line after the results' },
      { line: 6, reason: 'Summary line after the results' },
    ]);
  });

  it('when the header repeats in different letter case, then it is still recognised as the column names', () => {
    const sheet = parseSheet('Driver,Car,Run,Time\nNell Ashdown,42,1,46.210\nDRIVER,CAR,RUN,TIME\nIvo Parrish,7,1,45.980\n');
    expect(sheet.rows).toHaveLength(2);
  });

  it('when the file is a workbook or other binary read as text, then a SheetError says to save it as CSV, before any row is guessed at', () => {
    // An .xlsx or .ods is a zip archive: it starts with the local file header signature 50 4B 03 04 (PKWARE APPNOTE 4.3.7).
    const xlsx = new TextDecoder().decode(Uint8Array.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00, 0x08, 0x00, 0x00, 0x00, 0x21, 0x00, 0x62, 0xee, 0x9d, 0x68]));
    expect(() => parseSheet(`${xlsx}[Content_Types].xml,a,b\n1,2,3`)).toThrow(/spreadsheet workbook .*save it as CSV/);
    // An old .xls (an OLE compound file, D0 CF 11 E0 A1 B1 1A E1, from memory) decodes to U+FFFD and NULs.
    const xls = new TextDecoder().decode(Uint8Array.from([0xd0, 0xcf, 0x11, 0xe0, 0xa1, 0xb1, 0x1a, 0xe1, 0, 0, 0, 0, 0, 0, 0, 0, 0x3e, 0x00, 0x03, 0x00]));
    expect(() => parseSheet(`${xls},Driver,Car\n`)).toThrow(/not text.*Save the results as CSV/);
    expect(() => parseSheet('%PDF-1.7\n%\u00e2\u00e3\n1 0 obj')).toThrow(/not text/);
    // A text file whose accented letters came out wrong (another encoding) is still text.
    expect(parseSheet('Driver,Car,Run 1\nJos\uFFFD Pe\uFFFDa,12,45.1\nRen\uFFFDe M\uFFFDller,7,46.0\nL\uFFFDa \uFFFD,3,47\n').rows).toHaveLength(3);
  });

  it('when no line names two or more columns, then a SheetError says what the first line should hold', () => {
    expect(() => parseSheet('just one thing\n\n')).toThrow(SheetError);
    expect(() => parseSheet('')).toThrow(/name the columns/);
  });
});

describe('detectShape', () => {
  it.each<[string[], 'long' | 'wide']>([
    [['Driver', 'Car', 'Run', 'Time'], 'long'],
    [['Driver', 'Car #', 'Run #', 'Raw time', 'Cones'], 'long'],
    [['Driver', 'Car', 'Run 1', 'Run 2', 'Run 3'], 'wide'],
    [['Name', '#', 'R1', 'R2'], 'wide'],
    [['Name', '#', 'Run #1', 'Pen 1', 'Run #2', 'Pen 2'], 'wide'],
    [['Name', 'Run 1', 'Best'], 'long'],
  ])('when the columns are %j, then %s', (header, shape) => {
    expect(detectShape(header)).toBe(shape);
  });
});

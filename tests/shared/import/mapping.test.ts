import { describe, expect, it } from 'vitest';
import { parseSheet } from '../../../shared/import/sheet';
import { guessMapping, rowsToRuns, type ColumnMapping } from '../../../shared/import/mapping';

// Three invented clubs' column names for the same facts. Cones after "+" and penalty columns per run are
// both common practice in autocross result sheets.

describe('guessMapping', () => {
  it('when the columns are "Driver, Car #, Class, Run, Time, Cones, Status", then each is found by its name', () => {
    const header = ['Driver', 'Car #', 'Class', 'Run', 'Time', 'Cones', 'Status'];
    expect(guessMapping(header, 'long').columns).toEqual({
      driverName: 0, carNumber: 1, classCode: 2, runNumber: 3, time: 4, cones: 5, status: 6,
    });
  });

  it('when the columns are "Entrant, No., Cls, Heat, Raw time, Penalty", then the same fields are found', () => {
    const header = ['Entrant', 'No.', 'Cls', 'Heat', 'Raw time', 'Penalty'];
    expect(guessMapping(header, 'long').columns).toEqual({
      driverName: 0, carNumber: 1, classCode: 2, runNumber: 3, time: 4, cones: 5, status: null,
    });
  });

  it('when the columns are "Pos, #, Name, Car, Run 1, Pen 1, Run 2, Pen 2, Best", then the number is "#", not the car model', () => {
    const header = ['Pos', '#', 'Name', 'Car', 'Run 1', 'Pen 1', 'Run 2', 'Pen 2', 'Best'];
    const mapping = guessMapping(header, 'wide');
    expect(mapping.columns).toMatchObject({ driverName: 2, carNumber: 1, classCode: null });
    expect(mapping.runColumns).toEqual([
      { runNumber: 1, time: 4, cones: 5 },
      { runNumber: 2, time: 6, cones: 7 },
    ]);
  });

  it('when run and penalty columns are named "R1, R1 cones" and "Run 2 cones", then each penalty pairs with its run', () => {
    const mapping = guessMapping(['Driver', 'R1', 'R1 cones', 'R2', 'Run 2 cones', 'R3'], 'wide');
    expect(mapping.runColumns).toEqual([
      { runNumber: 1, time: 1, cones: 2 },
      { runNumber: 2, time: 3, cones: 4 },
      { runNumber: 3, time: 5, cones: null },
    ]);
  });
});

describe('rowsToRuns: a long sheet (one row per run)', () => {
  const text = [
    'Driver,Car #,Class,Run,Time,Cones,Status',
    'Nell Ashdown,42,SS,1,46.210,1,',
    'Nell Ashdown,42,SS,2,45.874+1,,',
    'Nell Ashdown,42,SS,3,47.002,,OFF',
    'Nell Ashdown,42,SS,4,,,DNF',
    'Nell Ashdown,42,SS,5,DSQ,,',
    'Nell Ashdown,42,SS,6,,,',
    'Nell Ashdown,42,SS,x,46.000,,',
    'Nell Ashdown,42,SS,7,46.1.2,,',
  ].join('\n');

  it('when rows hold times, cones and statuses, then each row gives its run; an empty time is no run', () => {
    const sheet = parseSheet(text);
    const rows = rowsToRuns(sheet, guessMapping(sheet.header, sheet.shape));
    expect(rows.map((r) => [r.line, r.runs, r.error])).toEqual([
      [2, [{ runNumber: 1, rawSec: 46.21, cones: 1, status: 'finished' }], undefined],
      [3, [{ runNumber: 2, rawSec: 45.874, cones: 1, status: 'finished' }], undefined],
      [4, [{ runNumber: 3, rawSec: 47.002, cones: 0, status: 'off_course' }], undefined],
      [5, [{ runNumber: 4, rawSec: null, cones: 0, status: 'dnf' }], undefined],
      [6, [{ runNumber: 5, rawSec: null, cones: 0, status: 'dsq' }], undefined],
      [8, [], expect.stringContaining('"x"')],
      [9, [{ runNumber: 7, rawSec: null, cones: 0, status: 'finished', error: expect.stringMatching(/decimal point/) }], undefined],
    ]);
    expect(rows[0]).toMatchObject({ driverName: 'Nell Ashdown', carNumber: '42', classCode: 'SS' });
  });

  it('when the sheet has no run column, then a driver\'s rows are numbered in order', () => {
    const sheet = parseSheet('Name,#,Time\nNell Ashdown,42,46.2\nIvo Parrish,7,45.9\nNell Ashdown,42,45.8\n');
    const rows = rowsToRuns(sheet, guessMapping(sheet.header, sheet.shape));
    expect(rows.map((r) => [r.driverName, r.runs[0]!.runNumber])).toEqual([['Nell Ashdown', 1], ['Ivo Parrish', 1], ['Nell Ashdown', 2]]);
  });

  it('when the file uses semicolons, then "46,210" reads as 46.210 s', () => {
    const sheet = parseSheet('Fahrer;Nr;Lauf;Zeit;Pen\nNell Ashdown;42;1;46,210;2\n');
    const mapping: ColumnMapping = {
      shape: 'long',
      columns: { driverName: 0, carNumber: 1, classCode: null, runNumber: 2, time: 3, cones: 4, status: null },
      runColumns: [],
    };
    expect(rowsToRuns(sheet, mapping)[0]!.runs).toEqual([{ runNumber: 1, rawSec: 46.21, cones: 2, status: 'finished' }]);
  });

  it('when the user points "time" at another column, then the runs follow the new column', () => {
    const sheet = parseSheet('Driver,Run,Raw,Final\nNell Ashdown,1,46.210,48.210\n');
    const guessed = guessMapping(sheet.header, sheet.shape);
    expect(rowsToRuns(sheet, guessed)[0]!.runs[0]!.rawSec).toBe(46.21);
    const corrected = { ...guessed, columns: { ...guessed.columns, time: 3 } };
    expect(rowsToRuns(sheet, corrected)[0]!.runs[0]!.rawSec).toBe(48.21);
  });
});

describe('rowsToRuns: a wide sheet (one row per driver, a column per run)', () => {
  it('when runs have penalty columns, then each run takes its number from its column and its cones from its penalty column', () => {
    const text = [
      '\uFEFFPos;#;Name;Class;Run 1;Pen 1;Run 2;Pen 2;Run 3;Pen 3',
      '1;7;Ivo Parrish;SS;45,980;0;DNF;;45,501;1',
      '2;42;Nell Ashdown;SS;46,210;1;45,874;;;',
      'Entries: 2;;;;;;;;;',
    ].join('\n');
    const sheet = parseSheet(text);
    expect(sheet.shape).toBe('wide');
    const rows = rowsToRuns(sheet, guessMapping(sheet.header, sheet.shape));
    expect(rows).toEqual([
      {
        line: 2, driverName: 'Ivo Parrish', carNumber: '7', classCode: 'SS',
        runs: [
          { runNumber: 1, rawSec: 45.98, cones: 0, status: 'finished' },
          { runNumber: 2, rawSec: null, cones: 0, status: 'dnf' },
          { runNumber: 3, rawSec: 45.501, cones: 1, status: 'finished' },
        ],
      },
      {
        line: 3, driverName: 'Nell Ashdown', carNumber: '42', classCode: 'SS',
        runs: [
          { runNumber: 1, rawSec: 46.21, cones: 1, status: 'finished' },
          { runNumber: 2, rawSec: 45.874, cones: 0, status: 'finished' },
        ],
      },
    ]);
  });

  it('when a wide sheet has blocks per class and cones after "+", then classes come from the block headings', () => {
    const text = ['Class SS', 'Driver,Car,R1,R2', 'Nell Ashdown,42,46.210+1,45.874', '', 'Class HS', 'Driver,Car,R1,R2', 'Mira Tallis,15,OFF,48.511+2'].join('\n');
    const sheet = parseSheet(text);
    const rows = rowsToRuns(sheet, guessMapping(sheet.header, sheet.shape));
    expect(rows.map((r) => [r.driverName, r.classCode, r.runs.map((x) => [x.runNumber, x.rawSec, x.cones, x.status])])).toEqual([
      ['Nell Ashdown', 'SS', [[1, 46.21, 1, 'finished'], [2, 45.874, 0, 'finished']]],
      ['Mira Tallis', 'HS', [[1, null, 0, 'off_course'], [2, 48.511, 2, 'finished']]],
    ]);
  });
});

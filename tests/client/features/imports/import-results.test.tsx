// @vitest-environment jsdom
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it } from 'vitest';
import type { ImportResultsInput } from '../../../../shared/import/import.schema';
import { jsonResponse, renderApp, requestsTo, setUpAppTests, stubFetch, type StubRoutes } from '../../test-utils';
import { CAR, EVENT, IDS, list, user } from '../../fixtures/season';

// An invented club's results: Maren Holt drives car 47 (the fixture's roadster); the others are invented too.
const PATH = `/cars/${IDS.car}/import?eventId=${IDS.event}`;
const POST = `POST /api/events/${IDS.event}/imports`;

function stubImport(extra: StubRoutes = {}) {
  return stubFetch({
    'GET /api/auth/session': jsonResponse(200, { user: user() }),
    [`GET /api/cars/${IDS.car}`]: jsonResponse(200, CAR),
    'GET /api/events': list([EVENT]),
    [POST]: jsonResponse(200, {
      created: 2,
      alreadyThere: 1,
      differing: [{ line: 3, runNumber: 1, logged: { status: 'finished', rawTimeSec: 46.7, cones: 0 }, sheet: { status: 'finished', rawTimeSec: 46.21, cones: 1 } }],
      failed: [{ line: 4, runNumber: 3, reason: 'Run numbers go up to 999' }],
    }),
    ...extra,
  });
}

async function chooseFile(text: string | Uint8Array<ArrayBuffer>, name = 'round-4.csv') {
  const u = userEvent.setup();
  const input = await screen.findByLabelText(/Results file/);
  await u.upload(input, new File([text], name, { type: 'text/csv' }));
  return u;
}

setUpAppTests([() => import('@/app/routes/cars/import-results')]);

// Each test reads a file and clicks through the page: allow for a busy machine.
describe('the results import page', { timeout: 15_000 }, () => {
  it('when a file is chosen, then the column names and its first 8 rows show, and lines set aside are counted', async () => {
    stubImport();
    renderApp(PATH);
    const rows = Array.from({ length: 10 }, (_, i) => `Driver ${i + 1},${i + 1},SM,1,4${i}.500`);
    await chooseFile(['\uFEFFDriver,Car #,Class,Run,Time', ...rows, '', 'Total entries,10,,,'].join('\n'));

    const preview = await screen.findByRole('region', { name: 'File preview' }, );
    const table = within(preview).getByRole('table');
    expect(within(table).getAllByRole('columnheader').map((th) => th.textContent)).toEqual(['Line', 'Driver', 'Car #', 'Class', 'Run', 'Time']);
    const body = within(table).getAllByRole('row').slice(1);
    expect(body).toHaveLength(8);
    expect(within(body[0]!).getByText('Driver 1')).toBeTruthy();
    expect(within(table).queryByText('Driver 9')).toBeNull();
    expect(screen.getByText(/10 result rows, fields separated by commas; one row per run/)).toBeTruthy();
    expect(screen.getByText('2 lines set aside (not results)')).toBeTruthy();
    // The guessed columns show as selects.
    expect((screen.getByLabelText('Raw time') as HTMLSelectElement).value).toBe('4');
    expect((screen.getByLabelText('Car number') as HTMLSelectElement).value).toBe('1');
  });

  it('when the time column is changed, then the runs to import follow the new column', async () => {
    const fetchMock = stubImport();
    renderApp(PATH);
    const u = await chooseFile('Driver,#,Run,Raw,Final\nMaren Holt,47,1,46.210,48.210\nMaren Holt,47,2,45.874,45.874\n');
    await screen.findByRole('region', { name: 'File preview' });
    const timeSelect = screen.getByLabelText('Raw time') as HTMLSelectElement;
    expect(timeSelect.value).toBe('3');
    expect(screen.getByText('Run 1: 46.210')).toBeTruthy();

    await u.selectOptions(timeSelect, 'Final');
    expect(screen.getByText('Run 1: 48.210')).toBeTruthy();
    expect(screen.queryByText('Run 1: 46.210')).toBeNull();
    await u.click(screen.getByRole('button', { name: 'Import 2 runs' }));
    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    const sent = requestsTo(fetchMock, POST)[0]!.body as ImportResultsInput;
    expect(sent.runs.map((r) => r.rawTimeSec)).toEqual([48.21, 45.874]);
  });

  it('when rows are chosen, then only the ticked rows of the car are sent, and the answer is summed up', async () => {
    const fetchMock = stubImport();
    renderApp(PATH);
    const text = [
      'Pos;#;Name;Class;Run 1;Pen 1;Run 2;Pen 2',
      '1;12;Juno Brack;SM;44,900;0;44,700;0',
      '2;47;Maren Holt;SM;46,210;1;DNF;',
      '3;47;Tomas Reyes;SM;47,000;0;46,500;2',
      '4;8;Pia Lindqvist;SM;48,100;;abc;',
    ].join('\n');
    const u = await chooseFile(text, 'round-4.txt');
    await screen.findByRole('region', { name: 'File preview' });
    expect((screen.getByLabelText('Layout') as HTMLSelectElement).value).toBe('wide');
    expect(screen.getByText(/Run 2: “Run 2”, cones from “Pen 2”/)).toBeTruthy();

    // The car's number is filled in: the two drivers of car 47 match, both ticked.
    expect((screen.getByLabelText('Your car number') as HTMLInputElement).value).toBe('47');
    const chosen = screen.getByRole('list', { name: 'Rows that match' });
    expect(within(chosen).getAllByRole('checkbox')).toHaveLength(2);
    expect(screen.getByRole('button', { name: 'Import 4 runs' })).toBeTruthy();
    await u.click(within(chosen).getByRole('checkbox', { name: /Line 4: Tomas Reyes/ }));
    await u.selectOptions(screen.getByLabelText('Whose runs'), 'Maren Holt');
    await u.click(screen.getByRole('button', { name: 'Import 2 runs' }));

    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    const sent = requestsTo(fetchMock, POST)[0]!.body as ImportResultsInput;
    expect(sent).toEqual({
      carId: IDS.car,
      driverId: IDS.maren,
      firstRunAt: new Date('2026-06-07T12:00:00').toISOString(),
      runs: [
        { line: 3, runNumber: 1, status: 'finished', rawTimeSec: 46.21, cones: 1 },
        { line: 3, runNumber: 2, status: 'dnf', rawTimeSec: null, cones: 0 },
      ],
    });
    const summary = await screen.findByRole('status', { name: 'Import result' });
    expect(summary.textContent).toContain('Added 2 runs.');
    expect(summary.textContent).toContain('1 run already logged for this event; kept as they were.');
    // The phone's run 1 stays, and the sheet's other result is named beside it.
    expect(summary.textContent).toContain('The sheet gives one of them otherwise. If the sheet is right, edit the run on the event’s page:');
    expect(within(summary).getByText('Run 1: logged 46.700; the sheet (line 3) 46.210 +1 cone')).toBeTruthy();
    expect(summary.textContent).toContain('Line 4, run 3: Run numbers go up to 999');
  });

  it('when a chosen row has a cell that is not a time, then that run is left out and listed with its reason', async () => {
    const fetchMock = stubImport({ [POST]: jsonResponse(200, { created: 1, alreadyThere: 0, differing: [], failed: [] }) });
    renderApp(PATH);
    const u = await chooseFile('Name\t#\tR1\tR2\nPia Lindqvist\t47\t48.100\tabc\n');
    await screen.findByText(/Run 2 will be left out: "abc" is not a time/);
    await u.click(screen.getByRole('button', { name: 'Import 1 run' }));
    await waitFor(() => expect(requestsTo(fetchMock, POST)).toHaveLength(1));
    expect((requestsTo(fetchMock, POST)[0]!.body as ImportResultsInput).runs).toHaveLength(1);
    expect((await screen.findByRole('status', { name: 'Import result' })).textContent).toContain('Line 2, run 2: "abc" is not a time, DNF, OFF or DSQ');
  });

  it('when the file has no line of column names, then the message shows beside the file picker', async () => {
    stubImport();
    renderApp(PATH);
    await chooseFile('only one thing\n');
    expect(await screen.findByText(/No line with column names was found/)).toBeTruthy();
    expect(screen.queryByRole('region', { name: 'File preview' })).toBeNull();
  });

  it('when the CSV was saved as Windows-1252 (as a spreadsheet on Windows does), then its accented names read right', async () => {
    stubImport();
    renderApp(PATH);
    // "José Peña" and "Renée Müller" in Windows-1252: é = E9, ñ = F1, ü = FC (one byte each; not valid UTF-8).
    const latin = (s: string) => Uint8Array.from([...s].map((c) => c.charCodeAt(0)));
    await chooseFile(latin('Driver,Car #,Run,Time\nJos\u00e9 Pe\u00f1a,12,1,45.100\nRen\u00e9e M\u00fcller,7,1,46.020\n'));

    const preview = await screen.findByRole('region', { name: 'File preview' });
    expect(within(preview).getByText('José Peña')).toBeTruthy();
    expect(within(preview).getByText('Renée Müller')).toBeTruthy();
  });

  it('when the CSV was saved as UTF-16 without a byte-order mark, then it is read as text, not taken for a workbook', async () => {
    stubImport();
    renderApp(PATH);
    const text = 'Driver,Car #,Run,Time\nJosé Peña,12,1,45.100\nRenée Müller,7,1,46.020\n';
    // UTF-16LE: each character's low byte, then its high byte (0 for all of these), no FF FE in front.
    const bytes = Uint8Array.from([...text].flatMap((c) => [c.charCodeAt(0) & 0xff, c.charCodeAt(0) >> 8]));
    await chooseFile(bytes);

    const preview = await screen.findByRole('region', { name: 'File preview' });
    expect(within(preview).getByText('José Peña')).toBeTruthy();
    expect(screen.queryByText(/not text/)).toBeNull();
  });

  it('when a workbook is chosen, then the message says to save it as CSV, and the box no longer says it is reading it', async () => {
    stubImport();
    renderApp(PATH);
    await chooseFile(Uint8Array.from([0x50, 0x4b, 0x03, 0x04, 0x14, 0x00, 0x06, 0x00, 0x08, 0x00]), 'results.xlsx');

    expect(await screen.findByText(/spreadsheet workbook .*save it as CSV/)).toBeTruthy();
    expect(screen.getByText('“results.xlsx” could not be used · choose another')).toBeTruthy();
    expect(screen.queryByText(/Reading “results.xlsx”/)).toBeNull();
  });
});

describe('a sheet with no car numbers', { timeout: 15_000 }, () => {
  it('when the file has driver, run, time and cones columns only, then the rows are found by the driver\'s name, not filtered out by the car\'s number', async () => {
    stubImport();
    renderApp(`/cars/${IDS.car}/import`);
    await chooseFile(['Driver,Run,Time,Cones', 'Maren Holt,1,45.6,0', 'Juno Brack,1,44.9,0', 'Maren Holt,2,45.2,1'].join('\n'));
    await screen.findByRole('region', { name: 'File preview' });

    expect((screen.getByLabelText('Your car number') as HTMLInputElement).value).toBe('');
    expect((screen.getByLabelText('Your name as the sheet spells it') as HTMLInputElement).value).toBe('Maren Holt');
    const chosen = screen.getByRole('list', { name: 'Rows that match' });
    expect(within(chosen).getAllByRole('checkbox').map((c) => c.closest('li')!.textContent)).toEqual([
      expect.stringContaining('Maren Holt'),
      expect.stringContaining('Maren Holt'),
    ]);
  });
});

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { addCoDriver, countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun, postSetup, type Driver } from '../season/season-fixtures';
import { parseSheet } from '../../../shared/import/sheet';
import { guessMapping, rowsToRuns } from '../../../shared/import/mapping';
import { DSQ_NOTE, type ImportResult } from '../../../shared/import/import.schema';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const runsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [carId]);
const importPath = (d: Driver) => `/api/events/${d.eventId}/imports`;
const run = (line: number, runNumber: number, rawTimeSec: number | null, over: Record<string, unknown> = {}) => ({
  line, runNumber, status: 'finished', rawTimeSec, cones: 0, ...over,
});

/** An invented club's long sheet: Nell Ashdown's three runs among others'. */
const SHEET = [
  'Driver,Car #,Class,Run,Time,Cones',
  'Nell Ashdown,42,SS,1,46.210,1',
  'Ivo Parrish,7,SS,1,45.980,0',
  'Nell Ashdown,42,SS,2,45.874,0',
  'Nell Ashdown,42,SS,3,DNF,',
].join('\n');

function nellsRuns() {
  const sheet = parseSheet(SHEET);
  const rows = rowsToRuns(sheet, guessMapping(sheet.header, sheet.shape)).filter((r) => r.carNumber === '42');
  return rows.flatMap((r) => r.runs.map((x) => ({ line: r.line, runNumber: x.runNumber, status: x.status, rawTimeSec: x.rawSec, cones: x.cones })));
}

describe('POST /api/events/:eventId/imports', () => {
  it('when a sheet\'s rows are imported, then their runs are stored for the car at the event, tied to the setup in force', async () => {
    const d = await driverWithCarAndEvent(t);
    const setup = await postSetup(d.c, d.carId, { effectiveFrom: '2026-04-12T07:00:00Z' });
    const res = await d.c.post(importPath(d), { carId: d.carId, runs: nellsRuns() });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ created: 3, alreadyThere: 0, differing: [], failed: [] } satisfies ImportResult);

    const list = await d.c.get(`/api/runs?carId=${d.carId}&eventId=${d.eventId}`);
    const runs = (list.body.items as { runNumber: number; rawTimeSec: number | null; cones: number; status: string; setupId: string; driver: { id: string }; recordedAt: string }[])
      .sort((a, b) => a.runNumber - b.runNumber);
    expect(runs.map((r) => [r.runNumber, r.rawTimeSec, r.cones, r.status])).toEqual([
      [1, 46.21, 1, 'finished'],
      [2, 45.874, 0, 'finished'],
      [3, null, 0, 'dnf'],
    ]);
    expect(runs.every((r) => r.driver.id === d.user.id && r.setupId === setup.id)).toBe(true);
    // Noon UTC on the event's day, one minute per run.
    expect(runs.map((r) => r.recordedAt)).toEqual(['2026-04-12T12:00:00.000Z', '2026-04-12T12:01:00.000Z', '2026-04-12T12:02:00.000Z']);
  });

  it('when the same rows are imported again, then nothing new is stored and every run is "already there"', async () => {
    const d = await driverWithCarAndEvent(t);
    const first = await d.c.post(importPath(d), { carId: d.carId, runs: nellsRuns() });
    expect(first.body.created).toBe(3);
    const again = await d.c.post(importPath(d), { carId: d.carId, runs: nellsRuns() });
    expect(again.status).toBe(200);
    expect(again.body).toEqual({ created: 0, alreadyThere: 3, differing: [], failed: [] });
    expect(await runsOf(d.carId)).toBe(3);
  });

  it('when the sheet gives a logged run another time, cones or result, then the logged run stays as it was and the difference is listed', async () => {
    const d = await driverWithCarAndEvent(t);
    // Logged on the phone: run 1 at 45.678 clean, run 2 at 46.5 clean, run 3 a DNF.
    await postRun(d.c, d.carId, d.eventId, { runNumber: 1, rawTimeSec: 45.678, cones: 0, status: 'finished' });
    await postRun(d.c, d.carId, d.eventId, { runNumber: 2, rawTimeSec: 46.5, cones: 0, status: 'finished' });
    await postRun(d.c, d.carId, d.eventId, { runNumber: 3, rawTimeSec: null, cones: 0, status: 'dnf' });
    const res = await d.c.post(importPath(d), {
      carId: d.carId,
      runs: [
        run(2, 1, 45.123), // another time
        run(3, 2, 46.5, { cones: 1 }), // a cone the phone missed
        run(4, 3, null, { status: 'dnf' }), // the same DNF
        run(5, 4, 47.01), // new
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({
      created: 1,
      alreadyThere: 3,
      differing: [
        { line: 2, runNumber: 1, logged: { status: 'finished', rawTimeSec: 45.678, cones: 0 }, sheet: { status: 'finished', rawTimeSec: 45.123, cones: 0 } },
        { line: 3, runNumber: 2, logged: { status: 'finished', rawTimeSec: 46.5, cones: 0 }, sheet: { status: 'finished', rawTimeSec: 46.5, cones: 1 } },
      ],
      failed: [],
    } satisfies ImportResult);
    const stored = await t.ds.query('SELECT run_number, raw_time_sec, cones FROM runs WHERE car_id = $1 ORDER BY run_number', [d.carId]);
    expect(stored.slice(0, 2)).toEqual([{ run_number: 1, raw_time_sec: 45.678, cones: 0 }, { run_number: 2, raw_time_sec: 46.5, cones: 0 }]);
  });

  it('when one run is bad, then it is listed with its reason and the others import', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.post(importPath(d), {
      carId: d.carId,
      runs: [
        run(2, 1, 46.1),
        run(3, 2, 2400), // over the 30-minute limit
        run(4, 3, null), // finished with no time
        run(5, 1, 45.9), // run 1 twice
        run(6, 4, 47.2, { cones: 2 }),
      ],
    });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.created).toBe(2);
    expect(res.body.alreadyThere).toBe(0);
    expect(res.body.failed).toEqual([
      { line: 3, runNumber: 2, reason: expect.stringContaining('1800') },
      { line: 4, runNumber: 3, reason: 'A finished run needs its time' },
      { line: 5, runNumber: 1, reason: 'Run 1 appears more than once in this import' },
    ]);
    const stored = await t.ds.query('SELECT run_number, raw_time_sec, cones FROM runs WHERE car_id = $1 ORDER BY run_number', [d.carId]);
    expect(stored).toEqual([{ run_number: 1, raw_time_sec: 46.1, cones: 0 }, { run_number: 4, raw_time_sec: 47.2, cones: 2 }]);
  });

  it('when a run was disqualified, then it is kept as a DNF with a note saying so', async () => {
    const d = await driverWithCarAndEvent(t);
    await d.c.post(importPath(d), { carId: d.carId, runs: [run(2, 1, 45.2, { status: 'dsq' })] });
    const [row] = await t.ds.query('SELECT status, raw_time_sec, notes FROM runs WHERE car_id = $1', [d.carId]);
    expect(row).toEqual({ status: 'dnf', raw_time_sec: 45.2, notes: DSQ_NOTE });
  });

  it('when a co-driver is named, then the runs are theirs; a stranger as driver is a field error', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await addCoDriver(t, d);
    const res = await d.c.post(importPath(d), { carId: d.carId, driverId: co.user.id, runs: [run(2, 1, 46)] });
    expect(res.body.created).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE driver_id = $1', [co.user.id])).toBe(1);
    const stranger = await signedInClient(t, { displayName: 'Odile Fenn' });
    expectFieldErrors(await d.c.post(importPath(d), { carId: d.carId, driverId: stranger.user.id, runs: [run(2, 1, 46)] }), ['driverId']);
  });

  it('when the first run time is given in the driver\'s zone, then runs start there; a time on another day is refused', async () => {
    const d = await driverWithCarAndEvent(t);
    const ok = await d.c.post(importPath(d), { carId: d.carId, firstRunAt: '2026-04-12T12:00:00-06:00', runs: [run(2, 2, 46)] });
    expect(ok.body.created).toBe(1);
    const [row] = await t.ds.query('SELECT recorded_at FROM runs WHERE car_id = $1', [d.carId]);
    expect((row.recorded_at as Date).toISOString()).toBe('2026-04-12T18:01:00.000Z');
    expectFieldErrors(await d.c.post(importPath(d), { carId: d.carId, firstRunAt: '2026-05-01T12:00:00Z', runs: [run(2, 3, 46)] }), ['firstRunAt']);
  });

  it('when the body is malformed, then 400 with field errors and nothing stored', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await d.c.post(importPath(d), { carId: d.carId, runs: [] }), ['runs']);
    expectFieldErrors(await d.c.post(importPath(d), { carId: 'nope', runs: [run(2, 1, 46)] }), ['carId']);
    const many = Array.from({ length: 501 }, (_, i) => run(i + 2, i + 1, 46));
    expectFieldErrors(await d.c.post(importPath(d), { carId: d.carId, runs: many }), ['runs']);
    expect(await runsOf(d.carId)).toBe(0);
  });

  it('when another driver imports onto the car, then 404 and nothing is stored', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    expectError(await other.c.post(importPath(other), { carId: d.carId, runs: [run(2, 1, 46)] }), 404, 'not_found');
    // Their own car at an event they cannot see is also not found.
    expectError(await other.c.post(importPath(d), { carId: other.carId, runs: [run(2, 1, 46)] }), 404, 'not_found');
    expect(await runsOf(d.carId)).toBe(0);
    expect(await runsOf(other.carId)).toBe(0);
  });

  it('when the car\'s shop staff import, then 403: they may read the car but not log its runs', async () => {
    const d = await driverWithCarAndEvent(t);
    const staff = await signedInClient(t, { displayName: 'Ren Calloway' });
    const [shop] = await t.ds.query(`INSERT INTO shops (name) VALUES ('Gravel Lane Alignment') RETURNING id`);
    await t.ds.query('INSERT INTO shop_members (shop_id, user_id, is_shop_admin) VALUES ($1, $2, true)', [shop.id, staff.user.id]);
    await t.ds.query('INSERT INTO shop_grants (car_id, shop_id, granted_by) VALUES ($1, $2, $3)', [d.carId, shop.id, d.user.id]);
    expectError(await staff.c.post(importPath(d), { carId: d.carId, runs: [run(2, 1, 46)] }), 403, 'forbidden');
    expect(await runsOf(d.carId)).toBe(0);
  });
});

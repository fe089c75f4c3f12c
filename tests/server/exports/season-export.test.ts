import { randomUUID } from 'node:crypto';
import Papa from 'papaparse';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, makeTestApp, signedInClient, type TestApp } from '../test-app';
import { answerWhileBodyOpen, credentialsOf } from '../open-body';
import { countOf, driverWithCarAndEvent, expectError, postRun, postSetup, setupBody, type Client, type Driver } from '../season/season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

type Rec = Record<string, unknown> & { id: string };
interface SeasonFile {
  format: string;
  version: number;
  exportedAt: string;
  car: Rec;
  setups: Rec[];
  changes: Rec[];
  events: Rec[];
  runs: Rec[];
  pressures: Rec[];
  tyreSets: (Rec & { mountings: Rec[]; readings: Rec[] })[];
}

const ok = (res: { status: number; body: unknown }, status = 201) => {
  expect(res.status, JSON.stringify(res.body)).toBe(status);
  return res.body as Rec;
};

/**
 * A season with every kind of record: two events, three snapshots (one derived by a quick change,
 * one with a note and anti-roll bars), four runs (cones, a DNF, hot pressures), a change-log entry
 * tied to a snapshot, a cold pressure reading, and a tyre set with a rotation and a tread reading
 * at an event.
 */
async function seedSeason(d: Driver) {
  const event2 = ok(await d.c.post('/api/events', {
    name: 'Spring points round 2', date: '2026-05-03', venue: 'Kestrel Lane car park', kind: 'autocross', conePenaltySec: 1,
    surface: 'coarse asphalt', airTempC: 17.5, trackTempC: 24, notes: 'Gusty',
  }));
  const base = await postSetup(d.c, d.carId, { notes: 'As bought', corners: {
    ...setupBody().corners,
    lf: { camberDeg: -1.5, toeMm: -0.5, casterDeg: 6.2, springRateNPerMm: 70, rideHeightMm: 120, damperClicks: 4, damperReboundClicks: 6, coldPressureKpa: 220, cornerWeightKg: 262.5 },
  } });
  const quick = ok(await d.c.post(`/api/cars/${d.carId}/setups/quick-change`, {
    effectiveFrom: '2026-04-12T10:30:00Z',
    changes: [{ field: 'camberDeg', corners: ['lf', 'rf'], delta: -0.3 }],
  }));
  const third = await postSetup(d.c, d.carId, { label: 'Round 2 base', effectiveFrom: '2026-05-01T08:00:00Z', derivedFromId: base.id,
    axles: { front: { antiRollBar: 'hole 3' }, rear: { antiRollBar: null } } });
  await postRun(d.c, d.carId, d.eventId, { runNumber: 1, rawTimeSec: 46.512, recordedAt: '2026-04-12T10:00:00Z', hotPressuresKpa: { lf: 241, rf: 240, lr: 231, rr: 230 } });
  await postRun(d.c, d.carId, d.eventId, { runNumber: 2, rawTimeSec: 45.9, cones: 1, recordedAt: '2026-04-12T11:00:00Z' });
  await postRun(d.c, d.carId, d.eventId, { runNumber: 3, rawTimeSec: null, status: 'dnf', recordedAt: '2026-04-12T12:00:00Z', notes: 'Spun at the slalom' });
  await postRun(d.c, d.carId, event2.id, { runNumber: 1, rawTimeSec: 1.5 * 60 + 2.25, recordedAt: '2026-05-03T10:00:00Z' });
  ok(await d.c.post(`/api/cars/${d.carId}/changes`, { changedOn: '2026-04-30', what: 'Front bar to hole 3', location: 'front', setupId: third.id, notes: 'Less push' }));
  ok(await d.c.post(`/api/cars/${d.carId}/pressures`, { kind: 'cold', takenAt: '2026-04-12T08:00:00Z', corners: { lf: 200, rf: 201, lr: 195 } }));
  const set = ok(await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', size: '205/50R15', boughtOn: '2026-03-01', startTreadMm: 7, notes: 'Scrubbed' }));
  ok(await d.c.post(`/api/tyre-sets/${set.id}/mountings`, { mountedAt: '2026-04-20T07:00:00Z', positions: { lf: 3, rf: 4, lr: 1, rr: 2 } }));
  ok(await d.c.post(`/api/tyre-sets/${set.id}/readings`, {
    takenAt: '2026-04-12T13:00:00Z', eventId: d.eventId, notes: 'After round 1',
    corners: { lf: { innerMm: 5.5, middleMm: 6, outerMm: 5 }, rr: { innerMm: 6.5, middleMm: 6.5, outerMm: 6.4 } },
  }));
  return { base, quick, third, event2 };
}

async function exportJson(c: Client, carId: string): Promise<SeasonFile> {
  const res = await c.get(`/api/cars/${carId}/export.json`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as SeasonFile;
}

/** Fields that name the people or the moment of export, which an import into another account must change. */
const PEOPLE_AND_MOMENT = ['exportedAt', 'recordedBy', 'driverName'];

/**
 * The file with ids replaced by what they point at (an event by its date and name, a snapshot by
 * its time and label, a run by its event and number) and lists sorted, so two files of the same
 * season compare equal whatever ids they were given. Only `id` and PEOPLE_AND_MOMENT are dropped:
 * any other field or record missing from one file makes the two differ.
 */
function canonical(file: SeasonFile) {
  const events = new Map(file.events.map((e) => [e.id, `${String(e.date)} ${String(e.name)}`]));
  const setups = new Map(file.setups.map((s) => [s.id, `${String(s.effectiveFrom)} ${String(s.label)}`]));
  const runs = new Map(file.runs.map((r) => [r.id, `${events.get(r.eventId as string)} #${String(r.runNumber)}`]));
  const deref = (map: Map<string, string>, id: unknown) => (id === null ? null : (map.get(id as string) ?? `DANGLING ${String(id)}`));
  const strip = (o: Record<string, unknown>): Record<string, unknown> =>
    Object.fromEntries(Object.entries(o).filter(([k]) => k !== 'id' && !PEOPLE_AND_MOMENT.includes(k)));
  const sorted = <T,>(list: T[]) => [...list].sort((a, b) => JSON.stringify(a).localeCompare(JSON.stringify(b)));
  const top = strip(file as unknown as Record<string, unknown>);
  return {
    ...top,
    car: strip(file.car),
    setups: sorted(file.setups.map((s) => ({ ...strip(s), derivedFromId: deref(setups, s.derivedFromId) }))),
    changes: sorted(file.changes.map((c) => ({ ...strip(c), setupId: deref(setups, c.setupId) }))),
    events: sorted(file.events.map(strip)),
    runs: sorted(file.runs.map((r) => ({ ...strip(r), eventId: deref(events, r.eventId) }))),
    pressures: sorted(file.pressures.map((p) => ({ ...strip(p), runId: deref(runs, p.runId) }))),
    tyreSets: sorted(
      file.tyreSets.map((s) => ({
        ...strip(s),
        mountings: sorted(s.mountings.map(strip)),
        readings: sorted(s.readings.map((r) => ({ ...strip(r), eventId: deref(events, r.eventId) }))),
      })),
    ),
  };
}

const allIds = (file: SeasonFile) => [
  file.car.id, ...file.setups.map((s) => s.id), ...file.changes.map((c) => c.id), ...file.events.map((e) => e.id), ...file.runs.map((r) => r.id),
  ...file.pressures.map((p) => p.id), ...file.tyreSets.flatMap((s) => [s.id, ...s.mountings.map((m) => m.id), ...s.readings.map((r) => r.id)]),
];

describe('the season round trip: export as one driver, import as another, export again', () => {
  it('when driver B imports driver A\'s JSON, then B\'s new car exports the same season with new ids, B as driver and recorder', async () => {
    const a = await driverWithCarAndEvent(t);
    await seedSeason(a);
    const fileA = await exportJson(a.c, a.carId);
    // The seed made it into the file: the comparison below has something to lose.
    expect([fileA.setups.length, fileA.changes.length, fileA.events.length, fileA.runs.length, fileA.pressures.length, fileA.tyreSets.length]).toEqual([3, 1, 2, 4, 2, 1]);
    expect([fileA.tyreSets[0]!.mountings.length, fileA.tyreSets[0]!.readings.length]).toEqual([2, 1]);
    expect(fileA).toMatchObject({ format: 'scrubline-season', version: 1 });
    expect(fileA).not.toHaveProperty('comments');

    const b = await signedInClient(t, { displayName: 'Ines Varga' });
    const imported = await b.c.post('/api/cars/import', fileA);
    expect(imported.status, JSON.stringify(imported.body)).toBe(201);
    const newCarId = (imported.body as { carId: string }).carId;
    expect(newCarId).not.toBe(a.carId);
    const fileB = await exportJson(b.c, newCarId);

    expect(canonical(fileB)).toEqual(canonical(fileA));
    // Every record is new: no id of A's season reappears.
    const idsA = new Set(allIds(fileA));
    expect(allIds(fileB).filter((id) => idsA.has(id))).toEqual([]);
    // B drove and recorded all of it; A's car is untouched and B's car is B's alone.
    expect(new Set(fileB.runs.map((r) => r.driverName))).toEqual(new Set(['Ines Varga']));
    expect(new Set([...fileB.setups, ...fileB.changes].map((r) => r.recordedBy))).toEqual(new Set(['Ines Varga']));
    const carB = ok(await b.c.get(`/api/cars/${newCarId}`), 200);
    expect(carB.owner).toEqual({ id: b.user.id, displayName: 'Ines Varga' });
    expect(carB.coDrivers).toEqual([]);
    expectError(await a.c.get(`/api/cars/${newCarId}/export.json`), 404, 'not_found');
    // The runs tie to the same snapshots as before (the tie is worked out from the times).
    const tieOf = async (c: Client, carId: string) => {
      const setups = (ok(await c.get(`/api/cars/${carId}/setups`), 200).items as Rec[]);
      const runs = (ok(await c.get(`/api/runs?carId=${carId}`), 200).items as Rec[]);
      return runs.map((r) => `${String(r.recordedAt)} → ${String(setups.find((s) => s.id === r.setupId)?.label)} ${String(r.adjustedTimeSec)}`).sort();
    };
    expect(await tieOf(b.c, newCarId)).toEqual(await tieOf(a.c, a.carId));
  });

  it('when the front dampers are double-adjustable, then the file carries the rebound adjuster, the import restores it, and rebound clicks past it are refused', async () => {
    const a = await driverWithCarAndEvent(t);
    const front = { positions: 12, countFrom: 'full_soft', rebound: { positions: 20, countFrom: 'full_stiff' } };
    ok(await a.c.patch(`/api/cars/${a.carId}`, { version: 1, damperAdjusters: { front } }), 200);
    // 16 rebound clicks: past the front adjuster's 12, within its rebound adjuster's 20.
    await postSetup(a.c, a.carId, { corners: { ...setupBody().corners, lf: { damperClicks: 4, damperReboundClicks: 16 } } });
    const file = await exportJson(a.c, a.carId);
    expect(file.car.damperAdjusters).toEqual({ front, rear: { positions: 12, countFrom: 'full_soft', rebound: null } });

    const b = await signedInClient(t);
    const imported = ok(await b.c.post('/api/cars/import', file));
    expect(ok(await b.c.get(`/api/cars/${String(imported.carId)}`), 200).damperAdjusters).toEqual(file.car.damperAdjusters);

    const tight = structuredClone(file);
    (tight.car.damperAdjusters as { front: typeof front }).front.rebound.positions = 15;
    const res = await b.c.post('/api/cars/import', tight);
    expectError(res, 400, 'validation_failed');
    expect(res.body.error.fieldErrors).toEqual({ 'setups.0.corners.lf.damperReboundClicks': ["The car's adjuster has 15 clicks; use 0 to 15"] });
    expect(await countOf(t, 'SELECT count(*) AS n FROM cars WHERE owner_id = $1', [b.user.id])).toBe(1);
  });

  it('when one field or one record is dropped from a file, then the comparison above tells the files apart', async () => {
    const a = await driverWithCarAndEvent(t);
    await seedSeason(a);
    const file = await exportJson(a.c, a.carId);
    const copy = () => structuredClone(file);
    const lessField = copy();
    delete lessField.runs[1]!.cones;
    const lessRecord = copy();
    lessRecord.tyreSets[0]!.readings.pop();
    const otherLink = copy();
    otherLink.pressures.find((p) => p.runId)!.runId = otherLink.runs.find((r) => r.runNumber === 2)!.id;
    const lessCorner = copy();
    delete (lessCorner.setups[0]!.corners as Record<string, unknown>).lf;
    for (const changed of [lessField, lessRecord, otherLink, lessCorner]) expect(canonical(changed)).not.toEqual(canonical(file));
    expect(canonical(copy())).toEqual(canonical(file));
  });

  it('when two drivers each logged a "run 1" at one event, then the import keeps both, the second numbered after the last and noted', async () => {
    const a = await driverWithCarAndEvent(t);
    const co = await signedInClient(t, { displayName: 'Teo Marsh' });
    ok(await a.c.post(`/api/cars/${a.carId}/co-drivers`, { email: co.email }));
    await postRun(a.c, a.carId, a.eventId, { runNumber: 1, rawTimeSec: 46.1, recordedAt: '2026-04-12T10:00:00Z' });
    await postRun(a.c, a.carId, a.eventId, { runNumber: 2, rawTimeSec: 45.8, recordedAt: '2026-04-12T10:40:00Z' });
    await postRun(co.c, a.carId, a.eventId, { runNumber: 1, rawTimeSec: 47.3, recordedAt: '2026-04-12T10:20:00Z' });
    const file = await exportJson(a.c, a.carId);
    const b = await signedInClient(t);
    const carId = ok(await b.c.post('/api/cars/import', file)).carId as string;
    const runs = (ok(await b.c.get(`/api/runs?carId=${carId}`), 200).items as Rec[]).map((r) => [r.runNumber, r.rawTimeSec, r.notes]);
    expect(runs.sort()).toEqual([
      [1, 46.1, null],
      [2, 45.8, null],
      [3, 47.3, 'Run 1 by Teo Marsh in the imported file.'],
    ]);
  });
});

describe('POST /api/cars/import refuses a bad file with a 400 and writes nothing', () => {
  const carsOf = (userId: string) => countOf(t, 'SELECT count(*) AS n FROM cars WHERE owner_id = $1', [userId]);
  const minimal = (over: Record<string, unknown> = {}) => ({
    format: 'scrubline-season', version: 1,
    car: { id: 'car-1', name: 'Imported roadster', classCode: 'SS' },
    events: [{ id: 'e1', name: 'Round 1', date: '2026-04-12' }],
    runs: [{ id: 'r1', eventId: 'e1', runNumber: 1, rawTimeSec: 45.5, recordedAt: '2026-04-12T10:00:00Z' }],
    ...over,
  });

  it('when the file is not a season file at all, then 400 says so on "format"', async () => {
    const b = await signedInClient(t);
    for (const body of [{ hello: 'world' }, { ...minimal(), format: 'spreadsheet' }]) {
      const res = await b.c.post('/api/cars/import', body);
      expectError(res, 400, 'validation_failed');
      expect(res.body.error.message).toMatch(/not a Scrubline season file/);
      expect(Object.keys(res.body.error.fieldErrors)).toEqual(['format']);
    }
    const arrayBody = await b.c.post('/api/cars/import', [minimal()] as unknown as object);
    expectError(arrayBody, 400, 'validation_failed');
    expect(await carsOf(b.user.id)).toBe(0);
  });

  it('when the file is from a newer version, then 400 names the version this server reads', async () => {
    const b = await signedInClient(t);
    const res = await b.c.post('/api/cars/import', minimal({ version: 2 }));
    expectError(res, 400, 'validation_failed');
    expect(res.body.error.message).toBe('This file was written by a newer Scrubline (file version 2); this one reads version 1.');
    expect(res.body.error.fieldErrors).toEqual({ version: [res.body.error.message] });
  });

  it('when values are out of range or missing, then 400 lists each by its path in the file', async () => {
    const b = await signedInClient(t);
    const res = await b.c.post('/api/cars/import', minimal({
      runs: [{ id: 'r1', eventId: 'e1', runNumber: 1, rawTimeSec: -3, recordedAt: '2026-04-12T10:00:00Z' }],
      setups: [{ id: 's1', label: 'Base', effectiveFrom: '2026-04-01T00:00:00Z', corners: { lf: { camberDeg: 40 } } }],
      tyreSets: [{ id: 't1', label: 'Set A', mountings: [], readings: [{ id: 'x', takenAt: 'yesterday', corners: { lf: { innerMm: 5, middleMm: 5 } } }] }],
    }));
    expectError(res, 400, 'validation_failed');
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual([
      'runs.0.rawTimeSec', 'setups.0.corners.lf.camberDeg', 'tyreSets.0.readings.0.corners.lf.outerMm', 'tyreSets.0.readings.0.takenAt',
    ]);
    expect(await carsOf(b.user.id)).toBe(0);
  });

  it('when records point at nothing or ids repeat, then 400 names each one and nothing is written', async () => {
    const b = await signedInClient(t);
    const res = await b.c.post('/api/cars/import', minimal({
      runs: [
        { id: 'r1', eventId: 'e9', runNumber: 1, rawTimeSec: 45.5, recordedAt: '2026-04-12T10:00:00Z' },
        { id: 'r1', eventId: 'e1', runNumber: 2, rawTimeSec: 45.1, recordedAt: '2026-04-12T10:30:00Z' },
      ],
      setups: [{ id: 's1', label: 'Base', effectiveFrom: '2026-04-01T00:00:00Z', derivedFromId: 's0' }],
      changes: [{ id: 'c1', changedOn: '2026-04-01', what: 'Arms', setupId: 's7' }],
      pressures: [{ id: 'p1', kind: 'hot', takenAt: '2026-04-12T10:00:00Z', runId: 'r5', corners: { lf: 230 } }],
    }));
    expectError(res, 400, 'validation_failed');
    expect(Object.keys(res.body.error.fieldErrors).sort()).toEqual([
      'changes.0.setupId', 'pressures.0.runId', 'runs.0.eventId', 'runs.1.id', 'setups.0.derivedFromId',
    ]);
    expect(await carsOf(b.user.id)).toBe(0);
  });

  it('when a file is larger than the app\'s usual 100 kB, then it imports; above 5 MB it is refused with 413', async () => {
    const b = await signedInClient(t);
    const runs = Array.from({ length: 900 }, (_, i) => ({
      id: `run-${i}`, eventId: 'e1', runNumber: i + 1, rawTimeSec: 45 + i / 1000, cones: i % 3, recordedAt: new Date(Date.UTC(2026, 3, 12, 9, 0, i)).toISOString(),
      notes: 'A long note about the run, to make the file larger than the small body limit of other routes.',
    }));
    const big = minimal({ runs });
    expect(JSON.stringify(big).length).toBeGreaterThan(100 * 1024);
    const res = await b.c.post('/api/cars/import', big);
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(await countOf(t, 'SELECT count(*) AS n FROM runs WHERE car_id = $1', [res.body.carId])).toBe(900);

    const huge = minimal({ car: { id: 'c', name: 'Huge', classCode: 'SS', notes: 'x'.repeat(6 * 1024 * 1024) } });
    expectError(await b.c.post('/api/cars/import', huge), 413, 'payload_too_large');
  });

  it('when nobody is signed in, then 401', async () => {
    const c = client(t.app);
    expectError(await c.post('/api/cars/import', minimal()), 401, 'unauthenticated');
  });

  it('when a large file that never ends comes signed out or without a CSRF token, then 401 or 403 comes while the body is still open', async () => {
    // 256 KiB of a season file, past the app's usual 100 kB, and then nothing more is sent.
    const firstChunk = `{"format":"scrubline-season","version":1,"car":{"id":"c","name":"Huge","classCode":"SS","notes":"${'x'.repeat(256 * 1024)}`;
    const open = (headers: Record<string, string>) =>
      answerWhileBodyOpen(t.app, { path: '/api/cars/import', headers: { ...headers, 'Content-Type': 'application/json' }, firstChunk });

    // A session and a valid token, but nobody signed in.
    const signedOut = await open(await credentialsOf(client(t.app)));
    expect(signedOut).toMatchObject({ status: 401, body: { error: { code: 'unauthenticated' } }, bodyStillOpen: true });
    // Signed in, but no token: the CSRF check refuses it.
    const b = await signedInClient(t);
    const { Cookie } = await credentialsOf(b.c);
    const noToken = await open({ Cookie });
    expect(noToken).toMatchObject({ status: 403, body: { error: { code: 'csrf_invalid' } }, bodyStillOpen: true });
    // Neither cookie nor token.
    expect(await open({})).toMatchObject({ status: 403, bodyStillOpen: true });
    expect(await carsOf(b.user.id)).toBe(0);
    // The same account with its token still imports (the larger files above go the same way).
    expect((await b.c.post('/api/cars/import', minimal())).status).toBe(201);
  });
});

describe('GET /api/cars/:carId/export.csv', () => {
  const parse = (text: string) => {
    expect(text.charCodeAt(0)).toBe(0xfeff);
    const parsed = Papa.parse<Record<string, string>>(text.slice(1), { header: true, skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    return parsed;
  };

  it('when the driver downloads it, then one row per run carries the setup in force at that run, in SI with units in the header', async () => {
    const a = await driverWithCarAndEvent(t);
    const { quick } = await seedSeason(a);
    const res = await a.c.get(`/api/cars/${a.carId}/export.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe('attachment; filename="blue-roadster-season-2026.csv"');
    const { data, meta } = parse(res.text);
    expect(meta.fields!.slice(0, 13)).toEqual([
      'event_date', 'event_name', 'venue', 'run_number', 'driver', 'status', 'raw_time_s', 'cones', 'cone_penalty_s', 'adjusted_time_s',
      'recorded_at', 'setup_label', 'setup_effective_from',
    ]);
    expect(meta.fields).toContain('lf_camber_deg');
    expect(meta.fields).toContain('rr_spring_rate_n_per_mm');
    expect(meta.fields).toContain('lr_cold_pressure_kpa');
    expect(meta.fields).toHaveLength(13 + 4 * 9 + 4);
    expect(meta.fields!.at(-1)).toBe('tyre_set');
    expect(data).toHaveLength(4);
    expect(res.text.split('\r\n').length).toBe(6); // header, 4 rows, and the final line end (RFC 4180 CRLF)

    // Run 2 of round 1 (11:00) ran on the quick change made at 10:30: camber −1.5 − 0.3 = −1.8° at the front.
    const run2 = data.find((r) => r.event_name === 'Spring points round 1' && r.run_number === '2')!;
    const q = quick.corners as Record<string, Record<string, number | null>>;
    expect(run2).toMatchObject({
      event_date: '2026-04-12', venue: 'Harrow Flats airfield', driver: 'Nell Ashdown', status: 'finished',
      raw_time_s: '45.9', cones: '1', cone_penalty_s: '2',
      // Time plus penalties (club rulebooks, "common practice"): 45.9 + 1 × 2 = 47.9.
      adjusted_time_s: '47.9',
      setup_label: quick.label, setup_effective_from: '2026-04-12T10:30:00.000Z',
      lf_camber_deg: String(q.lf!.camberDeg), rf_camber_deg: String(q.rf!.camberDeg), lr_camber_deg: '-1',
      lf_toe_mm: '-0.5', lf_caster_deg: '6.2', lf_spring_rate_n_per_mm: '70', lf_ride_height_mm: '120', lf_clicks: '4',
      lf_rebound_clicks: '6', lf_cold_pressure_kpa: '220', lf_corner_weight_kg: '262.5', rf_caster_deg: '',
      front_anti_roll_bar: 'hole 2', rear_anti_roll_bar: 'disconnected',
    });
    expect(q.lf!.camberDeg).toBe(-1.8);
    // Set A, fitted as bought on 1 March, was on the car for every run.
    expect(new Set(data.map((r) => r.tyre_set))).toEqual(new Set(['Set A']));
    // Run 1 (10:00) was still on the base snapshot; the DNF has no time; round 2 sits on "Round 2 base".
    expect(data.find((r) => r.run_number === '1' && r.event_date === '2026-04-12')).toMatchObject({ setup_label: 'Baseline', lf_camber_deg: '-1.5' });
    expect(data.find((r) => r.run_number === '3')).toMatchObject({ status: 'dnf', raw_time_s: '', adjusted_time_s: '', run_notes: 'Spun at the slalom' });
    expect(data.find((r) => r.event_date === '2026-05-03')).toMatchObject({ raw_time_s: '92.25', setup_label: 'Round 2 base', front_anti_roll_bar: 'hole 3' });
    // Negative numbers stay numbers: no apostrophe, no quotes.
    expect(res.text).toContain(',-1.8,');
  });

  it('when a text cell starts like a formula, then it gets a leading apostrophe; quotes and commas are quoted per RFC 4180', async () => {
    const a = await driverWithCarAndEvent(t);
    const ev = ok(await a.c.post('/api/events', { name: '=HYPERLINK("http://example.com","Results")', date: '2026-06-01', venue: 'Lot "B", north' }));
    await postSetup(a.c, a.carId, { label: '+2 clicks rear', axles: { front: { antiRollBar: '@soft' }, rear: { antiRollBar: '-1 hole' } } });
    await postRun(a.c, a.carId, ev.id as string, { recordedAt: '2026-06-01T10:00:00Z', notes: '\tTab first' });
    const res = await a.c.get(`/api/cars/${a.carId}/export.csv`);
    const row = parse(res.text).data[0]!;
    expect(row).toMatchObject({
      event_name: '\'=HYPERLINK("http://example.com","Results")',
      setup_label: '\'+2 clicks rear',
      front_anti_roll_bar: '\'@soft',
      rear_anti_roll_bar: '\'-1 hole',
      venue: 'Lot "B", north',
      lf_camber_deg: '-1.5',
    });
    expect(row.run_notes).toBe('Tab first'); // notes are trimmed when saved, so the tab never reaches the file
    // No tyre set recorded: the cell is empty, not a guess.
    expect(row.tyre_set).toBe('');
    expect(res.text).toContain('"\'=HYPERLINK(""http://example.com"",""Results"")"');
    expect(res.text).toContain('"Lot ""B"", north"');
  });

  it('when the car has no runs yet, then the file is the header alone, named for this year', async () => {
    const a = await driverWithCarAndEvent(t);
    const res = await a.c.get(`/api/cars/${a.carId}/export.csv`);
    expect(res.status).toBe(200);
    expect(res.headers['content-disposition']).toBe(`attachment; filename="blue-roadster-season-${new Date().getUTCFullYear()}.csv"`);
    expect(parse(res.text).data).toEqual([]);
  });
});

describe('who may download a season', () => {
  it('when another driver asks for either file, then 404, and a co-driver gets both', async () => {
    const a = await driverWithCarAndEvent(t);
    await postRun(a.c, a.carId, a.eventId);
    const other = await signedInClient(t);
    expectError(await other.c.get(`/api/cars/${a.carId}/export.csv`), 404, 'not_found');
    expectError(await other.c.get(`/api/cars/${a.carId}/export.json`), 404, 'not_found');
    expectError(await other.c.get(`/api/cars/${randomUUID()}/export.json`), 404, 'not_found');
    const co = await signedInClient(t);
    ok(await a.c.post(`/api/cars/${a.carId}/co-drivers`, { email: co.email }));
    expect((await co.c.get(`/api/cars/${a.carId}/export.csv`)).status).toBe(200);
    expect((await exportJson(co.c, a.carId)).runs).toHaveLength(1);
  });
});

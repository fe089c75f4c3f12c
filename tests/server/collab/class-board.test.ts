import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { BoardCar, BoardResult, ClassBoard } from '../../../shared/collab/team.schema';
import { client, makeTestApp, signedInClient, type TestApp } from '../test-app';
import { seededDatabaseUrl } from '../support-seeded';
import { expectError, expectFieldErrors, postSetup, setupBody, type Client } from '../season/season-fixtures';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../../server/db/demo-accounts';

/*
 * Scoring on the board, checked against numbers worked by hand from the runs inserted here.
 * Adjusted time = raw + cones × the event's cone penalty: common practice, "time plus
 * penalties" per cone (club autocross rulebooks). Index time = adjusted × the class factor
 * the captain entered. % off = (t − fastest) / fastest × 100. Trend = least-squares slope
 * of % off against event order; for events 1, 2, 3 that is (y₃ − y₁) / 2 (x̄ = 2,
 * Σ(x − x̄)² = 2, and the middle point has x − x̄ = 0).
 */

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

type Person = Awaited<ReturnType<typeof signedInClient>>;

async function carOf(c: Client, name: string, classCode: string) {
  const res = await c.post('/api/cars', { name, classCode, carNumber: name.slice(0, 2) });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.id as string;
}

async function event(createdBy: Person, name: string, date: string, conePenaltySec: number) {
  const rows: { id: string }[] = await t.ds.query(
    'INSERT INTO events (created_by, name, date, cone_penalty_sec) VALUES ($1, $2, $3, $4) RETURNING id',
    [createdBy.user.id, name, date, conePenaltySec],
  );
  return rows[0]!.id;
}

/** Runs at a shared event, straight into the table (the runs API is tested elsewhere). */
async function runs(carId: string, eventId: string, driver: Person, date: string, list: [number | null, number, ('finished' | 'dnf' | 'off_course')?][]) {
  for (const [i, [raw, cones, status]] of list.entries()) {
    await t.ds.query(
      `INSERT INTO runs (id, car_id, event_id, driver_id, run_number, raw_time_sec, cones, status, recorded_at)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9)`,
      [randomUUID(), carId, eventId, driver.user.id, i + 1, raw, cones, status ?? 'finished', `${date}T${10 + i}:00:00Z`],
    );
  }
}

type Depths = [inner: number, middle: number, outer: number];

/** A tread reading on one of the car's tyre sets, straight into the tables (the tyres API is tested elsewhere). */
async function tread(tyreSetId: string, by: Person, takenAt: string, corners: Partial<Record<'lf' | 'rf' | 'lr' | 'rr', Depths>>) {
  const rows: { id: string }[] = await t.ds.query(
    'INSERT INTO tread_readings (tyre_set_id, taken_at, created_by) VALUES ($1, $2, $3) RETURNING id',
    [tyreSetId, takenAt, by.user.id],
  );
  for (const [corner, [inner, middle, outer]] of Object.entries(corners)) {
    await t.ds.query(
      'INSERT INTO tread_reading_corners (reading_id, corner, inner_mm, middle_mm, outer_mm) VALUES ($1, $2, $3, $4, $5)',
      [rows[0]!.id, corner, inner, middle, outer],
    );
  }
}

async function tyreSet(carId: string, label: string) {
  const rows: { id: string }[] = await t.ds.query('INSERT INTO tyre_sets (car_id, label) VALUES ($1, $2) RETURNING id', [carId, label]);
  return rows[0]!.id;
}

const entered = (b: ClassBoard, carId: string): BoardCar => {
  const found = b.classes.flatMap((c) => c.cars).find((c) => c.car.id === carId);
  expect(found, `car ${carId} on the board`).toBeDefined();
  return found!;
};
const at = (car: BoardCar, eventId: string, driverId: string): BoardResult => {
  const found = car.results.find((r) => r.eventId === eventId && r.driver.id === driverId);
  expect(found, `result at ${eventId}`).toBeDefined();
  return found!;
};

/**
 * Team "Late Brakers", season 2025:
 *   Alpha (SR, Ann's, setup shared; Eve, on the team, and Finn, not on it, co-drive it), Bravo (SR, Ben's, results
 *   only), Delta (SH, Dee's, results only).
 *   The captain enters an SR factor of 0.842 and none for SH.
 */
async function scenario() {
  const captain = await signedInClient(t, { displayName: 'Cap Tain' });
  const team = await captain.c.post('/api/teams', { name: 'Late Brakers' });
  expect(team.status).toBe(201);
  const teamId = team.body.id as string;
  const ann = await signedInClient(t, { displayName: 'Ann Apex' });
  const ben = await signedInClient(t, { displayName: 'Ben Braking' });
  const dee = await signedInClient(t, { displayName: 'Dee Drift' });
  const eve = await signedInClient(t, { displayName: 'Eve Early' });
  const finn = await signedInClient(t, { displayName: 'Finn Outsider' });
  for (const p of [ann, ben, dee, eve]) {
    await t.ds.query('INSERT INTO team_members (team_id, user_id) VALUES ($1, $2)', [teamId, p.user.id]);
  }
  const alpha = await carOf(ann.c, 'Alpha', 'SS');
  const bravo = await carOf(ben.c, 'Bravo', 'SS');
  const delta = await carOf(dee.c, 'Delta', 'SH');
  expect((await ann.c.post(`/api/cars/${alpha}/co-drivers`, { email: eve.email })).status).toBe(201);
  expect((await ann.c.post(`/api/cars/${alpha}/co-drivers`, { email: finn.email })).status).toBe(201);
  // Entered in the team's own classes, which need not be the car's.
  for (const [p, carId, classCode, sharing] of [
    [ann, alpha, 'SR', 'results_and_setup'], [ben, bravo, 'SR', 'results'], [dee, delta, 'SH', 'results'],
  ] as const) {
    const res = await p.c.post(`/api/teams/${teamId}/entries`, { carId, classCode, sharing });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
  }
  expect((await captain.c.put(`/api/teams/${teamId}/factors`, { season: 2025, classCode: 'SR', factor: 0.842 })).status).toBe(200);

  // Setups. Alpha's: a baseline, the change in force at event 3, and one after the season's last event.
  await postSetup(ann.c, alpha, { label: 'Alpha baseline', effectiveFrom: '2025-03-01T00:00:00Z' });
  await postSetup(ann.c, alpha, {
    label: 'After camber change',
    effectiveFrom: '2025-05-20T00:00:00Z',
    corners: {
      lf: { camberDeg: -2.0, springRateNPerMm: 40, damperClicks: 5, coldPressureKpa: 200 },
      rf: { camberDeg: -2.2, springRateNPerMm: 42, damperClicks: 6, coldPressureKpa: 204 },
      lr: { camberDeg: -1.5, springRateNPerMm: 30, damperClicks: 7, coldPressureKpa: 190 },
      rr: { camberDeg: -1.5, springRateNPerMm: 30, damperClicks: 7, coldPressureKpa: 190 },
    },
  });
  await postSetup(ann.c, alpha, { label: 'Winter storage', effectiveFrom: '2025-10-01T00:00:00Z' });
  // Bravo's setup has values that must never appear on the board.
  const secret = { camberDeg: -3.33, springRateNPerMm: 77.7, damperClicks: 13, coldPressureKpa: 211.1 };
  await postSetup(ben.c, bravo, {
    ...setupBody(),
    label: 'Secret sauce',
    effectiveFrom: '2025-03-01T00:00:00Z',
    corners: { lf: secret, rf: secret, lr: secret, rr: secret },
  });

  const e1 = await event(ann, 'Round 1', '2025-04-06', 2);
  const e2 = await event(ann, 'Round 2', '2025-05-04', 2);
  const e3 = await event(ann, 'Round 3', '2025-06-01', 1);
  const e0 = await event(dee, 'Last year\'s final', '2024-09-14', 2);

  // Round 1, 2 s a cone.
  // Alpha/Ann: 50.000+1 → 52.000; 51.000 clean → 51.000; 49.500+2 → 53.500. Best raw 49.500 (cones ignored), best adjusted 51.000.
  await runs(alpha, e1, ann, '2025-04-06', [[50.0, 1], [51.0, 0], [49.5, 2]]);
  // Bravo/Ben: 50.200 clean; DNF; 49.900+1 → 51.900. Best raw 49.900, best adjusted 50.200 (class fastest).
  await runs(bravo, e1, ben, '2025-04-06', [[50.2, 0], [null, 0, 'dnf'], [49.9, 1]]);
  // Delta/Dee: 55.000 clean, alone in SH.
  await runs(delta, e1, dee, '2025-04-06', [[55.0, 0]]);
  // Round 2, 2 s a cone. Alpha/Ann 48.000; Alpha/Eve 48.300; Bravo/Ben 48.600.
  await runs(alpha, e2, ann, '2025-05-04', [[48.0, 0]]);
  await runs(alpha, e2, eve, '2025-05-04', [[48.3, 0], [null, 0, 'off_course']]);
  // Finn, who co-drives Alpha but is not on the team, is the quickest of the day: 47.700.
  await runs(alpha, e2, finn, '2025-05-04', [[47.7, 0]]);
  await runs(bravo, e2, ben, '2025-05-04', [[48.6, 0]]);
  // Round 3, 1 s a cone. Alpha/Ann: 47.200+1 → 48.200 (with 2 s it would be 49.200, slower than the clean 48.500); 48.500.
  await runs(alpha, e3, ann, '2025-06-01', [[47.2, 1], [48.5, 0]]);
  // Bravo/Ben: 48.400 clean.
  await runs(bravo, e3, ben, '2025-06-01', [[48.4, 0]]);
  // The season before: Delta only.
  await runs(delta, e0, dee, '2024-09-14', [[57.0, 0]]);

  // Tread. Alpha: an older set read in April; the race set read in full on 1 June, its fronts alone on 30 August,
  // and in full again the next February (after the 2025 season).
  const alphaOld = await tyreSet(alpha, 'Alpha old set');
  const alphaRace = await tyreSet(alpha, 'Alpha race set');
  await tread(alphaOld, ann, '2025-04-06T12:00:00Z', { lf: [7, 7, 7], rf: [7, 7, 7], lr: [7, 7, 7], rr: [7, 7, 7] });
  await tread(alphaRace, ann, '2025-06-01T15:00:00Z', {
    lf: [6.5, 6.5, 6.5], rf: [6.5, 6.5, 6.5], lr: [6.0, 6.0, 6.0], rr: [6.2, 6.1, 6.0],
  });
  await tread(alphaRace, ann, '2025-08-30T16:00:00Z', { lf: [5.0, 5.4, 5.6], rf: [4.8, 5.2, 5.0] });
  await tread(alphaRace, ann, '2026-02-01T12:00:00Z', { lf: [2, 2, 2], rf: [2, 2, 2], lr: [2, 2, 2], rr: [2, 2, 2] });
  // Bravo's tread must never appear on the board.
  await tread(await tyreSet(bravo, 'Bravo set'), ben, '2025-06-01T15:00:00Z', {
    lf: [3.33, 3.33, 3.33], rf: [3.33, 3.33, 3.33], lr: [3.33, 3.33, 3.33], rr: [3.33, 3.33, 3.33],
  });

  return { captain, teamId, ann, ben, dee, eve, finn, alpha, bravo, delta, e0, e1, e2, e3 };
}

let s: Awaited<ReturnType<typeof scenario>>;
let board: ClassBoard;
beforeAll(async () => {
  s = await scenario();
  const res = await s.captain.c.get(`/api/teams/${s.teamId}/board?season=2025`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  board = res.body as ClassBoard;
}, 60_000);

describe('GET /api/teams/:teamId/board', () => {
  it('when the captain reads 2025, then cars are grouped by their entered class with the class factor (SR 0.842, SH none)', () => {
    expect(board.team).toEqual({ id: s.teamId, name: 'Late Brakers', isCaptain: true });
    expect(board.season).toBe(2025);
    expect(board.classes.map((c) => [c.classCode, c.factor, c.cars.map((x) => x.car.name)])).toEqual([
      ['SH', null, ['Delta']],
      ['SR', 0.842, ['Alpha', 'Bravo']],
    ]);
    expect(entered(board, s.alpha).owner).toEqual({ id: s.ann.user.id, displayName: 'Ann Apex' });
  });

  it('when runs have cones, then best raw ignores them and best adjusted adds the event\'s penalty per cone', () => {
    const alpha = entered(board, s.alpha);
    const bravo = entered(board, s.bravo);
    expect(at(alpha, s.e1, s.ann.user.id)).toMatchObject({ eventName: 'Round 1', date: '2025-04-06', bestRawSec: 49.5, bestAdjustedSec: 51.0 });
    expect(at(bravo, s.e1, s.ben.user.id)).toMatchObject({ bestRawSec: 49.9, bestAdjustedSec: 50.2 });
    // Round 3 has a 1 s penalty: 47.200 + 1 × 1 = 48.200 beats the clean 48.500.
    expect(at(alpha, s.e3, s.ann.user.id)).toMatchObject({ bestRawSec: 47.2, bestAdjustedSec: 48.2 });
  });

  it('when the best raw time had cones, then the line carries its cone count, so it reads apart from the adjusted time\'s run', () => {
    // Round 1: Alpha's best raw 49.500 had 2 cones (adjusted 51.000 came from the clean 51.000); Bravo's 49.900 had 1.
    expect(at(entered(board, s.alpha), s.e1, s.ann.user.id)).toMatchObject({ bestRawSec: 49.5, bestRawCones: 2 });
    expect(at(entered(board, s.bravo), s.e1, s.ben.user.id)).toMatchObject({ bestRawSec: 49.9, bestRawCones: 1 });
    // A clean best raw has 0 cones.
    expect(at(entered(board, s.delta), s.e1, s.dee.user.id)).toMatchObject({ bestRawSec: 55, bestRawCones: 0 });
    // The runs of each line, by how they ended: Bravo's DNF at Round 1, Eve's off course at Round 2.
    expect(at(entered(board, s.bravo), s.e1, s.ben.user.id).runs).toEqual({ finished: 2, dnf: 1, offCourse: 0 });
    expect(at(entered(board, s.alpha), s.e2, s.eve.user.id).runs).toEqual({ finished: 1, dnf: 0, offCourse: 1 });
  });

  it('when every run of a day was DNF or off course, then the line has no times and says how its runs ended', async () => {
    const e = await event(s.dee, 'Wet round', '2023-05-07', 2);
    await runs(s.delta, e, s.dee, '2023-05-07', [[null, 0, 'dnf'], [null, 0, 'dnf']]);
    await runs(s.alpha, e, s.ann, '2023-05-07', [[null, 0, 'dnf'], [null, 0, 'off_course']]);
    const b = (await s.captain.c.get(`/api/teams/${s.teamId}/board?season=2023`)).body as ClassBoard;
    expect(at(entered(b, s.delta), e, s.dee.user.id)).toMatchObject({
      runs: { finished: 0, dnf: 2, offCourse: 0 }, bestRawSec: null, bestRawCones: null, bestAdjustedSec: null, rankInClass: null,
    });
    expect(at(entered(b, s.alpha), e, s.ann.user.id)).toMatchObject({ runs: { finished: 0, dnf: 1, offCourse: 1 }, bestAdjustedSec: null });
  });

  it('when a class has a factor, then index = adjusted × factor; without one, index is null', () => {
    // 51.000 × 0.842 = 42.942; 50.200 × 0.842 = 42.2684 → 42.268 (to the millisecond).
    expect(at(entered(board, s.alpha), s.e1, s.ann.user.id).indexSec).toBeCloseTo(42.942, 9);
    expect(at(entered(board, s.bravo), s.e1, s.ben.user.id).indexSec).toBeCloseTo(42.268, 9);
    expect(at(entered(board, s.delta), s.e1, s.dee.user.id).indexSec).toBeNull();
  });

  it('when drivers meet at an event, then each line has its % off the class\'s fastest and its rank in class', () => {
    const alpha = entered(board, s.alpha);
    const bravo = entered(board, s.bravo);
    // Round 1, SR fastest 50.200 (Bravo): Alpha (51.000 − 50.200) / 50.200 × 100 = 1.5936 %, 2nd.
    expect(at(bravo, s.e1, s.ben.user.id)).toMatchObject({ pctOffClassFastest: 0, rankInClass: 1 });
    expect(at(alpha, s.e1, s.ann.user.id).pctOffClassFastest).toBeCloseTo((0.8 / 50.2) * 100, 9);
    expect(at(alpha, s.e1, s.ann.user.id).rankInClass).toBe(2);
    // Round 2, SR fastest 48.000 (Ann in Alpha): Eve in Alpha 0.300 / 48 × 100 = 0.625 %, 2nd; Bravo 0.600 / 48 × 100 = 1.25 %, 3rd.
    expect(at(alpha, s.e2, s.ann.user.id)).toMatchObject({ pctOffClassFastest: 0, rankInClass: 1 });
    expect(at(alpha, s.e2, s.eve.user.id).pctOffClassFastest).toBeCloseTo(0.625, 9);
    expect(at(alpha, s.e2, s.eve.user.id).rankInClass).toBe(2);
    expect(at(bravo, s.e2, s.ben.user.id).pctOffClassFastest).toBeCloseTo(1.25, 9);
    expect(at(bravo, s.e2, s.ben.user.id).rankInClass).toBe(3);
    // Round 3, SR fastest 48.200 (Alpha): Bravo 0.200 / 48.2 × 100 = 0.41494 %.
    expect(at(bravo, s.e3, s.ben.user.id).pctOffClassFastest).toBeCloseTo((0.2 / 48.2) * 100, 9);
    // Delta is alone in SH: a time with nothing to compare it with has no rank and no % off, and says why.
    expect(at(entered(board, s.delta), s.e1, s.dee.user.id)).toMatchObject({ pctOffClassFastest: null, rankInClass: null, aloneInClass: true });
    expect(at(bravo, s.e1, s.ben.user.id).aloneInClass).toBe(false);
    // Results run in event order, one line per driver.
    expect(alpha.results.map((r) => [r.eventName, r.driver.displayName])).toEqual([
      ['Round 1', 'Ann Apex'], ['Round 2', 'Ann Apex'], ['Round 2', 'Eve Early'], ['Round 3', 'Ann Apex'],
    ]);
  });

  it('when a car\'s co-driver is not on the team, then their runs are not on the board and count in no rank; once they join, they are', async () => {
    const alpha = entered(board, s.alpha);
    // Finn's 47.700 at Round 2 would have been the class's fastest; Ann's 48.000 stays first at 0 %.
    expect(alpha.results.some((r) => r.driver.id === s.finn.user.id)).toBe(false);
    expect(JSON.stringify(board)).not.toContain('Finn Outsider');
    expect(at(alpha, s.e2, s.ann.user.id)).toMatchObject({ pctOffClassFastest: 0, rankInClass: 1 });

    await t.ds.query('INSERT INTO team_members (team_id, user_id) VALUES ($1, $2)', [s.teamId, s.finn.user.id]);
    try {
      const joined = (await s.captain.c.get(`/api/teams/${s.teamId}/board?season=2025`)).body as ClassBoard;
      const line = at(entered(joined, s.alpha), s.e2, s.finn.user.id);
      expect(line).toMatchObject({ bestAdjustedSec: 47.7, pctOffClassFastest: 0, rankInClass: 1 });
      // (48.000 − 47.700) / 47.700 × 100 = 0.62893 %: Ann is second now.
      expect(at(entered(joined, s.alpha), s.e2, s.ann.user.id).pctOffClassFastest).toBeCloseTo((0.3 / 47.7) * 100, 9);
    } finally {
      await t.ds.query('DELETE FROM team_members WHERE team_id = $1 AND user_id = $2', [s.teamId, s.finn.user.id]);
    }
  });

  it('when a car closes in or falls back, then its trend is the least-squares slope of its best % off per event', () => {
    // Alpha: events 1, 2, 3 at 1.5936 %, 0 % (Ann's 0 beats Eve's 0.625), 0 % → slope (0 − 1.5936) / 2 = −0.7968 % per event.
    expect(entered(board, s.alpha).trendPctPerEvent).toBeCloseTo(-((0.8 / 50.2) * 100) / 2, 9);
    // Bravo: 0 %, 1.25 %, 0.41494 % → slope (0.41494 − 0) / 2 = +0.20747 % per event (falling back).
    expect(entered(board, s.bravo).trendPctPerEvent).toBeCloseTo(((0.2 / 48.2) * 100) / 2, 9);
    // Delta ran one event in 2025: no trend.
    expect(entered(board, s.delta).trendPctPerEvent).toBeNull();
  });

  it('when a member shares setups, then the board shows the snapshot in force at the car\'s latest event, as axle averages', () => {
    // At Round 3 (1 June) "After camber change" (from 20 May) is in force; "Winter storage" (October) is not.
    expect(entered(board, s.alpha).setup).toEqual({
      label: 'After camber change',
      effectiveFrom: '2025-05-20T00:00:00.000Z',
      frontCamberDeg: -2.1, // (−2.0 + −2.2) / 2
      rearCamberDeg: -1.5,
      frontSpringNPerMm: 41, // (40 + 42) / 2
      rearSpringNPerMm: 30,
      frontClicks: 5.5, // (5 + 6) / 2
      rearClicks: 7,
      frontColdKpa: 202, // (200 + 204) / 2
      rearColdKpa: 190,
    });
  });

  it('when a member shares setups, then the board shows each axle\'s latest tread reading of the season as means over its two corners', () => {
    // Front: 30 August, the latest reading with both fronts (the February one is after the 2025 season).
    //   depth (5.0 + 5.4 + 5.6 + 4.8 + 5.2 + 5.0) / 6 = 31 / 6 = 5.166667 mm; inner − outer ((5.0 − 5.6) + (4.8 − 5.0)) / 2 = −0.4 mm.
    // Rear: 1 June, since the August reading has no rears.
    //   depth (6.0 × 3 + 6.2 + 6.1 + 6.0) / 6 = 36.3 / 6 = 6.05 mm; inner − outer ((6.0 − 6.0) + (6.2 − 6.0)) / 2 = 0.1 mm.
    const wear = entered(board, s.alpha).wear;
    expect(wear?.front?.takenAt).toBe('2025-08-30T16:00:00.000Z');
    expect(wear?.front?.meanDepthMm).toBeCloseTo(31 / 6, 6);
    expect(wear?.front?.innerMinusOuterMm).toBeCloseTo(-0.4, 6);
    expect(wear?.rear?.takenAt).toBe('2025-06-01T15:00:00.000Z');
    expect(wear?.rear?.meanDepthMm).toBeCloseTo(6.05, 6);
    expect(wear?.rear?.innerMinusOuterMm).toBeCloseTo(0.1, 6);
  });

  it('when the season asked for is over, then a later reading shows only on the later season\'s board', async () => {
    const next = (await s.ann.c.get(`/api/teams/${s.teamId}/board?season=2026`)).body as ClassBoard;
    expect(entered(next, s.alpha).wear).toEqual({
      front: { meanDepthMm: 2, innerMinusOuterMm: 0, takenAt: '2026-02-01T12:00:00.000Z' },
      rear: { meanDepthMm: 2, innerMinusOuterMm: 0, takenAt: '2026-02-01T12:00:00.000Z' },
    });
  });

  it('when a member shares results only, then the board carries none of their setup values or tread', () => {
    const bravo = entered(board, s.bravo);
    expect(bravo.sharing).toBe('results');
    expect(bravo.setup).toBeNull();
    expect(bravo.wear).toBeNull();
    const json = JSON.stringify(board);
    for (const value of ['Secret sauce', '-3.33', '77.7', '211.1', '3.33']) expect(json).not.toContain(value);
    expect(entered(board, s.delta).setup).toBeNull();
    expect(entered(board, s.delta).wear).toBeNull();
  });

  it('when a member reads the board, then they see what the captain sees', async () => {
    const res = await s.ben.c.get(`/api/teams/${s.teamId}/board?season=2025`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ...board, team: { ...board.team, isCaptain: false } });
  });

  it('when no season is given, then the latest season with runs by entered cars is shown; another season shows its own events', async () => {
    const latest = await s.dee.c.get(`/api/teams/${s.teamId}/board`);
    expect(latest.body.season).toBe(2025);
    const before = (await s.dee.c.get(`/api/teams/${s.teamId}/board?season=2024`)).body as ClassBoard;
    expect(before.classes.find((c) => c.classCode === 'SR')!.factor).toBeNull();
    expect(entered(before, s.delta).results).toEqual([
      expect.objectContaining({ eventId: s.e0, bestAdjustedSec: 57, indexSec: null, pctOffClassFastest: null, rankInClass: null, aloneInClass: true }),
    ]);
    expect(entered(before, s.alpha).results).toEqual([]);
    expect(entered(before, s.alpha).setup).toBeNull();
  });

  it('when a team has no runs yet, then the board is for the current year with its cars and no results', async () => {
    const captain = await signedInClient(t);
    const teamId = (await captain.c.post('/api/teams', { name: 'Fresh' })).body.id as string;
    const carId = await carOf(captain.c, 'New car', 'SR');
    await captain.c.post(`/api/teams/${teamId}/entries`, { carId, classCode: 'SR', sharing: 'results_and_setup' });
    const res = await captain.c.get(`/api/teams/${teamId}/board`);
    expect(res.body).toEqual({
      team: { id: teamId, name: 'Fresh', isCaptain: true },
      season: new Date().getUTCFullYear(),
      classes: [{ classCode: 'SR', factor: null, cars: [expect.objectContaining({ results: [], trendPctPerEvent: null, setup: null, wear: null })] }],
    });
  });

  it('when an outsider or another team\'s captain asks, then 404; a bad season is 400', async () => {
    const outsider = await signedInClient(t);
    const other = await signedInClient(t);
    await other.c.post('/api/teams', { name: 'Rivals' });
    expectError(await outsider.c.get(`/api/teams/${s.teamId}/board`), 404, 'not_found');
    expectError(await other.c.get(`/api/teams/${s.teamId}/board?season=2025`), 404, 'not_found');
    expectFieldErrors(await s.captain.c.get(`/api/teams/${s.teamId}/board?season=1066`), ['season']);
  });

  it('when more cars are entered, then the board takes the same number of queries (no query per car)', async () => {
    const countQueries = async (c: Client, teamId: string) => {
      const spy = vi.spyOn(t.ds, 'query');
      try {
        const res = await c.get(`/api/teams/${teamId}/board?season=2025`);
        expect(res.status).toBe(200);
        return spy.mock.calls.length;
      } finally {
        spy.mockRestore();
      }
    };
    // A one-car team, sharing its setup, against the three-car team above.
    const solo = await signedInClient(t);
    const teamId = (await solo.c.post('/api/teams', { name: 'Solo' })).body.id as string;
    const carId = await carOf(solo.c, 'Lonely', 'SR');
    await solo.c.post(`/api/teams/${teamId}/entries`, { carId, classCode: 'SR', sharing: 'results_and_setup' });
    await postSetup(solo.c, carId, { effectiveFrom: '2025-01-01T00:00:00Z' });
    await runs(carId, await event(solo, 'Solo round', '2025-04-06', 2), solo, '2025-04-06', [[50, 0]]);

    await tread(await tyreSet(carId, 'Solo set'), solo, '2025-04-06T12:00:00Z', { lf: [5, 5, 5], rf: [5, 5, 5] });
    // A second car sharing its setup and tread on the three-car team: a query per sharing car would show.
    const second = await carOf(s.ann.c, 'Alpha two', 'SH');
    expect((await s.ann.c.post(`/api/teams/${s.teamId}/entries`, { carId: second, classCode: 'SH', sharing: 'results_and_setup' })).status).toBe(201);
    await tread(await tyreSet(second, 'Second set'), s.ann, '2025-04-06T12:00:00Z', { lr: [4, 4, 4], rr: [4, 4, 4] });

    const one = await countQueries(solo.c, teamId);
    const four = await countQueries(s.captain.c, s.teamId);
    try {
      expect(four).toBe(one);
      expect(four).toBeLessThanOrEqual(11);
    } finally {
      await s.ann.c.delete(`/api/teams/${s.teamId}/entries/${second}`);
    }
  });
});

describe('the demo team\'s board', () => {
  let demo: { url: string; drop: () => Promise<void> };
  let app: TestApp;
  beforeAll(async () => {
    demo = await seededDatabaseUrl();
    app = await makeTestApp({ databaseUrl: demo.url });
  }, 120_000);
  afterAll(async () => {
    await app?.close();
    await demo?.drop();
  });

  it('when the captain reads 2026, then Gooseberry and Pebble (SR) and Biscuit Tin (SH) have results, and only Pebble\'s setup is shown', async () => {
    const c = client(app.app);
    expect((await c.post('/api/auth/login', { email: DEMO_ACCOUNTS.captain.email, password: DEMO_PASSWORD })).status).toBe(200);
    const teams = await c.get('/api/teams/mine');
    expect(teams.body.items).toEqual([{ id: expect.any(String), name: 'Gravel Pit Irregulars', isCaptain: true }]);
    const res = await c.get(`/api/teams/${teams.body.items[0].id}/board?season=2026`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const b = res.body as ClassBoard;
    expect(b.classes.map((x) => [x.classCode, x.factor, x.cars.map((car) => [car.car.name, car.sharing])])).toEqual([
      ['SH', 0.815, [['Biscuit Tin', 'results']]],
      ['SR', 0.842, [['Gooseberry', 'results'], ['Pebble', 'results_and_setup']]],
    ]);
    const biscuit = entered(b, b.classes[0]!.cars[0]!.car.id);
    const [gooseberry, pebble] = b.classes[1]!.cars;
    // Eight events: Pebble has Maren each time (Teo co-drives it but is not on the team), Biscuit Tin has Priya.
    expect(pebble!.results).toHaveLength(8);
    expect(pebble!.results.every((r) => r.driver.displayName === DEMO_ACCOUNTS.driver.displayName)).toBe(true);
    expect(biscuit!.results).toHaveLength(8);
    expect(pebble!.setup).toMatchObject({ frontCamberDeg: -2.4 }); // the camber arms are on by the last event
    expect(biscuit!.setup).toBeNull();
    expect(gooseberry!.setup).toBeNull();

    // Two cars in SR: at each event one of them is the class's fastest (rank 1, 0 % off) and the other is off it.
    // Gooseberry leads the spring, Pebble the rounds after its camber arms (12 June).
    const leaders = [...new Set(pebble!.results.map((r) => r.date))].map((date) => {
      const lines = [...pebble!.results, ...gooseberry!.results].filter((r) => r.date === date);
      const first = lines.filter((r) => r.rankInClass === 1);
      expect(first, date).toHaveLength(1);
      expect(first[0]!.pctOffClassFastest).toBe(0);
      for (const r of lines) if (r !== first[0]) expect(r.pctOffClassFastest!, date).toBeGreaterThan(0);
      return gooseberry!.results.includes(first[0]!) ? 'Gooseberry' : 'Pebble';
    });
    expect(leaders).toEqual([...Array(4).fill('Gooseberry'), ...Array(4).fill('Pebble')]);

    // One line checked against the stored runs: Maren's best adjusted at the first event, 2 s a cone.
    const rows: { raw_time_sec: number; cones: number }[] = await app.ds.query(
      `SELECT r.raw_time_sec, r.cones FROM runs r JOIN cars c ON c.id = r.car_id JOIN events e ON e.id = r.event_id
        JOIN users u ON u.id = r.driver_id
       WHERE c.name = 'Pebble' AND e.date = '2026-04-12' AND u.email = $1 AND r.status = 'finished'`,
      [DEMO_ACCOUNTS.driver.email],
    );
    const expected = Math.min(...rows.map((r) => Math.round((r.raw_time_sec + r.cones * 2) * 1000) / 1000));
    const first = pebble!.results.find((r) => r.date === '2026-04-12' && r.driver.displayName === DEMO_ACCOUNTS.driver.displayName)!;
    expect(first.bestAdjustedSec).toBeCloseTo(expected, 9);
    expect(first.indexSec).toBeCloseTo(Math.round(expected * 0.842 * 1000) / 1000, 9);
  });
});

describe('a time stored before times had to be 0.001 s or more', () => {
  it('when a car\'s best at an event rounds to 0 s, then the board still loads, that line ranks first, and nobody has a % off a fastest of 0 s', async () => {
    const e = await event(s.ann, 'Winter test', '2024-02-04', 2);
    await runs(s.alpha, e, s.ann, '2024-02-04', [[1e-300, 0]]);
    await runs(s.bravo, e, s.ben, '2024-02-04', [[50, 0]]);

    const res = await s.captain.c.get(`/api/teams/${s.teamId}/board?season=2024`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    const b = res.body as ClassBoard;
    expect(at(entered(b, s.alpha), e, s.ann.user.id)).toMatchObject({ bestAdjustedSec: 0, pctOffClassFastest: null, rankInClass: 1 });
    expect(at(entered(b, s.bravo), e, s.ben.user.id)).toMatchObject({ bestAdjustedSec: 50, pctOffClassFastest: null, rankInClass: 2 });
  });
});

import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { TeamEntity, TeamMemberEntity } from '../../../server/features/teams/team.entity';
import { addCoDriver, anonymous, countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun, runBody } from './season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const eventsBy = (userId: string) => countOf(t, 'SELECT count(*) AS n FROM events WHERE created_by = $1', [userId]);
const event = (over: Record<string, unknown> = {}) => ({ name: 'Club sprint', date: '2026-06-12', ...over });

describe('POST /api/events', () => {
  it('when only name and date are sent, then 201 with autocross and the 2 s cone penalty by default', async () => {
    const { c, user } = await signedInClient(t);
    const res = await c.post('/api/events', event());
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toEqual({
      id: expect.any(String),
      name: 'Club sprint',
      date: '2026-06-12',
      venue: null,
      kind: 'autocross',
      conePenaltySec: 2,
      surface: null,
      airTempC: null,
      trackTempC: null,
      notes: null,
      teamId: null,
      createdBy: user.id,
      createdAt: expect.any(String),
    });
    expect((await c.get(`/api/events/${res.body.id}`)).body).toEqual(res.body);
  });

  it('when every field is given, then they are stored', async () => {
    const { c } = await signedInClient(t);
    const res = await c.post('/api/events', event({ venue: 'Harrow Flats', kind: 'track_day', conePenaltySec: 0, surface: 'concrete', airTempC: -5, trackTempC: 41.5, notes: 'Windy' }));
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body).toMatchObject({ kind: 'track_day', conePenaltySec: 0, surface: 'concrete', airTempC: -5, trackTempC: 41.5 });
  });

  it('when name and date are missing or malformed, then 400 names them and nothing is written', async () => {
    const { c, user } = await signedInClient(t);
    expectFieldErrors(await c.post('/api/events', { venue: 'X' }), ['name', 'date']);
    expectFieldErrors(await c.post('/api/events', event({ date: '12/06/2026' })), ['date']);
    expectFieldErrors(await c.post('/api/events', event({ name: '   ' })), ['name']);
    expect(await eventsBy(user.id)).toBe(0);
  });

  it('when the cone penalty, temperatures or kind are out of range, then 400 at each field', async () => {
    const { c, user } = await signedInClient(t);
    expectFieldErrors(await c.post('/api/events', event({ conePenaltySec: -1, airTempC: 91, trackTempC: -41, kind: 'rally' })), [
      'conePenaltySec', 'airTempC', 'trackTempC', 'kind',
    ]);
    expectFieldErrors(await c.post('/api/events', event({ conePenaltySec: 61 })), ['conePenaltySec']);
    expect(await eventsBy(user.id)).toBe(0);
  });

  it('when a field is unknown, then 400 "Unknown field"', async () => {
    const { c, user } = await signedInClient(t);
    expect(expectFieldErrors(await c.post('/api/events', event({ createdBy: randomUUID() })), ['createdBy']).createdBy).toEqual(['Unknown field']);
    expect(await eventsBy(user.id)).toBe(0);
  });

  it('when the team is not one the driver belongs to, then 400 on teamId; a member may tag it', async () => {
    const { c, user } = await signedInClient(t);
    const team = await t.ds.getRepository(TeamEntity).save({ name: `Team ${randomUUID().slice(0, 6)}` });
    expectFieldErrors(await c.post('/api/events', event({ teamId: team.id })), ['teamId']);
    expect(await eventsBy(user.id)).toBe(0);
    await t.ds.getRepository(TeamMemberEntity).save({ teamId: team.id, userId: user.id, isCaptain: false });
    const res = await c.post('/api/events', event({ teamId: team.id }));
    expect(res.status).toBe(201);
    expect(res.body.teamId).toBe(team.id);
  });
});

describe('GET /api/events and /api/events/:eventId', () => {
  it('when a driver lists events, then { items, count }, newest date first, without other drivers’ events', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    const later = await d.c.post('/api/events', event({ date: '2026-09-01' }));
    const res = await d.c.get('/api/events');
    expect(res.status).toBe(200);
    expect(res.body.count).toBe(2);
    expect(res.body.items.map((e: { id: string }) => e.id)).toEqual([later.body.id, d.eventId]);
    expect(res.body.items.map((e: { id: string }) => e.id)).not.toContain(other.eventId);
  });

  it('when another driver asks for the event, then 404; a co-driver of the creator’s car sees it', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await signedInClient(t);
    expectError(await other.c.get(`/api/events/${d.eventId}`), 404, 'not_found');
    expect((await other.c.get('/api/events')).body).toEqual({ items: [], count: 0 });
    const co = await addCoDriver(t, d);
    expect((await co.c.get(`/api/events/${d.eventId}`)).status).toBe(200);
    expect((await co.c.get('/api/events')).body.items.map((e: { id: string }) => e.id)).toEqual([d.eventId]);
  });

  it('when someone is added as a co-driver, then the car\'s drivers see the events they make from then on, never the ones they made before', async () => {
    const owner = await driverWithCarAndEvent(t);
    const other = await signedInClient(t, { displayName: 'Nell Kirby' });
    const before = await other.c.post('/api/events', event({ name: 'Their own club round' }));
    expect(before.status).toBe(201);
    // Added without being asked: what they had is not opened up by it.
    const res = await owner.c.post(`/api/cars/${owner.carId}/co-drivers`, { email: other.email });
    expect(res.status).toBe(201);
    expectError(await owner.c.get(`/api/events/${before.body.id}`), 404, 'not_found');
    expect((await owner.c.get('/api/events')).body.items.map((e: { id: string }) => e.id)).not.toContain(before.body.id);

    // At the next event the co-driver enters it first; the owner logs into the same one.
    const after = await other.c.post('/api/events', event({ name: 'Shared round', date: '2026-05-03' }));
    expect((await owner.c.get(`/api/events/${after.body.id}`)).status).toBe(200);
    expect((await owner.c.get('/api/events')).body.items.map((e: { id: string }) => e.id)).toContain(after.body.id);
    // And the co-driver sees the owner's events, old ones included: the owner chose to share the car.
    expect((await other.c.get(`/api/events/${owner.eventId}`)).status).toBe(200);
  });

  it('when the event id is unknown or malformed, then 404', async () => {
    const { c } = await signedInClient(t);
    expectError(await c.get(`/api/events/${randomUUID()}`), 404, 'not_found');
    expectError(await c.get('/api/events/round-1'), 404, 'not_found');
  });

  it('when nobody is signed in, then every event route answers 401', async () => {
    const d = await driverWithCarAndEvent(t);
    const anon = anonymous(t);
    expectError(await anon.get('/api/events'), 401, 'unauthenticated');
    expectError(await anon.post('/api/events', event()), 401, 'unauthenticated');
    expectError(await anon.get(`/api/events/${d.eventId}`), 401, 'unauthenticated');
    expectError(await anon.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`), 401, 'unauthenticated');
  });
});

describe('GET /api/events/:eventId/summary', () => {
  it('when runs are [52.101 + 1 cone, DNF, 51.880, off course + 1 cone], then bests, cones, DNFs and runs in run-number order', async () => {
    const d = await driverWithCarAndEvent(t);
    // posted out of order; the summary lists them by run number
    const r3 = await postRun(d.c, d.carId, d.eventId, { runNumber: 3, rawTimeSec: 51.88, recordedAt: '2026-04-12T12:00:00Z' });
    const r1 = await postRun(d.c, d.carId, d.eventId, { runNumber: 1, rawTimeSec: 52.101, cones: 1, recordedAt: '2026-04-12T10:00:00Z' });
    const r4 = await postRun(d.c, d.carId, d.eventId, { runNumber: 4, status: 'off_course', rawTimeSec: null, cones: 1, recordedAt: '2026-04-12T13:00:00Z' });
    const r2 = await postRun(d.c, d.carId, d.eventId, { runNumber: 2, status: 'dnf', rawTimeSec: null, recordedAt: '2026-04-12T11:00:00Z' });
    const res = await d.c.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`);
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.event.id).toBe(d.eventId);
    expect(res.body.entries).toHaveLength(1);
    const entry = res.body.entries[0];
    // Worked by hand: runs [52.101 + 1 cone, DNF, 51.880] → best 51.880 (time plus penalties, SCCA Solo Rules §1.2.1)
    expect(entry).toMatchObject({
      carId: d.carId,
      carName: 'Blue roadster',
      driver: { id: d.user.id, displayName: 'Nell Ashdown' },
      bestRawSec: 51.88,
      bestAdjustedSec: 51.88,
      bestRunId: r3.id,
      cones: 2,
      dnfs: 1,
      offCourses: 1,
      runCount: 4,
    });
    expect(entry.runs.map((r: { id: string }) => r.id)).toEqual([r1.id, r2.id, r3.id, r4.id]);
    expect(entry.runs.map((r: { runNumber: number }) => r.runNumber)).toEqual([1, 2, 3, 4]);
    expect(entry.runs[0].adjustedTimeSec).toBeCloseTo(54.101, 9);
    expect(Math.abs(entry.runs[0].pctOffBest - ((54.101 - 51.88) / 51.88) * 100)).toBeLessThan(1e-9);
    expect(entry.runs[1]).toMatchObject({ status: 'dnf', adjustedTimeSec: null, pctOffBest: null, isBest: false });
  });

  it('when the event’s cone penalty is 1 s, then the best adjusted time counts 1 s per cone', async () => {
    const d = await driverWithCarAndEvent(t, { conePenaltySec: 1 });
    const r1 = await postRun(d.c, d.carId, d.eventId, { runNumber: 1, rawTimeSec: 45.678, cones: 2 });
    await postRun(d.c, d.carId, d.eventId, { runNumber: 2, rawTimeSec: 47.9, cones: 0 });
    const entry = (await d.c.get(`/api/events/${d.eventId}/summary`)).body.entries[0];
    // 45.678 + 2 × 1 s = 47.678 beats the clean 47.900; at 2 s a cone it would be 49.678 and lose
    expect(entry.bestAdjustedSec).toBeCloseTo(47.678, 9);
    expect(entry.bestRunId).toBe(r1.id);
  });

  it('when a co-driver also ran the car, then there is one entry per driver, fastest first', async () => {
    const d = await driverWithCarAndEvent(t);
    const co = await addCoDriver(t, d, 'Teo Marsh');
    await postRun(d.c, d.carId, d.eventId, { runNumber: 1, rawTimeSec: 50.5 });
    const theirs = await co.c.post('/api/runs', runBody(d.carId, d.eventId, { runNumber: 1, rawTimeSec: 49.9 }));
    expect(theirs.status).toBe(201);
    const res = await d.c.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`);
    expect(res.body.entries.map((e: { driver: { displayName: string }; bestAdjustedSec: number }) => [e.driver.displayName, e.bestAdjustedSec])).toEqual([
      ['Teo Marsh', 49.9],
      ['Nell Ashdown', 50.5],
    ]);
    expect((await co.c.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`)).body.entries).toHaveLength(2);
  });

  it('when the event has no runs yet, then the summary has no entries', async () => {
    const d = await driverWithCarAndEvent(t);
    expect((await d.c.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`)).body).toMatchObject({ entries: [] });
  });

  it('when another driver asks for the summary filtered by this car, then 404, even at their own event', async () => {
    const d = await driverWithCarAndEvent(t);
    const other = await driverWithCarAndEvent(t);
    await postRun(d.c, d.carId, d.eventId);
    expectError(await other.c.get(`/api/events/${d.eventId}/summary?carId=${d.carId}`), 404, 'not_found');
    expectError(await other.c.get(`/api/events/${other.eventId}/summary?carId=${d.carId}`), 404, 'not_found');
    expectError(await other.c.get(`/api/events/${d.eventId}/summary`), 404, 'not_found');
  });

  it('when the carId is malformed or an unknown parameter is sent, then 400 at that parameter', async () => {
    const d = await driverWithCarAndEvent(t);
    expectFieldErrors(await d.c.get(`/api/events/${d.eventId}/summary?carId=blue`), ['carId']);
    expectFieldErrors(await d.c.get(`/api/events/${d.eventId}/summary?class=SS`), ['class']);
  });
});

import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { corr, mean as mathMean, std as mathStd } from 'mathjs';
import { client, makeTestApp, type TestApp } from '../test-app';
import { seededDatabaseUrl } from '../support-seeded';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../../server/db/demo-accounts';
import { DEMO_CAMBER_ARMS_DATE } from '../../../server/db/demo-season';
import { driverWithCarAndEvent, postRun, postSetup, type Driver } from '../season/season-fixtures';

let db: Awaited<ReturnType<typeof seededDatabaseUrl>>;
let t: TestApp;
let maren: ReturnType<typeof client>;
let carId: string;
const setupCorners = {
  lr: { camberDeg: -1.0, toeMm: 1, damperClicks: 6, coldPressureKpa: 210 },
  rr: { camberDeg: -1.0, toeMm: 1, damperClicks: 6, coldPressureKpa: 210 },
};

beforeAll(async () => {
  db = await seededDatabaseUrl();
  t = await makeTestApp({ databaseUrl: db.url });
  maren = client(t.app);
  expect((await maren.post('/api/auth/login', { email: DEMO_ACCOUNTS.driver.email, password: DEMO_PASSWORD })).status).toBe(200);
  carId = (await maren.get('/api/cars')).body.items.find((c: { name: string }) => c.name === 'Pebble').id;
}, 120_000);
afterAll(async () => {
  await t?.close();
  await db?.drop();
});

/** The clean times of the demo-free car below: 12 April (best 44.9 s) and 3 May (best 49.5 s). */
const DAY_ONE = [46.0, 45.8, 45.6, 45.2, 45.0, 45.1, 44.9];
const DAY_TWO = [50.0, 49.5, 49.8];

/**
 * A car of its own: rear clicks 5 from 1 April, changed to 7 between the third and fourth runs of 12 April, and
 * a second event on 3 May run on 7 all day.
 */
async function rearClicksChangedMidDay(): Promise<Driver> {
  const d = await driverWithCarAndEvent(t);
  const rear = (clicks: number) => ({ camberDeg: -1.0, toeMm: 1, damperClicks: clicks, coldPressureKpa: 210 });
  const front = { camberDeg: -1.5, toeMm: 0, damperClicks: 4, coldPressureKpa: 220 };
  await postSetup(d.c, d.carId, { label: 'Baseline', effectiveFrom: '2026-04-01T00:00:00Z', corners: { lf: front, rf: front, lr: rear(5), rr: rear(5) } });
  await postSetup(d.c, d.carId, { label: 'Rear clicks +2', effectiveFrom: '2026-04-12T10:25:00Z', corners: { lf: front, rf: front, lr: rear(7), rr: rear(7) } });
  for (const [i, raw] of DAY_ONE.entries()) {
    await postRun(d.c, d.carId, d.eventId, { runNumber: i + 1, rawTimeSec: raw, recordedAt: new Date(Date.UTC(2026, 3, 12, 10, i * 10)).toISOString() });
  }
  const second = await d.c.post('/api/events', { name: 'Spring points round 2', date: '2026-05-03', conePenaltySec: 2 });
  for (const [i, raw] of DAY_TWO.entries()) {
    await postRun(d.c, d.carId, second.body.id, { runNumber: i + 1, rawTimeSec: raw, recordedAt: new Date(Date.UTC(2026, 4, 3, 10, i * 10)).toISOString() });
  }
  return d;
}

describe('GET /api/cars/:carId/analysis/scatter', () => {
  it('when front camber is plotted against front wear skew, then every interval is a point and the fit says more negative camber skews less inward', async () => {
    const res = await maren.get(`/api/cars/${carId}/analysis/scatter?x=camber&y=wearSkew&corner=front`);
    expect(res.status).toBe(200);
    // 8 intervals (start → event 1 … event 7 → event 8) × 2 front corners.
    expect(res.body.n).toBe(16);
    expect(res.body.points).toHaveLength(16);
    const xs = new Set(res.body.points.map((p: { x: number }) => p.x));
    expect(xs).toEqual(new Set([-1.2, -2.4]));
    expect(res.body.fit).not.toBeNull();
    // Inner-minus-outer wear is higher at −1.2° (toe-out era) than at −2.4°: y falls as camber rises, so the slope is positive.
    expect(res.body.fit.slope).toBeGreaterThan(0);
    expect(res.body.fit.r2).toBeGreaterThan(0.3);
    for (const p of res.body.points) expect(p).toMatchObject({ setupId: expect.any(String), eventId: expect.any(String), runs: expect.any(Number), driver: null, runNumber: null });
  });

  it('when the demo car’s rear clicks are plotted against rear wear, then each event day the clicks changed mid-day is left out at both rear corners', async () => {
    const res = await maren.get(`/api/cars/${carId}/analysis/scatter?x=damperClicks&y=wear&corner=rear`);
    expect(res.status).toBe(200);
    // Every setup after the first that changed the rear clicks was a quick change between runs of an event day.
    const setups = ((await maren.get(`/api/cars/${carId}/setups`)).body.items as { effectiveFrom: string; corners: { lr: { damperClicks: number } } }[])
      .sort((a, b) => a.effectiveFrom.localeCompare(b.effectiveFrom));
    const changes = setups.filter((s, i) => i > 0 && s.corners.lr.damperClicks !== setups[i - 1]!.corners.lr.damperClicks).length;
    expect(changes).toBeGreaterThan(0);
    expect(res.body.leftOut).toEqual({ mixedSetting: 2 * changes });
    // Rear camber never changed, so its plot has every interval: the two plots' points and left-out add up to it.
    const camber = await maren.get(`/api/cars/${carId}/analysis/scatter?x=camber&y=wear&corner=rear`);
    expect(camber.body.leftOut).toEqual({ mixedSetting: 0 });
    expect(res.body.n + res.body.leftOut.mixedSetting).toBe(camber.body.n);
  });

  it('when clicks are plotted against time, then each run is a point with its run, event and setup, and clicks are normalised soft = 0', async () => {
    const res = await maren.get(`/api/cars/${carId}/analysis/scatter?x=damperClicks&y=time&corner=rear`);
    expect(res.status).toBe(200);
    // Every finished run without a cone, and no other: a cone's penalty is the driver's, not the setup's.
    const runs = (await maren.get(`/api/runs?carId=${carId}`)).body.items as { id: string; cones: number; status: string; runNumber: number; driver: { id: string; displayName: string } }[];
    const clean = runs.filter((r) => r.status === 'finished' && r.cones === 0);
    expect(runs.some((r) => r.status === 'finished' && r.cones > 0)).toBe(true);
    expect(res.body.n).toBe(clean.length);
    expect(new Set(res.body.points.map((pt: { runId: string }) => pt.runId))).toEqual(new Set(clean.map((r) => r.id)));
    const p = res.body.points[0];
    expect(p).toMatchObject({ runId: expect.any(String), eventId: expect.any(String), setupId: expect.any(String) });
    // Each point names its run's driver and number, as the run list does.
    for (const pt of res.body.points as { runId: string; driver: unknown; runNumber: number }[]) {
      const run = clean.find((r) => r.id === pt.runId)!;
      expect([pt.driver, pt.runNumber]).toEqual([run.driver, run.runNumber]);
    }
    // Every event the car ran at, oldest first, for markers that stay with their event from plot to plot.
    const events: { id: string; date: string }[] = (await maren.get(`/api/events`)).body.items;
    const ran = new Set(runs.map((r) => (r as unknown as { eventId: string }).eventId));
    expect(res.body.eventIds).toEqual(events.filter((e) => ran.has(e.id)).sort((a, b) => a.date.localeCompare(b.date)).map((e) => e.id));
    // The demo roadster counts clicks from full soft, 12 positions.
    expect(p.xNormalized).toBeCloseTo(p.x / 12, 12);
    expect(res.body.y.unit).toBe('%');
  });

  it('when every run is its day’s best (0 % off each time), then the flat line fits exactly: r² is 1, a number, not null', async () => {
    const d = await driverWithCarAndEvent(t);
    const events = [d.eventId];
    for (const date of ['2026-05-03', '2026-05-24']) {
      events.push((await d.c.post('/api/events', { name: `Round on ${date}`, date, conePenaltySec: 2 })).body.id);
    }
    // One setup before each event.
    for (const [camber, from] of [[-1.2, '2026-04-01'], [-1.8, '2026-05-01'], [-2.4, '2026-05-20']] as const) {
      const front = { camberDeg: camber, toeMm: 0, damperClicks: 4, coldPressureKpa: 220 };
      await postSetup(d.c, d.carId, { label: `Camber ${camber}`, effectiveFrom: `${from}T00:00:00Z`, corners: { ...setupCorners, lf: front, rf: front } });
    }
    await postRun(d.c, d.carId, events[0]!, { recordedAt: '2026-04-12T10:00:00Z' });
    await postRun(d.c, d.carId, events[1]!, { recordedAt: '2026-05-03T10:00:00Z' });
    await postRun(d.c, d.carId, events[2]!, { recordedAt: '2026-05-24T10:00:00Z' });

    const res = await d.c.get(`/api/cars/${d.carId}/analysis/scatter?x=camber&y=time&corner=front`);
    expect(res.status).toBe(200);
    expect(res.body.points.map((p: { x: number; y: number }) => [p.x, p.y])).toEqual([[-1.2, 0], [-1.8, 0], [-2.4, 0]]);
    expect(res.body.fit).toEqual({ slope: 0, intercept: 0, r2: 1 });
  });

  it('when the rear clicks were changed between two tread readings, then that interval is left out of clicks against wear and counted, not credited to the later value', async () => {
    const d = await rearClicksChangedMidDay();
    const set = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', size: '205/50R15', startTreadMm: 7 });
    expect(set.status).toBe(201);
    const rear = (mm: number) => ({ innerMm: mm, middleMm: mm, outerMm: mm });
    for (const [takenAt, mm] of [['2026-04-01T09:30:00Z', 7], ['2026-04-12T17:00:00Z', 6.72], ['2026-05-03T17:00:00Z', 6.6]] as const) {
      const reading = await d.c.post(`/api/tyre-sets/${set.body.id}/readings`, { takenAt, corners: { lr: rear(mm), rr: rear(mm) } });
      expect(reading.status, JSON.stringify(reading.body)).toBe(201);
    }

    // 1 April → 12 April: 3 runs on 5 clicks and 4 on 7. 12 April → 3 May: 3 runs, all on 7.
    const clicks = await d.c.get(`/api/cars/${d.carId}/analysis/scatter?x=damperClicks&y=wear&corner=rear`);
    expect(clicks.status).toBe(200);
    expect(clicks.body.points.map((p: { x: number; runs: number; corner: string }) => [p.corner, p.x, p.runs])).toEqual([['lr', 7, 3], ['rr', 7, 3]]);
    // 0.12 mm over 3 runs.
    for (const p of clicks.body.points) expect(p.y).toBeCloseTo(0.04, 12);
    expect(clicks.body.n).toBe(2);
    expect(clicks.body.leftOut).toEqual({ mixedSetting: 2 });

    // Rear camber never changed: every interval is on one value, whichever setups its runs were on.
    const camber = await d.c.get(`/api/cars/${d.carId}/analysis/scatter?x=camber&y=wear&corner=rear`);
    expect(camber.body.n).toBe(4);
    expect(camber.body.leftOut).toEqual({ mixedSetting: 0 });
  });

  it('when clicks are plotted against time, then each value has its runs, events, and mean and spread of % off the day’s best, and the change within a day is flagged as tied to run order', async () => {
    const d = await rearClicksChangedMidDay();
    const res = await d.c.get(`/api/cars/${d.carId}/analysis/scatter?x=damperClicks&y=time&corner=rear`);
    expect(res.status).toBe(200);

    // Independent: % off = (t − best)/best × 100 (SCCA Solo Rules scoring, common practice), each run against its
    // day's best, then the mean and the sample standard deviation (n − 1) from mathjs.
    const pct = (t: number, best: number) => ((t - best) / best) * 100;
    const five = DAY_ONE.slice(0, 3).map((t) => pct(t, 44.9));
    const seven = [...DAY_ONE.slice(3).map((t) => pct(t, 44.9)), ...DAY_TWO.map((t) => pct(t, 49.5))];
    const [low, high] = res.body.perValue.values;
    expect(res.body.perValue.values).toHaveLength(2);
    expect(low).toMatchObject({ value: 5, n: 3, days: 1 });
    expect(low.mean).toBeCloseTo(mathMean(five), 10);
    expect(low.sd).toBeCloseTo(Number(mathStd(five)), 10);
    expect(high).toMatchObject({ value: 7, n: 7, days: 2 });
    expect(high.mean).toBeCloseTo(mathMean(seven), 10);
    expect(high.sd).toBeCloseTo(Number(mathStd(seven)), 10);
    // 12 April: 5 clicks for the first three runs, then 7; 3 May: 7 all day.
    expect(res.body.perValue.runOrder).toEqual({ daysChanged: 1, daysInBlocks: 1 });
    expect(res.body.leftOut).toEqual({ mixedSetting: 0 });
    // Nothing else at the rear changed with the clicks.
    expect(res.body.alsoMoved).toEqual([]);

    const wear = await d.c.get(`/api/cars/${d.carId}/analysis/scatter?x=damperClicks&y=wear&corner=rear`);
    expect(wear.body.perValue).toBeNull();
  });

  it('when front toe was changed together with front camber, then camber against time names toe as moved with it, with r as mathjs has it, and leaves out what did not', async () => {
    const d = await driverWithCarAndEvent(t);
    const rear = { camberDeg: -1.0, toeMm: 1, damperClicks: 6, coldPressureKpa: 210 };
    const front = (camberDeg: number, toeMm: number, coldPressureKpa: number) => ({ camberDeg, toeMm, damperClicks: 4, coldPressureKpa });
    await postSetup(d.c, d.carId, { label: 'Baseline', effectiveFrom: '2026-04-01T00:00:00Z', corners: { lf: front(-1.5, 0, 220), rf: front(-1.5, 0, 220), lr: rear, rr: rear } });
    await postSetup(d.c, d.carId, { label: 'Camber and toe', effectiveFrom: '2026-04-12T10:25:00Z', corners: { lf: front(-2.5, -1, 220), rf: front(-2.5, -1, 220), lr: rear, rr: rear } });
    await postSetup(d.c, d.carId, { label: 'Front pressure up', effectiveFrom: '2026-04-12T10:45:00Z', corners: { lf: front(-2.5, -1, 230), rf: front(-2.5, -1, 230), lr: rear, rr: rear } });
    for (const [i, raw] of DAY_ONE.entries()) {
      await postRun(d.c, d.carId, d.eventId, { runNumber: i + 1, rawTimeSec: raw, recordedAt: new Date(Date.UTC(2026, 3, 12, 10, i * 10)).toISOString() });
    }
    const res = await d.c.get(`/api/cars/${d.carId}/analysis/scatter?x=camber&y=time&corner=front`);
    expect(res.status).toBe(200);

    // Independent: Pearson's r from mathjs over the same points, each point's front values read from its setup.
    const setups = new Map(((await d.c.get(`/api/cars/${d.carId}/setups`)).body.items as { id: string; corners: Record<string, Record<string, number>> }[]).map((s) => [s.id, s]));
    const points = res.body.points as { x: number; setupId: string }[];
    const frontOf = (id: string, field: string) => (setups.get(id)!.corners.lf![field]! + setups.get(id)!.corners.rf![field]!) / 2;
    const r = (field: string) => corr(points.map((p) => p.x), points.map((p) => frontOf(p.setupId, field))) as number;
    expect(r('toeMm')).toBeCloseTo(1, 12);
    // Pressure rose later in the day, on the new camber only: how strongly it follows camber is mathjs's to say.
    const pressureR = r('coldPressureKpa');
    const expected = [{ field: 'toeMm', r: r('toeMm') }, ...(Math.abs(pressureR) >= 0.7 ? [{ field: 'coldPressureKpa', r: pressureR }] : [])];
    expect(res.body.alsoMoved.map((m: { field: string }) => m.field)).toEqual(expected.map((m) => m.field));
    for (const [i, m] of expected.entries()) expect(res.body.alsoMoved[i].r).toBeCloseTo(m.r, 12);
  });

  it('when x or y is not one of the choices, then 400 with a field error', async () => {
    const res = await maren.get(`/api/cars/${carId}/analysis/scatter?x=toe&y=time`);
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.x).toBeDefined();
  });
});

describe('GET /api/cars/:carId/analysis/compare', () => {
  it('when the camber-arm change is compared, then front inner-edge wear is lower after it, with n, means and a verdict', async () => {
    const changes = (await maren.get(`/api/cars/${carId}/changes`)).body.items as { id: string; what: string }[];
    const arms = changes.find((c) => /camber arms/i.test(c.what))!;
    const res = await maren.get(`/api/cars/${carId}/analysis/compare?changeId=${arms.id}`);
    expect(res.status).toBe(200);
    expect(res.body.change.changedOn).toBe(DEMO_CAMBER_ARMS_DATE);
    for (const corner of ['lf', 'rf']) {
      const inner = res.body.corners[corner].innerWear;
      expect(inner.before.n).toBe(4);
      expect(inner.after.n).toBe(4);
      expect(inner.after.mean).toBeLessThan(inner.before.mean);
      expect(inner.pValue).toBeLessThan(0.05);
      expect(inner.verdict).toMatch(/inner-edge wear/i);
      // With what it measured and which way is better, so a client can say it again in its user's units.
      expect(inner.about).toEqual({ what: `${corner.toUpperCase()} inner-edge wear`, betterWhen: 'lower', counted: 'interval' });
    }
    expect(res.body.time.about).toEqual({ what: "time off the day's best", betterWhen: 'lower', counted: 'run' });
    // Inner minus outer is a balance: even (0) is the aim.
    expect(res.body.corners.lf.skew.about.betterWhen).toBe('nearZero');
    // Time: the arms went on between events, so no day had runs on both sides; every clean finished run is left
    // out rather than compared against a best of its own day on the same side.
    const runs = (await maren.get(`/api/runs?carId=${carId}`)).body.items as { cones: number; status: string }[];
    expect(res.body.time.before.n + res.body.time.after.n).toBe(0);
    expect(res.body.time.enough).toBe(false);
    expect(res.body.timeScope).toEqual({ days: 0, leftOut: runs.filter((r) => r.status === 'finished' && r.cones === 0).length });
  });

  it('when a change made between two runs of a day is compared, then time is compared within that day only, and a later day run on one side is left out', async () => {
    const d = await rearClicksChangedMidDay();
    const res = await d.c.get(`/api/cars/${d.carId}/analysis/compare?at=2026-04-12T10:25:00Z`);
    expect(res.status).toBe(200);
    // Independent: % off = (t − best)/best × 100 (SCCA Solo Rules scoring, common practice) against 12 April's best
    // of 44.9 s, then the mean and the sample standard deviation (n − 1) from mathjs.
    const pct = (t: number) => ((t - 44.9) / 44.9) * 100;
    const before = DAY_ONE.slice(0, 3).map(pct);
    const after = DAY_ONE.slice(3).map(pct);
    expect(res.body.time.before.n).toBe(3);
    expect(res.body.time.after.n).toBe(4);
    expect(res.body.time.before.mean).toBeCloseTo(mathMean(before), 10);
    expect(res.body.time.before.sd).toBeCloseTo(Number(mathStd(before)), 10);
    expect(res.body.time.after.mean).toBeCloseTo(mathMean(after), 10);
    expect(res.body.time.difference).toBeCloseTo(mathMean(after) - mathMean(before), 10);
    // 3 May, all after the change, has its own best: its three runs are left out.
    expect(res.body.timeScope).toEqual({ days: 1, leftOut: DAY_TWO.length });
  });

  it('when neither a change nor a date is given, then 400', async () => {
    const res = await maren.get(`/api/cars/${carId}/analysis/compare`);
    expect(res.status).toBe(400);
  });

  it('when another driver asks about this car, then 404', async () => {
    const priya = client(t.app);
    await priya.post('/api/auth/login', { email: DEMO_ACCOUNTS.secondDriver.email, password: DEMO_PASSWORD });
    expect((await priya.get(`/api/cars/${carId}/analysis/compare?at=2026-06-12`)).status).toBe(404);
    expect((await priya.get(`/api/cars/${carId}/season`)).status).toBe(404);
  });
});

describe('GET /api/cars/:carId/season', () => {
  it('when read, then it has 8 events with bests per driver, setup changes in order and a tyre-life projection', async () => {
    const res = await maren.get(`/api/cars/${carId}/season`);
    expect(res.status).toBe(200);
    expect(res.body.events).toHaveLength(8);
    const dates = res.body.events.map((e: { date: string }) => e.date);
    expect([...dates].sort()).toEqual(dates);
    for (const e of res.body.events) {
      expect(e.drivers.map((d: { driver: { displayName: string } }) => d.driver.displayName).sort()).toEqual(['Maren Holloway', 'Teo Varga']);
    }
    const effective = res.body.setupChanges.map((s: { effectiveFrom: string }) => s.effectiveFrom);
    expect([...effective].sort()).toEqual(effective);
    const arms = res.body.setupChanges.find((s: { label: string }) => /camber arms/i.test(s.label));
    expect(arms.changes.map((c: { path: string }) => c.path)).toContain('corners.lf.camberDeg');
    const life = res.body.tyreLife[0];
    expect(life.minDepthMm).toBe(1.6);
    expect(life.mmPerRun).toBeGreaterThan(0);
    // Runs left = floor((depth now − 1.6) / rate), common practice.
    expect(life.runsLeft).toBe(Math.floor((life.worst.depthMm - 1.6) / life.mmPerRun));
  });

  it('when front camber changed part-way through a set, then tyre life fits the worst spot from the last reading before the change, and a later alignment change with too few readings after it uses every reading', async () => {
    const d = await driverWithCarAndEvent(t);
    const front = (camberDeg: number, toeMm = 0, damperClicks = 4) => ({ camberDeg, toeMm, damperClicks, coldPressureKpa: 220 });
    const rear = { camberDeg: -1.0, toeMm: 1, damperClicks: 6, coldPressureKpa: 210 };
    await postSetup(d.c, d.carId, { label: 'Baseline', effectiveFrom: '2026-04-01T00:00:00Z', corners: { lf: front(-1), rf: front(-1), lr: rear, rr: rear } });
    await postSetup(d.c, d.carId, { label: 'More front camber', effectiveFrom: '2026-06-01T00:00:00Z', corners: { lf: front(-2), rf: front(-2), lr: rear, rr: rear } });
    // Damper clicks are not alignment: this change leaves the fit where it starts.
    await postSetup(d.c, d.carId, { label: 'Front clicks +2', effectiveFrom: '2026-07-01T00:00:00Z', corners: { lf: front(-2, 0, 6), rf: front(-2, 0, 6), lr: rear, rr: rear } });
    // Four events of 10 runs each: April, May, June, July.
    const days = ['2026-04-12', '2026-05-10', '2026-06-14', '2026-07-12'];
    for (const [n, date] of days.entries()) {
      const event = n === 0 ? { body: { id: d.eventId } } : await d.c.post('/api/events', { name: `Points round ${n + 1}`, date, conePenaltySec: 2 });
      for (let i = 0; i < 10; i++) await postRun(d.c, d.carId, event.body.id, { runNumber: i + 1, recordedAt: `${date}T10:${String(i * 5).padStart(2, '0')}:00Z` });
    }
    const set = await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', size: '205/50R15', startTreadMm: 7 });
    // Left-front inner edge: 0.1 mm a run before the camber change, 0.05 after; every other spot stays deeper.
    const spots = (inner: number) => ({ innerMm: inner, middleMm: 6.9, outerMm: 6.9 });
    const readings: [string, number][] = [['2026-04-01T09:00:00Z', 7], ['2026-04-12T18:00:00Z', 6], ['2026-05-10T18:00:00Z', 5], ['2026-06-14T18:00:00Z', 4.5], ['2026-07-12T18:00:00Z', 4]];
    for (const [takenAt, mm] of readings) {
      const r = await d.c.post(`/api/tyre-sets/${set.body.id}/readings`, { takenAt, corners: { lf: spots(mm), rf: spots(6.95) } });
      expect(r.status, JSON.stringify(r.body)).toBe(201);
    }

    const life = (await d.c.get(`/api/cars/${d.carId}/season`)).body.tyreLife[0];
    expect(life.worst).toEqual({ corner: 'lf', position: 'inner', depthMm: 4 });
    // From 10 May (5.0 mm after 20 runs) on: 4.5 mm after 30 and 4.0 after 40 lie on one line, 0.05 mm a run
    // (worked by hand), and runs left = floor((4.0 − 1.6) / 0.05) = 48 (common practice).
    expect(life.alignmentChange).toEqual({ at: '2026-06-01T00:00:00.000Z', label: 'More front camber', fitted: 'since' });
    expect(life.n).toBe(3);
    expect(life.mmPerRun).toBeCloseTo(0.05, 12);
    expect(life.runsLeft).toBe(48);

    // Toe changed after the last reading: too few readings since, so every reading is used, and the slope is the
    // least-squares one through all five (textbook formula: Σ(x − x̄)(y − ȳ) / Σ(x − x̄)²).
    await postSetup(d.c, d.carId, { label: 'Toe out 1 mm', effectiveFrom: '2026-07-20T00:00:00Z', corners: { lf: front(-2, -1, 6), rf: front(-2, -1, 6), lr: rear, rr: rear } });
    const after = (await d.c.get(`/api/cars/${d.carId}/season`)).body.tyreLife[0];
    expect(after.alignmentChange).toEqual({ at: '2026-07-20T00:00:00.000Z', label: 'Toe out 1 mm', fitted: 'whole' });
    const xs = [0, 10, 20, 30, 40];
    const ys = readings.map(([, mm]) => mm);
    const mx = mathMean(xs);
    const my = mathMean(ys);
    const slope = xs.reduce((sum, x, i) => sum + (x - mx) * (ys[i]! - my), 0) / xs.reduce((sum, x) => sum + (x - mx) ** 2, 0);
    expect(after.n).toBe(5);
    expect(after.mmPerRun).toBeCloseTo(-slope, 12);
  });

  it('when another set was on the car for some runs between two readings of a set, then its wear and tyre life count only the runs made on it', async () => {
    const d = await driverWithCarAndEvent(t);
    await postSetup(d.c, d.carId, { label: 'Baseline', effectiveFrom: '2026-04-01T00:00:00Z' });
    const fit = async (setId: string, at: string) =>
      expect((await d.c.post(`/api/tyre-sets/${setId}/mountings`, { mountedAt: at, positions: { lf: 1, rf: 2, lr: 3, rr: 4 } })).status).toBe(201);
    const a = (await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set A', startTreadMm: 7 })).body.id as string;
    const b = (await d.c.post(`/api/cars/${d.carId}/tyre-sets`, { label: 'Set B (wet)', startTreadMm: 7 })).body.id as string;
    await fit(a, '2026-04-12T08:00:00Z');
    await fit(b, '2026-04-12T11:00:00Z');
    await fit(a, '2026-04-12T12:00:00Z');
    // Set A: runs at 9:00 and 10:00, then 12:10; Set B: three runs from 11:10.
    for (const [i, at] of ['09:00', '10:00', '11:10', '11:20', '11:30', '12:10'].entries()) {
      await postRun(d.c, d.carId, d.eventId, { runNumber: i + 1, recordedAt: `2026-04-12T${at}:00Z` });
    }
    const lf = (innerMm: number) => ({ lf: { innerMm, middleMm: 6.9, outerMm: 6.9 } });
    expect((await d.c.post(`/api/tyre-sets/${a}/readings`, { takenAt: '2026-04-12T08:50:00Z', corners: lf(7) })).status).toBe(201);
    expect((await d.c.post(`/api/tyre-sets/${a}/readings`, { takenAt: '2026-04-12T12:30:00Z', corners: lf(6.7) })).status).toBe(201);

    // 0.3 mm off the inner edge over Set A's 3 runs, not over the car's 6: 0.1 mm a run (worked by hand); the
    // middle and outer lost nothing, and the plotted wear is the mean of the three.
    const wear = await d.c.get(`/api/cars/${d.carId}/analysis/scatter?x=camber&y=wear&corner=lf`);
    expect(wear.body.points.map((p: { runs: number }) => p.runs)).toEqual([3]);
    expect(wear.body.points[0].y).toBeCloseTo((0.1 + 0 + 0) / 3, 12);
    const life = (await d.c.get(`/api/cars/${d.carId}/season`)).body.tyreLife.find((l: { tyreSetId: string }) => l.tyreSetId === a);
    expect(life.mmPerRun).toBeCloseTo(0.1, 12);
    // Runs left = floor((6.7 − 1.6) / 0.1) = 51 (common practice).
    expect(life.runsLeft).toBe(51);
    expect(life.runsSinceReading).toBe(0);

    // Two more runs on Set A after its reading, then Set B on again for one: 51 − 2 = 49 left on A.
    await postRun(d.c, d.carId, d.eventId, { runNumber: 7, recordedAt: '2026-04-12T12:40:00Z' });
    await postRun(d.c, d.carId, d.eventId, { runNumber: 8, recordedAt: '2026-04-12T12:50:00Z' });
    await fit(b, '2026-04-12T13:00:00Z');
    await postRun(d.c, d.carId, d.eventId, { runNumber: 9, recordedAt: '2026-04-12T13:10:00Z' });
    const later = (await d.c.get(`/api/cars/${d.carId}/season`)).body.tyreLife.find((l: { tyreSetId: string }) => l.tyreSetId === a);
    expect(later.runsSinceReading).toBe(2);
    expect(later.runsLeft).toBe(49);
    expect(later.mmPerRun).toBeCloseTo(0.1, 12);
  });

  it('when a deeper minimum is asked for, then fewer runs are left', async () => {
    const a = (await maren.get(`/api/cars/${carId}/season`)).body.tyreLife[0].runsLeft;
    const b = (await maren.get(`/api/cars/${carId}/season?minDepthMm=3`)).body.tyreLife[0].runsLeft;
    expect(b).toBeLessThan(a);
  });
});

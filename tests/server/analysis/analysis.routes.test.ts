import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { client, makeTestApp, type TestApp } from '../test-app';
import { seededDatabaseUrl } from '../support-seeded';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../../../server/db/demo-accounts';
import { DEMO_CAMBER_ARMS_DATE } from '../../../server/db/demo-season';
import { driverWithCarAndEvent, postRun, postSetup } from '../season/season-fixtures';

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
    for (const p of res.body.points) expect(p).toMatchObject({ setupId: expect.any(String), eventId: expect.any(String), runs: expect.any(Number) });
  });

  it('when clicks are plotted against time, then each run is a point with its run, event and setup, and clicks are normalised soft = 0', async () => {
    const res = await maren.get(`/api/cars/${carId}/analysis/scatter?x=damperClicks&y=time&corner=rear`);
    expect(res.status).toBe(200);
    // Every finished run without a cone, and no other: a cone's penalty is the driver's, not the setup's.
    const runs = (await maren.get(`/api/runs?carId=${carId}`)).body.items as { id: string; cones: number; status: string }[];
    const clean = runs.filter((r) => r.status === 'finished' && r.cones === 0);
    expect(runs.some((r) => r.status === 'finished' && r.cones > 0)).toBe(true);
    expect(res.body.n).toBe(clean.length);
    expect(new Set(res.body.points.map((pt: { runId: string }) => pt.runId))).toEqual(new Set(clean.map((r) => r.id)));
    const p = res.body.points[0];
    expect(p).toMatchObject({ runId: expect.any(String), eventId: expect.any(String), setupId: expect.any(String) });
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
    // Time: the clean finished runs, each on one side of the change.
    const runs = (await maren.get(`/api/runs?carId=${carId}`)).body.items as { cones: number; status: string }[];
    expect(res.body.time.before.n + res.body.time.after.n).toBe(runs.filter((r) => r.status === 'finished' && r.cones === 0).length);
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

  it('when a deeper minimum is asked for, then fewer runs are left', async () => {
    const a = (await maren.get(`/api/cars/${carId}/season`)).body.tyreLife[0].runsLeft;
    const b = (await maren.get(`/api/cars/${carId}/season?minDepthMm=3`)).body.tyreLife[0].runsLeft;
    expect(b).toBeLessThan(a);
  });
});

import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SEASON_FILE_FORMAT, SEASON_FILE_VERSION } from '../../../shared/export/season-export.schema';
import { listRoutes, type Mount } from '../../../server/lib/routes';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { driverWithCarAndEvent, type Driver } from '../season/season-fixtures';

/**
 * Random and malformed bodies (fast-check) sent to every POST, PUT and PATCH route the app lists,
 * signed in as a driver with a car, an event and a valid CSRF token (as an admin for the admin's
 * routes), so each request reaches the route's own checks. The answer is never a 500: a body the route cannot take is a 400 in the
 * error envelope (with field errors when it was valid JSON), and nothing is written.
 */
let t: TestApp;
let d: Driver;
let admin: Awaited<ReturnType<typeof signedInClient>>;

beforeAll(async () => {
  t = await makeTestApp();
  d = await driverWithCarAndEvent(t);
  admin = await signedInClient(t, { isAdmin: true });
});
afterAll(async () => {
  await t.close();
});

/** Every row of every table of ours, summed: a refused request must leave it unchanged. */
async function totalRows(): Promise<number> {
  const tables: { relname: string }[] = await t.ds.query(
    `SELECT relname FROM pg_stat_user_tables WHERE relname NOT IN ('session', 'auth_rate_limits', 'migrations')`,
  );
  const counts = await Promise.all(tables.map(async ({ relname }) => Number((await t.ds.query(`SELECT count(*) AS n FROM "${relname}"`))[0].n)));
  return counts.reduce((a, b) => a + b, 0);
}

/** Field names the app's schemas use, so generated objects get past "unknown key" into type and range checks. */
const FIELD = fc.constantFrom(
  'id', 'name', 'label', 'carId', 'eventId', 'runNumber', 'rawTimeSec', 'cones', 'status', 'recordedAt', 'effectiveFrom',
  'corners', 'lf', 'camberDeg', 'body', 'target', 'type', 'email', 'password', 'displayName', 'lines', 'quantity',
  'unitPriceCents', 'version', 'date', 'classCode', 'notes', 'handoverAt', 'taxRatePct', 'runs', 'changes', 'kind',
  'note', 'isAdmin', 'newEmail', 'token',
);
const HOSTILE_TEXT = fc.constantFrom(
  '<img src=x onerror=alert(1)>', "'; DROP TABLE runs; --", '\u0000', '\uFFFF'.repeat(3), '🏁'.repeat(50), '-1e309', 'NaN', '__proto__',
);
const value = fc.oneof(fc.jsonValue({ maxDepth: 3 }), HOSTILE_TEXT, fc.constantFrom(-1, 0, 1e308, -0, 2 ** 53 + 1, 1e-300));
const body = fc.oneof(
  { weight: 3, arbitrary: fc.dictionary(FIELD, value, { maxKeys: 6 }) },
  { weight: 1, arbitrary: fc.jsonValue({ maxDepth: 3 }) },
  { weight: 1, arbitrary: fc.array(fc.dictionary(FIELD, value, { maxKeys: 3 }), { maxLength: 3 }) },
);
/** Text sent as application/json that is not JSON at all. */
const broken = fc.constantFrom('{"a":', '{name: 1}', "{'a':1}", '[1,2', '\u0000', 'null null', '{"a":1}}');

/**
 * Left out: the payment service's webhook (it checks a signature, not a session) and signing out
 * (it takes no body, and would end the session the other requests use).
 */
const SKIP = new Set(['POST /api/payments/webhook', 'POST /api/auth/logout']);

function pathFor(route: string): string {
  const path = route.split(' ')[1]!;
  return path
    .replace(':carId', d.carId)
    .replace(':eventId', d.eventId)
    .replace(/:[A-Za-z]+/g, '0b5c8a52-2d1f-4c1e-9a7a-6f1d2a3b4c5d');
}

describe('hostile input on every POST, PUT and PATCH route', () => {
  it('when random, malformed and hostile bodies are sent, then no answer is a 500, a 400 has the error envelope, and refused requests write nothing', async () => {
    const routes = listRoutes(t.app.locals.mounts as Mount[]).filter((r) => /^(POST|PUT|PATCH) /.test(r) && !SKIP.has(r));
    expect(routes.length).toBeGreaterThan(40);
    const tokens = { driver: await d.c.csrf(), admin: await admin.c.csrf() };
    const seen = new Map<string, Set<number>>();

    for (const route of routes) {
      const [method] = route.split(' ') as ['POST' | 'PUT' | 'PATCH'];
      const path = pathFor(route);
      const who = path.startsWith('/api/admin/') ? 'admin' : 'driver';
      const send = (payload: string) =>
        (who === 'admin' ? admin.c : d.c).agent[method.toLowerCase() as 'post' | 'put' | 'patch'](path)
          .set('X-CSRF-Token', tokens[who])
          .set('Content-Type', 'application/json')
          .send(payload);
      const rowsBefore = await totalRows();
      let anyWrite = false;
      await fc.assert(
        fc.asyncProperty(fc.oneof({ weight: 5, arbitrary: body.map((b) => JSON.stringify(b)) }, { weight: 1, arbitrary: broken }), async (payload) => {
          const res = await send(payload);
          seen.set(route, (seen.get(route) ?? new Set()).add(res.status));
          expect(res.status, `${route} ${payload.slice(0, 200)} → ${JSON.stringify(res.body)}`).toBeLessThan(500);
          if (res.status < 300) anyWrite = true;
          if (res.status === 400) {
            expect(['validation_failed', 'malformed_json']).toContain(res.body.error?.code);
            if (res.body.error.code === 'validation_failed') expect(res.body.error.fieldErrors ?? res.body.error.message).toBeTruthy();
          }
        }),
        { numRuns: 25, seed: 20261202 },
      );
      // A route that refused every body wrote nothing.
      if (!anyWrite) expect(await totalRows(), route).toBe(rowsBefore);
    }
    // The admin's routes were reached by the admin (their checks ran), not refused at the role check.
    const adminRoutes = routes.filter((r) => r.includes(' /api/admin/'));
    expect(adminRoutes.length).toBeGreaterThan(0);
    for (const r of adminRoutes) expect([...seen.get(r)!], r).not.toContain(403);
    // Most routes refused with 400 (their body was checked), not merely 404 for the made-up ids.
    const checked = [...seen.values()].filter((statuses) => statuses.has(400)).length;
    expect(checked).toBeGreaterThan(routes.length * 0.6);
  }, 240_000);

  it('when a body is over the size limit, then the answer is 413 and nothing is written', async () => {
    const before = await totalRows();
    const token = await d.c.csrf();
    const res = await d.c.agent
      .post('/api/runs')
      .set('X-CSRF-Token', token)
      .set('Content-Type', 'application/json')
      .send(JSON.stringify({ notes: 'x'.repeat(200 * 1024) }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(await totalRows()).toBe(before);
  });
});

/**
 * Values the schemas' formats let through but PostgreSQL cannot store: found at the edge, each a 400 at its field,
 * never a 500 from the database (PostgreSQL's text has no U+0000; its dates have no year 0).
 */
describe('values PostgreSQL cannot store', () => {
  it('when a text carries U+0000, in a body, deep in one or in the query, then 400 names the field and nothing is written', async () => {
    const before = await totalRows();
    const team = await d.c.post('/api/teams', { name: 'Gravel\u0000Pit' });
    expect(team.status).toBe(400);
    expect(team.body.error.fieldErrors.name).toEqual(['Contains a null character (U+0000), which cannot be stored: remove it']);

    const setup = await d.c.post(`/api/cars/${d.carId}/setups`, {
      label: 'Baseline', effectiveFrom: '2026-04-01T00:00:00Z', corners: {}, notes: 'ok', axles: { front: { antiRollBar: 'hole\u00002' } },
    });
    expect(setup.status).toBe(400);
    expect(Object.keys(setup.body.error.fieldErrors)).toEqual(['axles.front.antiRollBar']);

    const search = await d.c.get('/api/shops?q=Kettle%00Lane');
    expect(search.status).toBe(400);
    expect(search.body.error.fieldErrors.q).toBeDefined();
    expect(await totalRows()).toBe(before);
  });

  it('when a date or a moment is in year 0000 or out of the years a season can have, then 400 at that field and nothing is written', async () => {
    const before = await totalRows();
    for (const date of ['0000-01-01', '0026-06-12', '2200-01-01']) {
      const res = await d.c.post('/api/events', { name: 'Typo round', date, conePenaltySec: 2 });
      expect(res.status, date).toBe(400);
      expect(res.body.error.fieldErrors.date).toEqual(['Use a year from 1900 to 2199']);
    }
    const run = await d.c.post('/api/runs', { id: '3f1c2b4a-5d6e-4f70-8a9b-0c1d2e3f4a5b', carId: d.carId, eventId: d.eventId, runNumber: 1, rawTimeSec: 45.6, cones: 0, status: 'finished', recordedAt: '0000-04-12T10:00:00Z' });
    expect(run.status).toBe(400);
    expect(run.body.error.fieldErrors.recordedAt).toEqual(['Use a year from 1900 to 2199']);
    expect(await totalRows()).toBe(before);
    // The edges themselves are dates.
    expect((await d.c.post('/api/events', { name: 'Old round', date: '1900-01-01', conePenaltySec: 2 })).status).toBe(201);
  });
});

/**
 * Bodies and queries shaped to trip the server's own code rather than the schemas: field names that are also the
 * names of every JavaScript object's built-in properties, and JSON nested far deeper than any form of ours.
 */
describe('field names and nesting that trip JavaScript itself', () => {
  /** Each of these names a property every plain object inherits, or its prototype; JSON.parse makes them own keys. */
  const INHERITED = ['constructor', '__proto__', 'toString', 'hasOwnProperty', 'valueOf'];
  const routes = () => listRoutes(t.app.locals.mounts as Mount[]);

  it('when a body carries fields named like built-in properties, on every POST, PUT and PATCH route, then no answer is a 500 and each name is reported as an unknown field', async () => {
    const before = await totalRows();
    const tokens = { driver: await d.c.csrf(), admin: await admin.c.csrf() };
    const payload = `{${INHERITED.map((k) => `"${k}":1`).join(',')}}`;
    let named = 0;
    for (const route of routes().filter((r) => /^(POST|PUT|PATCH) /.test(r) && !SKIP.has(r))) {
      const [method] = route.split(' ') as ['POST' | 'PUT' | 'PATCH'];
      const path = pathFor(route);
      const who = path.startsWith('/api/admin/') ? 'admin' : 'driver';
      const res = await (who === 'admin' ? admin.c : d.c).agent[method.toLowerCase() as 'post' | 'put' | 'patch'](path)
        .set('X-CSRF-Token', tokens[who])
        .set('Content-Type', 'application/json')
        .send(payload);
      expect(res.status, `${route} → ${JSON.stringify(res.body)}`).toBeLessThan(500);
      if (res.body.error?.fieldErrors?.constructor !== undefined && Array.isArray(res.body.error.fieldErrors.constructor)) {
        named++;
        for (const k of INHERITED) expect(Object.getOwnPropertyDescriptor(res.body.error.fieldErrors, k)?.value, `${route} ${k}`).toEqual(['Unknown field']);
      }
    }
    // A route whose schema refuses unknown fields says which: most of them do.
    expect(named).toBeGreaterThan(20);
    expect(await totalRows()).toBe(before);
  }, 120_000);

  it('when a query carries parameters named like built-in properties, on every GET route, then no answer is a 500', async () => {
    const query = INHERITED.filter((k) => k !== '__proto__').map((k) => `${k}=1`).join('&');
    for (const route of routes().filter((r) => r.startsWith('GET ') && !r.includes('/file'))) {
      const path = pathFor(route);
      const res = await (path.startsWith('/api/admin/') ? admin.c : d.c).get(`${path}?targetType=run&targetId=${d.eventId}&${query}`);
      expect(res.status, `${route} → ${JSON.stringify(res.body)}`).toBeLessThan(500);
    }
    const list = await d.c.get(`/api/attachments?targetType=event&targetId=${d.eventId}&constructor=1`);
    expect(list.status).toBe(400);
    expect(list.body.error.fieldErrors.constructor).toEqual(['Unknown field']);
  }, 120_000);

  it('when a GET route that reads a query is sent a parameter it does not know, then 400 names that parameter', async () => {
    const someId = '00000000-0000-4000-8000-000000000000';
    const paths = [
      '/api/admin/users?q=a',
      `/api/teams/${someId}/factors?season=2026`,
      `/api/teams/${someId}/board?season=2026`,
      '/api/shops?q=a',
      `/api/attachments?targetType=event&targetId=${d.eventId}`,
      `/api/comments?type=event&id=${d.eventId}`,
      `/api/runs?eventId=${d.eventId}`,
      `/api/shops/${someId}/work-orders?status=open`,
      `/api/cars/${d.carId}/season?minDepthMm=2`,
      `/api/cars/${d.carId}/analysis/scatter?x=damperClicks&y=time`,
      `/api/events/${d.eventId}/summary`,
    ];
    for (const path of paths) {
      const res = await (path.startsWith('/api/admin/') ? admin.c : d.c).get(`${path}${path.includes('?') ? '&' : '?'}sortBy=time`);
      expect(res.status, `${path} → ${JSON.stringify(res.body)}`).toBe(400);
      expect(res.body.error.fieldErrors, path).toEqual({ sortBy: ['Unknown field'] });
    }
  });

  it('when a body is nested thousands of levels deep, in a form or in a season file, then 400 says where it goes too deep and nothing is written', async () => {
    const before = await totalRows();
    const deep = `${'['.repeat(20_000)}${']'.repeat(20_000)}`;
    const token = await d.c.csrf();
    const bodies = { '/api/teams': `{"name":${deep}}`, '/api/cars/import': `{"format":"${SEASON_FILE_FORMAT}","version":${SEASON_FILE_VERSION},"name":${deep}}` };
    for (const [path, body] of Object.entries(bodies)) {
      const res = await d.c.agent.post(path).set('X-CSRF-Token', token).set('Content-Type', 'application/json').send(body);
      expect(res.status, path).toBe(400);
      const [where, messages] = Object.entries(res.body.error.fieldErrors as Record<string, string[]>).find(([, m]) => m[0]!.startsWith('Nested too deeply'))!;
      expect(where, path).toBe(['name', ...Array(31).fill('0')].join('.'));
      expect(messages, path).toEqual(['Nested too deeply: nothing here is more than 32 levels down']);
    }
    expect(await totalRows()).toBe(before);
  });
});

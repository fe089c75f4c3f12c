/**
 * Walks every API route with each kind of person and checks the answer. The expected
 * statuses are written out by hand, route by route; the server's own table
 * (ROUTE_ACCESS in server/auth/access-matrix.ts) must list the same routes. A route the
 * app answers that is missing from either table fails this test.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ROUTE_ACCESS } from '../../../server/auth/access-matrix';
import { listRoutes, type Mount } from '../../../server/lib/routes';
import { createInvitation } from '../../../server/features/invitations/invitation.service';
import { captureMail, client, makeTestApp, signedInClient, TEST_PASSWORD, type TestApp } from '../test-app';
import { runBody, setupBody, type Client } from '../season/season-fixtures';
import { startFakePayments, type FakePayments } from '../../../scripts/lib/fake-payments';
import { fakeSettings } from '../service/invoice-fixtures';

const ACTORS = ['owner', 'coDriver', 'otherDriver', 'grantedStaff', 'otherStaff', 'captain', 'member', 'admin', 'anon'] as const;
type Actor = (typeof ACTORS)[number];

let t: TestApp;
let mailboxDir: string;
let payments: FakePayments;
let f: Awaited<ReturnType<typeof makeFixture>>;
const people = {} as Record<Exclude<Actor, 'anon'>, { c: Client; id: string; email: string }>;

beforeAll(async () => {
  mailboxDir = mkdtempSync(join(tmpdir(), 'scrubline-mailbox-'));
  payments = await startFakePayments();
  t = await makeTestApp({ mail: captureMail().settings, mailboxDir, payments: fakeSettings(payments) });
  for (const actor of ACTORS) {
    if (actor === 'anon') continue;
    const s = await signedInClient(t, { isAdmin: actor === 'admin', displayName: `Test ${actor}` });
    people[actor] = { c: s.c, id: s.user.id, email: s.email };
  }
  f = await makeFixture();
});
afterAll(async () => {
  await t.close();
  await payments.stop();
  rmSync(mailboxDir, { recursive: true, force: true });
});

const sql = (text: string, params: unknown[] = []) => t.ds.query(text, params) as Promise<{ id: string }[]>;
const one = async (text: string, params: unknown[] = []) => (await sql(text, params))[0]!.id;

/**
 * The owner's car (with a co-driver, granted to one shop), its event, run, setups, tyre
 * set, tread reading, comment and an open suggestion; another shop; a team whose member
 * has entered a car of their own.
 */
async function makeFixture() {
  const p = people;
  const grantedShop = await one(`INSERT INTO shops (name) VALUES ('Granted shop') RETURNING id`);
  const otherShop = await one(`INSERT INTO shops (name) VALUES ('Other shop') RETURNING id`);
  await sql(`INSERT INTO shop_members (shop_id, user_id, is_shop_admin) VALUES ($1, $2, true), ($3, $4, true)`, [
    grantedShop, p.grantedStaff.id, otherShop, p.otherStaff.id,
  ]);
  const team = await one(`INSERT INTO teams (name) VALUES ('Test team') RETURNING id`);
  await sql(`INSERT INTO team_members (team_id, user_id, is_captain) VALUES ($1, $2, true), ($1, $3, false)`, [team, p.captain.id, p.member.id]);
  const memberCar = await one(`INSERT INTO cars (owner_id, name, class_code) VALUES ($1, 'Member car', 'SR') RETURNING id`, [p.member.id]);
  await sql(`INSERT INTO team_entries (team_id, car_id, class_code, entered_by) VALUES ($1, $2, 'SR', $3)`, [team, memberCar, p.member.id]);

  const car = await newCar();
  const event = await one(`INSERT INTO events (created_by, name, date) VALUES ($1, 'Test round', '2026-05-10') RETURNING id`, [p.owner.id]);
  const setup = await newSetup(car, '2026-05-01T00:00:00Z');
  const laterSetup = await newSetup(car, '2026-05-09T00:00:00Z');
  const run = await newRun(car, event);
  const tyreSet = await one(`INSERT INTO tyre_sets (car_id, label) VALUES ($1, 'Set A') RETURNING id`, [car]);
  const reading = await one(`INSERT INTO tread_readings (tyre_set_id, taken_at, created_by) VALUES ($1, '2026-05-10T12:00:00Z', $2) RETURNING id`, [tyreSet, p.owner.id]);
  const suggestion = await newSuggestion(car, setup, grantedShop);
  return { grantedShop, otherShop, team, memberCar, car, event, setup, laterSetup, run, tyreSet, reading, suggestion };

  async function newCar() {
    const id = await one(`INSERT INTO cars (owner_id, name, class_code) VALUES ($1, 'Owner car', 'SR') RETURNING id`, [p.owner.id]);
    await sql(`INSERT INTO car_co_drivers (car_id, user_id) VALUES ($1, $2)`, [id, p.coDriver.id]);
    await sql(`INSERT INTO shop_grants (car_id, shop_id, granted_by) VALUES ($1, $2, $3)`, [id, grantedShop, p.owner.id]);
    return id;
  }
}

async function newSetup(car: string, effectiveFrom = '2026-05-01T00:00:00Z') {
  const id = await one(`INSERT INTO setup_snapshots (car_id, label, effective_from, created_by) VALUES ($1, 'Base', $2, $3) RETURNING id`, [car, effectiveFrom, people.owner.id]);
  await sql(`INSERT INTO setup_corners (setup_id, corner, camber_deg) SELECT $1, c, -1.5 FROM unnest(ARRAY['lf','rf','lr','rr']) c`, [id]);
  return id;
}

async function newRun(car: string, event: string) {
  return one(
    `INSERT INTO runs (id, car_id, event_id, driver_id, run_number, raw_time_sec, status, recorded_at)
     VALUES ($1, $2, $3, $4, (SELECT coalesce(max(run_number), 0) + 1 FROM runs WHERE event_id = $3), 45.5, 'finished', '2026-05-10T10:00:00Z') RETURNING id`,
    [randomUUID(), car, event, people.owner.id],
  );
}

async function newReading(tyreSet: string) {
  return one(`INSERT INTO tread_readings (tyre_set_id, taken_at, created_by) VALUES ($1, '2026-05-10T13:00:00Z', $2) RETURNING id`, [tyreSet, people.owner.id]);
}

async function newChange(car: string) {
  return one(`INSERT INTO change_log (car_id, changed_on, what, location, created_by) VALUES ($1, '2026-05-01', 'New arms', 'front', $2) RETURNING id`, [car, people.owner.id]);
}

async function newSuggestion(car: string, setup: string, shop: string) {
  return one(
    `INSERT INTO setup_suggestions (id, car_id, base_setup_id, shop_id, author_id, title, rationale, changes)
     VALUES ($1, $2, $3, $4, $5, 'More front camber', 'Outer shoulders are wearing', $6) RETURNING id`,
    [randomUUID(), car, setup, shop, people.grantedStaff.id, JSON.stringify([{ field: 'camberDeg', corners: ['lf', 'rf'], delta: -0.5 }])],
  );
}

/** An open service visit on the car by the granted shop (work orders). */
async function newWorkOrder(car = f.car) {
  return one(
    `INSERT INTO work_orders (id, shop_id, car_id, opened_by, visit_date, requested_work) VALUES ($1, $2, $3, $4, '2026-06-12', 'Align') RETURNING id`,
    [randomUUID(), f.grantedShop, car, people.grantedStaff.id],
  );
}

/** A handed-over visit by the granted shop, with one labour line, and (unless told not to) its open invoice (invoices). */
async function closedWorkOrder(withInvoice = true) {
  const id = await one(
    `INSERT INTO work_orders (id, shop_id, car_id, opened_by, visit_date, requested_work, status, handover_at, closed_by)
     VALUES ($1, $2, $3, $4, '2026-06-12', 'Align', 'closed', '2026-06-12T16:00:00Z', $4) RETURNING id`,
    [randomUUID(), f.grantedShop, f.car, people.grantedStaff.id],
  );
  await sql(`INSERT INTO work_order_lines (work_order_id, kind, description, quantity, unit_price_cents, position) VALUES ($1, 'labour', 'Alignment', 1, 9000, 0)`, [id]);
  const invoice = withInvoice ? ((await people.grantedStaff.c.post(`/api/work-orders/${id}/invoice`)).body.id as string) : null;
  return { workOrder: id, invoice: invoice! };
}

async function newComment(run: string) {
  return one(`INSERT INTO comments (id, car_id, run_id, author_id, body) VALUES ($1, $2, $3, $4, 'Nice run') RETURNING id`, [
    randomUUID(), f.car, run, people.owner.id,
  ]);
}

/** One request: a method and path, and optionally a body; built fresh for every actor. */
interface Call {
  path: string;
  body?: object;
}
type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

/**
 * Expected statuses in ACTORS order:
 * owner, co-driver, other driver, granted shop's staff, other shop's staff, team captain, team member, admin, anonymous.
 */
type Expect = [number, number, number, number, number, number, number, number, number];

/** The statuses that follow from "the car's people and its shop read; others do not see it". */
const CAR_READ: Expect = [200, 200, 404, 200, 404, 404, 404, 404, 401];
const carWrite = (ok: number): Expect => [ok, ok, 404, 403, 404, 404, 404, 404, 401];
const carManage = (ok: number): Expect => [ok, 403, 404, 403, 404, 404, 404, 404, 401];
const signedIn = (ok: number): Expect => [ok, ok, ok, ok, ok, ok, ok, ok, 401];
const everyone = (ok: number): Expect => [ok, ok, ok, ok, ok, ok, ok, ok, ok];
const TEAM_READ: Expect = [404, 404, 404, 404, 404, 200, 200, 404, 401];
const teamManage = (ok: number): Expect => [404, 404, 404, 404, 404, ok, 403, 404, 401];
const SHOP_READ: Expect = [404, 404, 404, 200, 404, 404, 404, 404, 401];

type Build = (actor: Actor) => Promise<Call> | Call;
const ROUTES: Record<string, { call: Build; expect: Expect; fresh?: boolean }> = {
  'GET /api/health': { call: () => ({ path: '/api/health' }), expect: everyone(200) },

  'GET /api/auth/csrf': { call: () => ({ path: '/api/auth/csrf' }), expect: everyone(200) },
  'POST /api/auth/register': {
    call: () => ({ path: '/api/auth/register', body: { email: `new-${randomUUID().slice(0, 8)}@example.com`, password: 'a long enough pass phrase', displayName: 'New' } }),
    expect: everyone(201),
    fresh: true,
  },
  'POST /api/auth/login': {
    call: (a) => ({ path: '/api/auth/login', body: { email: a === 'anon' ? 'nobody@example.com' : people[a].email, password: 'not the password at all' } }),
    expect: everyone(401),
    fresh: true,
  },
  'POST /api/auth/logout': { call: () => ({ path: '/api/auth/logout' }), expect: everyone(204), fresh: true },
  'GET /api/auth/me': { call: () => ({ path: '/api/auth/me' }), expect: signedIn(200) },
  'GET /api/auth/session': { call: () => ({ path: '/api/auth/session' }), expect: everyone(200) },
  'PATCH /api/auth/me/preferences': { call: () => ({ path: '/api/auth/me/preferences', body: { units: { pressure: 'kPa' } } }), expect: signedIn(200) },
  // A wrong current password: every signed-in person reaches the check (400), no one's password changes.
  'POST /api/auth/me/password': {
    call: () => ({ path: '/api/auth/me/password', body: { currentPassword: 'not the password at all', newPassword: 'a long enough pass phrase' } }),
    expect: signedIn(400),
  },
  'GET /api/auth/me/email': { call: () => ({ path: '/api/auth/me/email' }), expect: signedIn(200) },
  // A wrong password (400 for everyone signed in): no address changes.
  'POST /api/auth/me/email': {
    call: () => ({ path: '/api/auth/me/email', body: { newEmail: 'someone-new@example.com', password: 'not the password at all' } }),
    expect: signedIn(400),
  },
  // A link that was never sent: 400 for everyone signed in.
  'POST /api/auth/me/email/confirm': { call: () => ({ path: '/api/auth/me/email/confirm', body: { token: 'x'.repeat(43) } }), expect: signedIn(400) },
  'GET /api/auth/me/export.json': { call: () => ({ path: '/api/auth/me/export.json' }), expect: signedIn(200) },
  // A wrong password: every signed-in person reaches the check (400), no account is closed.
  'POST /api/auth/me/close': { call: () => ({ path: '/api/auth/me/close', body: { password: 'not the password at all' } }), expect: signedIn(400) },
  'GET /api/auth/me/sessions': { call: () => ({ path: '/api/auth/me/sessions' }), expect: signedIn(200) },
  // A wrong password: every signed-in person reaches the check (400), no device is signed out.
  'POST /api/auth/me/sessions/end': { call: () => ({ path: '/api/auth/me/sessions/end', body: { password: 'not the password at all' } }), expect: signedIn(400) },
  'POST /api/auth/password-reset': { call: () => ({ path: '/api/auth/password-reset', body: { email: 'nobody@example.com' } }), expect: everyone(202) },
  'POST /api/auth/password-reset/confirm': {
    call: () => ({ path: '/api/auth/password-reset/confirm', body: { token: 'x'.repeat(43), password: 'a long enough pass phrase' } }),
    expect: everyone(400),
  },

  'GET /api/admin/users': { call: () => ({ path: '/api/admin/users' }), expect: [403, 403, 403, 403, 403, 403, 403, 200, 401] },
  // An account that does not exist: the admin gets past the role check to the lookup (404); no one is suspended.
  'POST /api/admin/users/:userId/suspend': {
    call: () => ({ path: `/api/admin/users/${randomUUID()}/suspend`, body: { note: 'Matrix check' } }),
    expect: [403, 403, 403, 403, 403, 403, 403, 404, 401],
  },
  'POST /api/admin/users/:userId/restore': {
    call: () => ({ path: `/api/admin/users/${randomUUID()}/restore`, body: {} }),
    expect: [403, 403, 403, 403, 403, 403, 403, 404, 401],
  },
  'POST /api/admin/users/:userId/close': {
    call: () => ({ path: `/api/admin/users/${randomUUID()}/close`, body: { email: 'nobody@example.com' } }),
    expect: [403, 403, 403, 403, 403, 403, 403, 404, 401],
  },
  'PUT /api/admin/users/:userId/admin': {
    call: () => ({ path: `/api/admin/users/${randomUUID()}/admin`, body: { isAdmin: true } }),
    expect: [403, 403, 403, 403, 403, 403, 403, 404, 401],
  },

  'POST /api/cars': { call: () => ({ path: '/api/cars', body: { name: 'Spare', classCode: 'SR' } }), expect: signedIn(201) },
  'GET /api/cars': { call: () => ({ path: '/api/cars' }), expect: signedIn(200) },
  'GET /api/cars/:carId': { call: () => ({ path: `/api/cars/${f.car}` }), expect: CAR_READ },
  'PATCH /api/cars/:carId': { call: () => ({ path: `/api/cars/${f.car}`, body: { version: 1, notes: 'Changed' } }), expect: carManage(200) },
  'DELETE /api/cars/:carId': { call: async () => ({ path: `/api/cars/${await freshCar()}` }), expect: carManage(204) },
  'POST /api/cars/:carId/co-drivers': {
    call: async () => {
      // A bystander account, so no actor becomes a co-driver (and sees the owner's events) as a side effect.
      const email = `bystander-${randomUUID().slice(0, 8)}@example.com`;
      await sql(`INSERT INTO users (email, display_name, password_hash) VALUES ($1, 'Bystander', 'x')`, [email]);
      return { path: `/api/cars/${await freshCar()}/co-drivers`, body: { email } };
    },
    expect: carManage(201),
  },
  'DELETE /api/cars/:carId/co-drivers/:userId': {
    call: async () => ({ path: `/api/cars/${await freshCar()}/co-drivers/${people.coDriver.id}` }),
    // The owner may remove anyone; a co-driver may take themselves off.
    expect: [204, 204, 404, 403, 404, 404, 404, 404, 401],
  },
  'GET /api/cars/:carId/shop-grants': { call: () => ({ path: `/api/cars/${f.car}/shop-grants` }), expect: CAR_READ },
  'POST /api/cars/:carId/shop-grants': {
    call: async () => ({ path: `/api/cars/${await freshCar()}/shop-grants`, body: { shopId: f.otherShop } }),
    expect: carManage(201),
  },
  'DELETE /api/cars/:carId/shop-grants/:shopId': {
    call: async () => ({ path: `/api/cars/${await freshCar()}/shop-grants/${f.grantedShop}` }),
    expect: carManage(204),
  },

  'POST /api/cars/:carId/setups': { call: () => ({ path: `/api/cars/${f.car}/setups`, body: setupBody({ label: 'Added' }) }), expect: carWrite(201) },
  'GET /api/cars/:carId/setups': { call: () => ({ path: `/api/cars/${f.car}/setups` }), expect: CAR_READ },
  'POST /api/cars/:carId/setups/quick-change': {
    call: () => ({
      path: `/api/cars/${f.car}/setups/quick-change`,
      body: { effectiveFrom: '2026-05-10T09:00:00Z', changes: [{ field: 'camberDeg', corners: ['lf', 'rf'], delta: -0.2 }] },
    }),
    expect: carWrite(201),
  },
  'GET /api/setups/:setupId': { call: () => ({ path: `/api/setups/${f.setup}` }), expect: CAR_READ },
  'PATCH /api/setups/:setupId': { call: async () => ({ path: `/api/setups/${await newSetup(f.car)}`, body: { version: 1, notes: 'x' } }), expect: carWrite(200) },
  'DELETE /api/setups/:setupId': { call: async () => ({ path: `/api/setups/${await newSetup(f.car, '2025-01-01T00:00:00Z')}` }), expect: carWrite(204) },
  'GET /api/setups/:setupId/runs': { call: () => ({ path: `/api/setups/${f.setup}/runs` }), expect: CAR_READ },
  'GET /api/setups/:a/diff/:b': { call: () => ({ path: `/api/setups/${f.setup}/diff/${f.laterSetup}` }), expect: CAR_READ },

  'POST /api/cars/:carId/changes': { call: () => ({ path: `/api/cars/${f.car}/changes`, body: { changedOn: '2026-05-01', what: 'New arms' } }), expect: carWrite(201) },
  'GET /api/cars/:carId/changes': { call: () => ({ path: `/api/cars/${f.car}/changes` }), expect: CAR_READ },
  'DELETE /api/cars/:carId/changes/:changeId': { call: async () => ({ path: `/api/cars/${f.car}/changes/${await newChange(f.car)}` }), expect: carWrite(204) },

  'GET /api/cars/:carId/tyre-sets': { call: () => ({ path: `/api/cars/${f.car}/tyre-sets` }), expect: CAR_READ },
  'POST /api/cars/:carId/tyre-sets': { call: () => ({ path: `/api/cars/${f.car}/tyre-sets`, body: { label: 'Set B' } }), expect: carWrite(201) },
  'GET /api/cars/:carId/pressures': { call: () => ({ path: `/api/cars/${f.car}/pressures` }), expect: CAR_READ },
  'POST /api/cars/:carId/pressures': {
    call: () => ({ path: `/api/cars/${f.car}/pressures`, body: { kind: 'cold', takenAt: '2026-05-10T08:00:00Z', corners: { lf: 200 } } }),
    expect: carWrite(201),
  },
  'GET /api/tyre-sets/:tyreSetId/readings': { call: () => ({ path: `/api/tyre-sets/${f.tyreSet}/readings` }), expect: CAR_READ },
  'DELETE /api/tyre-sets/:tyreSetId/readings/:readingId': {
    call: async () => ({ path: `/api/tyre-sets/${f.tyreSet}/readings/${await newReading(f.tyreSet)}` }),
    expect: carWrite(204),
  },
  'POST /api/tyre-sets/:tyreSetId/readings': {
    call: () => ({ path: `/api/tyre-sets/${f.tyreSet}/readings`, body: { takenAt: '2026-05-10T13:00:00Z', corners: { lf: { innerMm: 5, middleMm: 5.5, outerMm: 6 } } } }),
    expect: carWrite(201),
  },
  'POST /api/tyre-sets/:tyreSetId/mountings': {
    call: () => ({ path: `/api/tyre-sets/${f.tyreSet}/mountings`, body: { mountedAt: '2026-05-10T07:00:00Z', positions: { lf: 1, rf: 2, lr: 3, rr: 4 } } }),
    expect: carWrite(201),
  },

  'GET /api/cars/:carId/analysis/scatter': { call: () => ({ path: `/api/cars/${f.car}/analysis/scatter?x=camber&y=time` }), expect: CAR_READ },
  'GET /api/cars/:carId/analysis/compare': { call: () => ({ path: `/api/cars/${f.car}/analysis/compare?at=2026-05-05` }), expect: CAR_READ },
  'GET /api/cars/:carId/season': { call: () => ({ path: `/api/cars/${f.car}/season` }), expect: CAR_READ },

  'POST /api/events': { call: () => ({ path: '/api/events', body: { name: 'Another round', date: '2026-06-01' } }), expect: signedIn(201) },
  'GET /api/events': { call: () => ({ path: '/api/events' }), expect: signedIn(200) },
  'GET /api/events/:eventId': { call: () => ({ path: `/api/events/${f.event}` }), expect: CAR_READ },
  'GET /api/events/:eventId/summary': { call: () => ({ path: `/api/events/${f.event}/summary?carId=${f.car}` }), expect: CAR_READ },

  'POST /api/runs': {
    call: () => ({ path: '/api/runs', body: runBody(f.car, f.event, { runNumber: 100 + Math.floor(Math.random() * 800), recordedAt: '2026-05-10T11:00:00Z' }) }),
    expect: carWrite(201),
  },
  'GET /api/runs': { call: () => ({ path: '/api/runs' }), expect: signedIn(200) },
  'GET /api/runs/:runId': { call: () => ({ path: `/api/runs/${f.run}` }), expect: CAR_READ },
  'PATCH /api/runs/:runId': { call: async () => ({ path: `/api/runs/${await newRun(f.car, f.event)}`, body: { version: 1, cones: 1 } }), expect: carWrite(200) },
  'DELETE /api/runs/:runId': { call: async () => ({ path: `/api/runs/${await newRun(f.car, f.event)}` }), expect: carWrite(204) },

  'GET /api/comments': { call: () => ({ path: `/api/comments?type=run&id=${f.run}` }), expect: CAR_READ },
  'POST /api/comments': {
    call: () => ({ path: '/api/comments', body: { target: { type: 'run', id: f.run }, body: 'Looked quick through the slalom' } }),
    expect: [201, 201, 404, 201, 404, 404, 404, 404, 401],
  },
  'PATCH /api/comments/:commentId': {
    call: async () => ({ path: `/api/comments/${await newComment(f.run)}`, body: { body: 'Edited', version: 1 } }),
    // Only the author (the owner here) may edit; others who see the car get 403.
    expect: [200, 403, 404, 403, 404, 404, 404, 404, 401],
  },
  'DELETE /api/comments/:commentId': {
    call: async () => ({ path: `/api/comments/${await newComment(f.run)}` }),
    expect: [204, 403, 404, 403, 404, 404, 404, 404, 401],
  },

  'GET /api/notifications': { call: () => ({ path: '/api/notifications' }), expect: signedIn(200) },
  'GET /api/notifications/unread-count': { call: () => ({ path: '/api/notifications/unread-count' }), expect: signedIn(200) },
  'POST /api/notifications/read': { call: () => ({ path: '/api/notifications/read', body: { all: true } }), expect: signedIn(200) },

  'GET /api/cars/:carId/suggestions': { call: () => ({ path: `/api/cars/${f.car}/suggestions` }), expect: CAR_READ },
  'POST /api/cars/:carId/suggestions': {
    call: () => ({
      path: `/api/cars/${f.car}/suggestions`,
      body: { baseSetupId: f.setup, title: 'Less rear camber', rationale: 'Rear inner shoulders are wearing', changes: [{ field: 'camberDeg', corners: ['lr', 'rr'], delta: 0.3 }] },
    }),
    // Only the granted shop's staff suggest; the drivers see the car but may not.
    expect: [403, 403, 404, 201, 404, 404, 404, 404, 401],
  },
  'GET /api/suggestions/waiting': { call: () => ({ path: '/api/suggestions/waiting' }), expect: signedIn(200) },
  'GET /api/suggestions/:suggestionId': { call: () => ({ path: `/api/suggestions/${f.suggestion}` }), expect: CAR_READ },
  'POST /api/suggestions/:suggestionId/accept': {
    call: async () => ({
      path: `/api/suggestions/${await newSuggestion(f.car, f.setup, f.grantedShop)}/accept`,
      body: { effectiveFrom: '2026-05-11T08:00:00Z' },
    }),
    expect: [201, 201, 404, 403, 404, 404, 404, 404, 401],
  },
  'POST /api/suggestions/:suggestionId/decline': {
    call: async () => ({ path: `/api/suggestions/${await newSuggestion(f.car, f.setup, f.grantedShop)}/decline`, body: { note: 'Not this season' } }),
    expect: [200, 200, 404, 403, 404, 404, 404, 404, 401],
  },

  'GET /api/shops': { call: () => ({ path: '/api/shops' }), expect: signedIn(200) },
  'POST /api/shops': { call: () => ({ path: '/api/shops', body: { name: 'Brand new shop' } }), expect: signedIn(201), fresh: true },
  'GET /api/shops/mine': { call: () => ({ path: '/api/shops/mine' }), expect: signedIn(200) },
  'GET /api/shops/:shopId': { call: () => ({ path: `/api/shops/${f.grantedShop}` }), expect: SHOP_READ },
  'GET /api/shops/:shopId/customers': { call: () => ({ path: `/api/shops/${f.grantedShop}/customers` }), expect: SHOP_READ },
  'POST /api/shops/:shopId/invitations': {
    call: () => ({ path: `/api/shops/${f.grantedShop}/invitations`, body: { email: `staff-${randomUUID().slice(0, 8)}@example.com` } }),
    expect: [404, 404, 404, 201, 404, 404, 404, 404, 401],
  },
  'DELETE /api/shops/:shopId/staff/:userId': {
    call: async () => {
      const u = await one(`INSERT INTO users (email, display_name, password_hash) VALUES ($1, 'Extra staff', 'x') RETURNING id`, [`extra-${randomUUID()}@example.com`]);
      await sql(`INSERT INTO shop_members (shop_id, user_id) VALUES ($1, $2)`, [f.grantedShop, u]);
      return { path: `/api/shops/${f.grantedShop}/staff/${u}` };
    },
    expect: [404, 404, 404, 204, 404, 404, 404, 404, 401],
  },

  'POST /api/teams': { call: () => ({ path: '/api/teams', body: { name: 'Brand new team' } }), expect: signedIn(201), fresh: true },
  'GET /api/teams/mine': { call: () => ({ path: '/api/teams/mine' }), expect: signedIn(200) },
  'GET /api/teams/:teamId': { call: () => ({ path: `/api/teams/${f.team}` }), expect: TEAM_READ },
  'POST /api/teams/:teamId/invitations': {
    call: () => ({ path: `/api/teams/${f.team}/invitations`, body: { email: `member-${randomUUID().slice(0, 8)}@example.com` } }),
    expect: teamManage(201),
  },
  'PATCH /api/teams/:teamId/members/:userId': {
    call: () => ({ path: `/api/teams/${f.team}/members/${people.member.id}`, body: { isCaptain: false } }),
    expect: teamManage(200),
  },
  'DELETE /api/teams/:teamId/members/:userId': {
    call: async () => {
      const u = await one(`INSERT INTO users (email, display_name, password_hash) VALUES ($1, 'Extra member', 'x') RETURNING id`, [`extra-${randomUUID()}@example.com`]);
      await sql(`INSERT INTO team_members (team_id, user_id) VALUES ($1, $2)`, [f.team, u]);
      return { path: `/api/teams/${f.team}/members/${u}` };
    },
    // Captains remove members; a member may remove only themself.
    expect: teamManage(204),
  },
  'POST /api/teams/:teamId/entries': {
    call: () => ({ path: `/api/teams/${f.team}/entries`, body: { carId: f.memberCar, classCode: 'SR', sharing: 'results' } }),
    // Only the car's owner (the member) can enter it; the captain is told to pick one of their own cars.
    expect: [404, 404, 404, 404, 404, 400, 200, 404, 401],
  },
  'PATCH /api/teams/:teamId/entries/:carId': {
    call: () => ({ path: `/api/teams/${f.team}/entries/${f.memberCar}`, body: { sharing: 'results_and_setup' } }),
    expect: [404, 404, 404, 404, 404, 403, 200, 404, 401],
  },
  'DELETE /api/teams/:teamId/entries/:carId': {
    call: async () => {
      const car = await one(`INSERT INTO cars (owner_id, name, class_code) VALUES ($1, 'Spare entry', 'SR') RETURNING id`, [people.member.id]);
      await sql(`INSERT INTO team_entries (team_id, car_id, class_code, entered_by) VALUES ($1, $2, 'SR', $3)`, [f.team, car, people.member.id]);
      return { path: `/api/teams/${f.team}/entries/${car}` };
    },
    // The owner withdraws their entry; a captain may withdraw any.
    expect: [404, 404, 404, 404, 404, 204, 204, 404, 401],
  },
  'GET /api/teams/:teamId/factors': { call: () => ({ path: `/api/teams/${f.team}/factors?season=2026` }), expect: TEAM_READ },
  'PUT /api/teams/:teamId/factors': {
    call: () => ({ path: `/api/teams/${f.team}/factors`, body: { season: 2026, classCode: 'SR', factor: 0.85 } }),
    expect: teamManage(200),
  },
  'GET /api/teams/:teamId/board': { call: () => ({ path: `/api/teams/${f.team}/board?season=2026` }), expect: TEAM_READ },

  // Service visits (work orders): the granted shop's staff open and edit them; the car's drivers read them.
  'POST /api/cars/:carId/work-orders': {
    call: () => ({ path: `/api/cars/${f.car}/work-orders`, body: { visitDate: '2026-06-12', requestedWork: 'Align' } }),
    expect: [403, 403, 404, 201, 404, 404, 404, 404, 401],
  },
  'GET /api/cars/:carId/work-orders': { call: () => ({ path: `/api/cars/${f.car}/work-orders` }), expect: CAR_READ },
  'GET /api/shops/:shopId/work-orders': { call: () => ({ path: `/api/shops/${f.grantedShop}/work-orders?status=open` }), expect: SHOP_READ },
  'GET /api/work-orders/:workOrderId': { call: async () => ({ path: `/api/work-orders/${await newWorkOrder()}` }), expect: CAR_READ },
  'PATCH /api/work-orders/:workOrderId': {
    call: async () => ({ path: `/api/work-orders/${await newWorkOrder()}`, body: { notes: 'Checked', version: 1 } }),
    expect: [403, 403, 404, 200, 404, 404, 404, 404, 401],
  },
  'PUT /api/work-orders/:workOrderId/lines': {
    call: async () => ({
      path: `/api/work-orders/${await newWorkOrder()}/lines`,
      body: { lines: [{ kind: 'labour', description: 'Alignment', quantity: 1, unitPriceCents: 9000 }] },
    }),
    expect: [403, 403, 404, 200, 404, 404, 404, 404, 401],
  },
  'PUT /api/work-orders/:workOrderId/measurements/:stage': {
    call: async () => ({
      path: `/api/work-orders/${await newWorkOrder()}/measurements/before`,
      body: { driverInCar: false, corners: { lf: { camberDeg: -1.1 } } },
    }),
    expect: [403, 403, 404, 200, 404, 404, 404, 404, 401],
  },
  'PUT /api/work-orders/:workOrderId/build-sheet': {
    call: async () => ({ path: `/api/work-orders/${await newWorkOrder()}/build-sheet`, body: { corners: { lf: { strokeMm: 110 } } } }),
    expect: [403, 403, 404, 200, 404, 404, 404, 404, 401],
  },
  'POST /api/work-orders/:workOrderId/close': {
    call: async () => ({ path: `/api/work-orders/${await newWorkOrder()}/close`, body: { handoverAt: '2026-06-12T16:00:00Z' } }),
    expect: [403, 403, 404, 200, 404, 404, 404, 404, 401],
  },

  // Invoices and payment: the visit's shop invoices and takes cash; the car's drivers pay online.
  'PATCH /api/shops/:shopId/settings': {
    call: () => ({ path: `/api/shops/${f.grantedShop}/settings`, body: { taxRatePct: 8.25 } }),
    expect: [404, 404, 404, 200, 404, 404, 404, 404, 401],
  },
  'POST /api/work-orders/:workOrderId/invoice': {
    call: async () => ({ path: `/api/work-orders/${(await closedWorkOrder(false)).workOrder}/invoice` }),
    expect: [403, 403, 404, 201, 404, 404, 404, 404, 401],
  },
  'GET /api/work-orders/:workOrderId/invoice': { call: async () => ({ path: `/api/work-orders/${(await closedWorkOrder()).workOrder}/invoice` }), expect: CAR_READ },
  'GET /api/invoices/:invoiceId': { call: async () => ({ path: `/api/invoices/${(await closedWorkOrder()).invoice}` }), expect: CAR_READ },
  'GET /api/shops/:shopId/invoices': { call: () => ({ path: `/api/shops/${f.grantedShop}/invoices` }), expect: [404, 404, 404, 200, 404, 404, 404, 404, 401] },
  'POST /api/invoices/:invoiceId/checkout': {
    call: async () => ({ path: `/api/invoices/${(await closedWorkOrder()).invoice}/checkout` }),
    expect: [200, 200, 404, 403, 404, 404, 404, 404, 401],
  },
  'POST /api/invoices/:invoiceId/mark-paid': {
    call: async () => ({ path: `/api/invoices/${(await closedWorkOrder()).invoice}/mark-paid`, body: { method: 'cash' } }),
    expect: [403, 403, 404, 200, 404, 404, 404, 404, 401],
  },
  // No session: the payment service's signature is the check, and an unsigned call is refused for everyone.
  'POST /api/payments/webhook': { call: () => ({ path: '/api/payments/webhook', body: { id: 'evt_unsigned', type: 'checkout.session.completed' } }), expect: everyone(400) },

  'GET /api/invitations/:token': {
    call: async () => ({ path: `/api/invitations/${await invitationFor('someone@example.com')}` }),
    expect: everyone(200),
  },
  'POST /api/invitations/:token/accept': {
    // Each actor accepts an invitation sent to their own address.
    call: async (a) => ({ path: `/api/invitations/${await invitationFor(a === 'anon' ? 'anon@example.com' : people[a].email)}/accept` }),
    expect: signedIn(200),
  },
  'POST /api/unsubscribe/:token': {
    call: async () => {
      const rows: { unsubscribe_token: string }[] = await t.ds.query(
        `INSERT INTO users (email, display_name, password_hash) VALUES ($1, 'Reader', 'x') RETURNING unsubscribe_token`,
        [`reader-${randomUUID()}@example.com`],
      );
      return { path: `/api/unsubscribe/${rows[0]!.unsubscribe_token}` };
    },
    expect: everyone(204),
  },

  // Timing-sheet import: the car's drivers add runs; the shop reads only. Each actor imports the same run, so repeats are "already there".
  'POST /api/events/:eventId/imports': {
    call: () => ({ path: `/api/events/${f.event}/imports`, body: { carId: f.car, runs: [{ line: 2, runNumber: 900, status: 'finished', rawTimeSec: 47.25, cones: 0 }] } }),
    expect: carWrite(200),
  },

  // Season export: whoever reads the car downloads it; an import makes a new car of the importer's own.
  'GET /api/cars/:carId/export.csv': { call: () => ({ path: `/api/cars/${f.car}/export.csv` }), expect: CAR_READ },
  'GET /api/cars/:carId/export.json': { call: () => ({ path: `/api/cars/${f.car}/export.json` }), expect: CAR_READ },
  'POST /api/cars/import': {
    call: () => ({ path: '/api/cars/import', body: { format: 'scrubline-season', version: 1, car: { id: 'c1', name: 'Imported', classCode: 'SR' } } }),
    expect: signedIn(201),
  },

  // Uploads. The POST here names the run in its query and sends no files: the car's drivers pass the access
  // check and are told to choose a file (400); the shop may not add files (403). Real uploads are in tests/server/files.
  'POST /api/attachments': {
    call: () => ({ path: `/api/attachments?targetType=run&targetId=${f.run}` }),
    expect: [400, 400, 404, 403, 404, 404, 404, 404, 401],
  },
  'GET /api/attachments': { call: () => ({ path: `/api/attachments?targetType=run&targetId=${f.run}` }), expect: CAR_READ },
  'GET /api/attachments/:attachmentId/file': { call: async () => ({ path: `/api/attachments/${await ownerAttachment()}/file` }), expect: CAR_READ },
  'GET /api/attachments/:attachmentId/thumbnail': { call: async () => ({ path: `/api/attachments/${await ownerAttachment()}/thumbnail` }), expect: CAR_READ },
  'DELETE /api/attachments/:attachmentId': {
    call: async () => ({ path: `/api/attachments/${await newAttachment()}` }),
    // The uploader (here the owner, who is also the car's owner) deletes; the co-driver and the shop see it but may not.
    expect: [204, 403, 404, 403, 404, 404, 404, 404, 401],
  },

  // Mounted only outside production (see the production-config test); here it is on.
  'GET /api/dev/mailbox': { call: () => ({ path: '/api/dev/mailbox' }), expect: everyone(200) },
  'DELETE /api/dev/mailbox': { call: () => ({ path: '/api/dev/mailbox' }), expect: everyone(204) },
};

/** A 1 × 1 PNG (uploads). */
const TINY_PNG = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAQAAAC1HAwCAAAAC0lEQVR42mNkYAAAAAYAAjCB0C8AAAAASUVORK5CYII=', 'base64');

/** A photo the owner attached to the fixture's run (uploads). */
async function newAttachment() {
  const c = people.owner.c;
  const res = await c.agent.post(`/api/attachments?targetType=run&targetId=${f.run}`).set('X-CSRF-Token', await c.csrf())
    .attach('files', TINY_PNG, 'wear.png');
  expect(res.status).toBe(201);
  return (res.body as { items: { id: string }[] }).items[0]!.id;
}
let sharedAttachment: Promise<string> | undefined;
const ownerAttachment = () => (sharedAttachment ??= newAttachment());

async function freshCar() {
  const id = await one(`INSERT INTO cars (owner_id, name, class_code) VALUES ($1, 'Fresh car', 'SR') RETURNING id`, [people.owner.id]);
  await sql(`INSERT INTO car_co_drivers (car_id, user_id) VALUES ($1, $2)`, [id, people.coDriver.id]);
  await sql(`INSERT INTO shop_grants (car_id, shop_id, granted_by) VALUES ($1, $2, $3)`, [id, f.grantedShop, people.owner.id]);
  return id;
}

/** A new shop invitation for `email`; answers the token from the link. */
async function invitationFor(email: string) {
  const { settings, sent } = captureMail();
  await createInvitation(t.ds, settings, { teamId: f.team, email, asAdmin: false, invitedBy: { id: people.captain.id, displayName: 'Test captain' } });
  const link = /\/invitations\/([A-Za-z0-9_-]+)/.exec(sent[0]!.text)?.[1];
  if (!link) throw new Error('The invitation e-mail has no link');
  return link;
}

async function clientFor(actor: Actor, fresh: boolean): Promise<Client> {
  if (actor === 'anon') return client(t.app);
  if (!fresh) return people[actor].c;
  // Routes that change who is signed in get a second session of their own.
  const c = client(t.app);
  const res = await c.post('/api/auth/login', { email: people[actor].email, password: TEST_PASSWORD });
  expect(res.status).toBe(200);
  return c;
}

async function send(c: Client, method: Method, call: Call) {
  switch (method) {
    case 'GET':
      return c.get(call.path);
    case 'POST':
      return c.post(call.path, call.body ?? {});
    case 'PUT':
      return c.put(call.path, call.body ?? {});
    case 'PATCH':
      return c.patch(call.path, call.body ?? {});
    case 'DELETE':
      return c.delete(call.path);
  }
}

describe('the authorization matrix', () => {
  it('lists every route the app answers, in both the server table and this test, and no route that does not exist', () => {
    const routes = listRoutes(t.app.locals.mounts as Mount[]);
    expect(routes.length).toBeGreaterThan(80);
    expect(routes.filter((r) => !(r in ROUTE_ACCESS)), 'routes missing from ROUTE_ACCESS').toEqual([]);
    expect(routes.filter((r) => !(r in ROUTES)), 'routes missing from this test').toEqual([]);
    expect(Object.keys(ROUTE_ACCESS).filter((r) => !routes.includes(r)), 'ROUTE_ACCESS rows with no route').toEqual([]);
  });

  it.each(Object.keys(ROUTES))('%s answers each person as expected', async (route) => {
    const spec = ROUTES[route]!;
    const method = route.split(' ')[0] as Method;
    const got: Record<string, number> = {};
    const want: Record<string, number> = {};
    for (const [i, actor] of ACTORS.entries()) {
      const c = await clientFor(actor, !!spec.fresh);
      const res = await send(c, method, await spec.call(actor));
      got[actor] = res.status;
      want[actor] = spec.expect[i]!;
      // Nothing is ever a crash, and every refusal uses the one error envelope.
      if (res.status >= 400) expect(res.body, `${route} as ${actor}`).toHaveProperty('error.code');
    }
    expect(got).toEqual(want);
  });
});

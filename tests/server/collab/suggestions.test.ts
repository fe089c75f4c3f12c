/**
 * Setup suggestions from a granted shop. The numbers are only arithmetic on the stored
 * values (a −0.5° camber change on −1.5° gives −2.0°); the limits they are checked against
 * are the app's own plausibility ranges, not advice. Real alignment changes are for the
 * car's manufacturer specifications, the event's rules and a qualified technician.
 */
import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { addCoDriver, countOf, expectError, expectFieldErrors, postSetup, setupBody } from '../season/season-fixtures';
import { grantedCar, SHOP_NAME, shopWithAdmin } from './shop-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const base = setupBody();
const suggestionsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM setup_suggestions WHERE car_id = $1', [carId]);
const setupsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM setup_snapshots WHERE car_id = $1', [carId]);

const SUGGESTION = {
  title: 'More front bite',
  rationale: 'Outside front shoulders are wearing and the nose washes wide in the slalom.',
  changes: [
    { field: 'camberDeg', corners: ['lf', 'rf'], delta: -0.5 },
    { field: 'damperClicks', corners: ['lr', 'rr'], value: 8 },
  ],
};

/** A granted car with the baseline setup (camber −1.5° front, rear clicks 6 on a 12-click adjuster), a co-driver, and an open suggestion. */
async function carWithSuggestion() {
  const g = await grantedCar(t);
  const co = await addCoDriver(t, g.driver);
  const setup = await postSetup(g.driver.c, g.driver.carId);
  const res = await g.staff.c.post(`/api/cars/${g.driver.carId}/suggestions`, { ...SUGGESTION, baseSetupId: setup.id });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return { ...g, co, setup, suggestion: res.body as { id: string } & Record<string, unknown> };
}

describe('POST /api/cars/:carId/suggestions', () => {
  it('when staff of a granted shop suggest, then 201, open, signed with the shop, with each change previewed from the base', async () => {
    const { driver, staff, shopId, setup, suggestion } = await carWithSuggestion();
    expect(suggestion).toEqual({
      id: expect.any(String),
      carId: driver.carId,
      baseSetup: { id: setup.id, label: 'Baseline', effectiveFrom: '2026-04-01T00:00:00.000Z' },
      shop: { id: shopId, name: SHOP_NAME },
      author: { id: staff.user.id, displayName: 'Dusty Okonjo' },
      title: SUGGESTION.title,
      rationale: SUGGESTION.rationale,
      changes: SUGGESTION.changes,
      // −1.5° + (−0.5°) = −2.0°; clicks set to 8 from 6 (plain arithmetic on the baseline).
      preview: [
        { field: 'camberDeg', corner: 'lf', from: base.corners.lf.camberDeg, to: -2 },
        { field: 'camberDeg', corner: 'rf', from: base.corners.rf.camberDeg, to: -2 },
        { field: 'damperClicks', corner: 'lr', from: base.corners.lr.damperClicks, to: 8 },
        { field: 'damperClicks', corner: 'rr', from: base.corners.rr.damperClicks, to: 8 },
      ],
      // The base is the setup in force now, so there is nothing newer to work the changes out against.
      now: null,
      recorded: null,
      status: 'open',
      decidedBy: null,
      decidedAt: null,
      decisionNote: null,
      acceptedSetupId: null,
      createdAt: expect.any(String),
    });
    const read = await driver.c.get(`/api/suggestions/${suggestion.id}`);
    expect(read.status).toBe(200);
    expect(read.body).toEqual(suggestion);
  });

  it('when the owner or a co-driver suggest, then 403; another driver or another shop gets 404; nothing is written', async () => {
    const { driver, co, setup } = await carWithSuggestion();
    const url = `/api/cars/${driver.carId}/suggestions`;
    const body = { ...SUGGESTION, baseSetupId: setup.id };
    expectError(await driver.c.post(url, body), 403, 'forbidden');
    expectError(await co.c.post(url, body), 403, 'forbidden');
    expectError(await (await signedInClient(t)).c.post(url, body), 404, 'not_found');
    expectError(await (await shopWithAdmin(t, 'Upland Motorsport')).admin.c.post(url, body), 404, 'not_found');
    expect(await suggestionsOf(driver.carId)).toBe(1);
  });

  it('when the base setup belongs to another car or does not exist, then 400 at baseSetupId and nothing is written', async () => {
    const { driver, staff } = await grantedCar(t);
    await postSetup(driver.c, driver.carId);
    const other = await grantedCar(t);
    const foreign = await postSetup(other.driver.c, other.driver.carId);
    const url = `/api/cars/${driver.carId}/suggestions`;
    expectFieldErrors(await staff.c.post(url, { ...SUGGESTION, baseSetupId: foreign.id }), ['baseSetupId']);
    expectFieldErrors(await staff.c.post(url, { ...SUGGESTION, baseSetupId: randomUUID() }), ['baseSetupId']);
    expect(await suggestionsOf(driver.carId)).toBe(0);
  });

  it('when a change takes a value out of range, past the car\'s adjuster, or nudges a value never recorded, then 400 naming each change and nothing is written', async () => {
    const { driver, staff } = await grantedCar(t);
    const setup = await postSetup(driver.c, driver.carId);
    const res = await staff.c.post(`/api/cars/${driver.carId}/suggestions`, {
      ...SUGGESTION,
      baseSetupId: setup.id,
      changes: [
        // −1.5° − 9° = −10.5°, below the −10° the app accepts.
        { field: 'camberDeg', corners: ['lf'], delta: -9 },
        // The car's rear adjuster has 12 clicks.
        { field: 'damperClicks', corners: ['lr', 'rr'], value: 13 },
        // No caster was recorded on the base.
        { field: 'casterDeg', corners: ['lf'], delta: 1 },
        { field: 'toeMm', corners: ['rf'], delta: 0.5 },
      ],
    });
    const errors = expectFieldErrors(res, ['changes.0.delta', 'changes.1.value', 'changes.2.delta']);
    expect(errors['changes.0.delta']![0]).toMatch(/LF: Camber must be between -10 and 5/);
    expect(errors['changes.1.value']!.join(' ')).toMatch(/12 clicks/);
    expect(errors['changes.2.delta']![0]).toMatch(/No current caster on LF/);
    expect(await suggestionsOf(driver.carId)).toBe(0);
  });

  it('when a change of clicks or rebound clicks names corners whose dampers lack that adjuster, then 400 at that change\'s corners and nothing is written', async () => {
    const { driver, staff } = await grantedCar(t);
    // Fixed rear dampers, and a base that records no rear clicks and no rebound clicks anywhere.
    expect((await driver.c.patch(`/api/cars/${driver.carId}`, { version: 1, damperAdjusters: { rear: null } })).status).toBe(200);
    const setup = await postSetup(driver.c, driver.carId, {
      corners: { lf: { camberDeg: -1.5, damperClicks: 4 }, rf: { camberDeg: -1.5, damperClicks: 4 }, lr: { camberDeg: -1 }, rr: { camberDeg: -1 } },
    });
    const res = await staff.c.post(`/api/cars/${driver.carId}/suggestions`, {
      ...SUGGESTION,
      baseSetupId: setup.id,
      changes: [
        { field: 'camberDeg', corners: ['lf', 'rf'], delta: -0.5 },
        { field: 'damperClicks', corners: ['lf', 'lr', 'rr'], value: 5 },
        { field: 'damperReboundClicks', corners: ['rf'], value: 3 },
      ],
    });
    const errors = expectFieldErrors(res, ['changes.1.corners', 'changes.2.corners']);
    expect(errors['changes.1.corners']).toEqual(['LR and RR have no damper adjuster on this car']);
    expect(errors['changes.2.corners']).toEqual(['RF has no rebound adjuster on this car']);
    expect(await suggestionsOf(driver.carId)).toBe(0);
    expect(await countOf(t, 'SELECT count(*) AS n FROM notifications WHERE car_id = $1 AND kind = $2', [driver.carId, 'suggestion'])).toBe(0);
  });

  it('when the car describes a rebound adjuster on the front, then rebound clicks are accepted there, within its own clicks, and still refused on the rear', async () => {
    const { driver, staff } = await grantedCar(t);
    // 12 clicks counted from full soft, and a rebound adjuster of 20 from full stiff; the base records no rebound clicks.
    const front = { positions: 12, countFrom: 'full_soft', rebound: { positions: 20, countFrom: 'full_stiff' } };
    expect((await driver.c.patch(`/api/cars/${driver.carId}`, { version: 1, damperAdjusters: { front } })).status).toBe(200);
    const setup = await postSetup(driver.c, driver.carId);
    const url = `/api/cars/${driver.carId}/suggestions`;

    const rear = await staff.c.post(url, { ...SUGGESTION, baseSetupId: setup.id, changes: [{ field: 'damperReboundClicks', corners: ['lr', 'rr'], value: 8 }] });
    expect(expectFieldErrors(rear, ['changes.0.corners'])['changes.0.corners']).toEqual(['LR and RR have no rebound adjuster on this car']);
    // 21 is past the rebound adjuster's 20.
    expectFieldErrors(await staff.c.post(url, { ...SUGGESTION, baseSetupId: setup.id, changes: [{ field: 'damperReboundClicks', corners: ['lf'], value: 21 }] }), [
      'changes.0.value',
    ]);
    expect(await suggestionsOf(driver.carId)).toBe(0);

    // 16 is past the front's 12 clicks but within its rebound adjuster's 20.
    const res = await staff.c.post(url, { ...SUGGESTION, baseSetupId: setup.id, changes: [{ field: 'damperReboundClicks', corners: ['lf', 'rf'], value: 16 }] });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.preview).toEqual([
      { field: 'damperReboundClicks', corner: 'lf', from: null, to: 16 },
      { field: 'damperReboundClicks', corner: 'rf', from: null, to: 16 },
    ]);
    expect(await suggestionsOf(driver.carId)).toBe(1);
  });

  it('when a change gives both a delta and a value, names an unknown field, or has no corners, then 400 at that change', async () => {
    const { driver, staff } = await grantedCar(t);
    const setup = await postSetup(driver.c, driver.carId);
    const url = `/api/cars/${driver.carId}/suggestions`;
    expectFieldErrors(await staff.c.post(url, { ...SUGGESTION, baseSetupId: setup.id, changes: [{ field: 'camberDeg', corners: ['lf'], delta: -0.5, value: -2 }] }), [
      'changes.0.delta',
    ]);
    expectFieldErrors(await staff.c.post(url, { ...SUGGESTION, baseSetupId: setup.id, changes: [{ field: 'wingDeg', corners: ['lf'], delta: 1 }] }), ['changes.0.field']);
    expectFieldErrors(await staff.c.post(url, { ...SUGGESTION, baseSetupId: setup.id, changes: [{ field: 'toeMm', corners: [], delta: 1 }] }), ['changes.0.corners']);
    expectFieldErrors(await staff.c.post(url, { baseSetupId: setup.id, title: '', rationale: '', changes: [] }), ['title', 'rationale', 'changes']);
    expect(await suggestionsOf(driver.carId)).toBe(0);
  });

  it('when the same client-made id is sent twice, then 201 then 200 with the same suggestion, stored and notified once', async () => {
    const { driver, staff } = await grantedCar(t);
    const setup = await postSetup(driver.c, driver.carId);
    const body = { ...SUGGESTION, id: randomUUID(), baseSetupId: setup.id };
    const first = await staff.c.post(`/api/cars/${driver.carId}/suggestions`, body);
    const again = await staff.c.post(`/api/cars/${driver.carId}/suggestions`, body);
    expect([first.status, again.status]).toEqual([201, 200]);
    expect(again.body).toEqual(first.body);
    expect(await suggestionsOf(driver.carId)).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM notifications WHERE suggestion_id = $1', [body.id])).toBe(1);
  });
});

describe('GET /api/cars/:carId/suggestions', () => {
  it('when a car has several suggestions, then they come newest first to its drivers and its shop; others get 404', async () => {
    const { driver, staff, co, setup, suggestion } = await carWithSuggestion();
    const later = await staff.c.post(`/api/cars/${driver.carId}/suggestions`, { ...SUGGESTION, title: 'Softer rear', baseSetupId: setup.id });
    const url = `/api/cars/${driver.carId}/suggestions`;
    for (const c of [driver.c, co.c, staff.c]) {
      const res = await c.get(url);
      expect(res.status).toBe(200);
      expect(res.body.items.map((s: { id: string }) => s.id)).toEqual([later.body.id, suggestion.id]);
      expect(res.body.items[1]).toEqual(suggestion);
    }
    const other = await signedInClient(t);
    expectError(await other.c.get(url), 404, 'not_found');
    expectError(await other.c.get(`/api/suggestions/${suggestion.id}`), 404, 'not_found');
  });
});

describe('a suggestion read after the car\'s setup changed', () => {
  it('when the setup in force now lacks a value the changes step from, then `now` says why accepting would be refused', async () => {
    const { driver, staff, suggestion } = await carWithSuggestion();
    // Handed back with no front camber recorded: "−0.5° from nothing" cannot be worked out.
    await postSetup(driver.c, driver.carId, {
      label: 'No camber noted',
      effectiveFrom: '2026-05-01T00:00:00Z',
      corners: { ...base.corners, lf: { ...base.corners.lf, camberDeg: null }, rf: { ...base.corners.rf, camberDeg: null } },
    });
    const open = (await staff.c.get(`/api/suggestions/${suggestion.id}`)).body;
    expect(open.now.problems).toEqual([
      'No current camber on LF to change; give a value instead',
      'No current camber on RF to change; give a value instead',
    ]);
  });

  it('when a newer setup is in force, then the suggestion names it and works the changes out against it; once accepted, it shows the setup recorded', async () => {
    const { driver, staff, setup, suggestion } = await carWithSuggestion();
    // A visit hands the car back with −1.8° front camber, in force from 1 May (before today).
    const handedBack = await postSetup(driver.c, driver.carId, {
      label: 'As handed back',
      effectiveFrom: '2026-05-01T00:00:00Z',
      corners: { ...base.corners, lf: { ...base.corners.lf, camberDeg: -1.8 }, rf: { ...base.corners.rf, camberDeg: -1.8 } },
    });
    const open = (await staff.c.get(`/api/suggestions/${suggestion.id}`)).body;
    // What was suggested stays as it was: −1.5° − 0.5° = −2.0° on the base.
    expect(open.preview[0]).toEqual({ field: 'camberDeg', corner: 'lf', from: -1.5, to: -2 });
    // What accepting now records: −1.8° − 0.5° = −2.3° (plain arithmetic on the setup in force).
    expect(open.now).toEqual({
      setup: { id: handedBack.id, label: 'As handed back', effectiveFrom: '2026-05-01T00:00:00.000Z' },
      preview: [
        { field: 'camberDeg', corner: 'lf', from: -1.8, to: -2.3 },
        { field: 'camberDeg', corner: 'rf', from: -1.8, to: -2.3 },
        { field: 'damperClicks', corner: 'lr', from: base.corners.lr.damperClicks, to: 8 },
        { field: 'damperClicks', corner: 'rr', from: base.corners.rr.damperClicks, to: 8 },
      ],
      problems: [],
    });
    expect(open.recorded).toBeNull();
    const listed = (await driver.c.get(`/api/cars/${driver.carId}/suggestions`)).body.items[0];
    expect(listed.now).toEqual(open.now);

    const setupId = randomUUID();
    const res = await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, { setupId, effectiveFrom: '2026-05-10T08:00:00Z' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const accepted = (await staff.c.get(`/api/suggestions/${suggestion.id}`)).body;
    expect(accepted.now).toBeNull();
    expect(accepted.recorded).toEqual({
      setup: { id: setupId, label: `From ${SHOP_NAME}: ${SUGGESTION.title}`, effectiveFrom: '2026-05-10T08:00:00.000Z' },
      from: { id: handedBack.id, label: 'As handed back', effectiveFrom: '2026-05-01T00:00:00.000Z' },
      preview: open.now.preview,
    });
    expect(accepted.baseSetup.id).toBe(setup.id);
  });
});

describe('GET /api/suggestions/waiting', () => {
  it('when a driver has open suggestions on their cars, then they and the co-driver get those, oldest first; decided ones, other cars and shop staff get none', async () => {
    const { driver, staff, co, setup, suggestion } = await carWithSuggestion();
    const later = await staff.c.post(`/api/cars/${driver.carId}/suggestions`, { ...SUGGESTION, title: 'Softer rear', baseSetupId: setup.id });
    const declined = await staff.c.post(`/api/cars/${driver.carId}/suggestions`, { ...SUGGESTION, title: 'Stiffer rear', baseSetupId: setup.id });
    expect((await driver.c.post(`/api/suggestions/${declined.body.id}/decline`, { note: 'Not this season' })).status).toBe(200);
    const elsewhere = await carWithSuggestion();

    for (const c of [driver.c, co.c]) {
      const res = await c.get('/api/suggestions/waiting');
      expect(res.status).toBe(200);
      expect(res.body.count).toBe(2);
      expect(res.body.items.map((s: { id: string }) => s.id)).toEqual([suggestion.id, later.body.id]);
      expect(res.body.items[0]).toEqual({
        id: suggestion.id,
        title: SUGGESTION.title,
        car: { id: driver.carId, name: expect.any(String) },
        shop: { id: expect.any(String), name: SHOP_NAME },
        createdAt: suggestion.createdAt,
      });
    }
    // Staff of the shop read the car but do not decide: nothing waits for them.
    expect((await staff.c.get('/api/suggestions/waiting')).body).toEqual({ items: [], count: 0 });
    expect((await elsewhere.driver.c.get('/api/suggestions/waiting')).body.items.map((s: { id: string }) => s.id)).toEqual([elsewhere.suggestion.id]);
  });
});

describe('POST /api/suggestions/:id/accept', () => {
  it('when the owner accepts, then one new snapshot carries the setup in force then with the changes, linked back to the suggestion', async () => {
    const { driver, setup, suggestion } = await carWithSuggestion();
    // In force from 1 May: the baseline with −1.0° front camber. Accepting for 10 May starts from this one, not the base.
    const later = await postSetup(driver.c, driver.carId, {
      label: 'May',
      effectiveFrom: '2026-05-01T00:00:00Z',
      corners: { ...base.corners, lf: { ...base.corners.lf, camberDeg: -1 }, rf: { ...base.corners.rf, camberDeg: -1 } },
    });
    const setupId = randomUUID();
    const res = await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, { setupId, effectiveFrom: '2026-05-10T08:00:00Z' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.setup).toMatchObject({
      id: setupId,
      carId: driver.carId,
      label: `From ${SHOP_NAME}: ${SUGGESTION.title}`,
      effectiveFrom: '2026-05-10T08:00:00.000Z',
      createdBy: { id: driver.user.id, displayName: 'Nell Ashdown' },
      derivedFromId: later.id,
      suggestion: { id: suggestion.id, title: SUGGESTION.title, shopName: SHOP_NAME },
      axles: base.axles,
    });
    // −1.0° − 0.5° = −1.5° at the front; rear clicks set to 8; everything else copied.
    const corners = res.body.setup.corners;
    expect([corners.lf.camberDeg, corners.rf.camberDeg, corners.lr.camberDeg]).toEqual([-1.5, -1.5, base.corners.lr.camberDeg]);
    expect([corners.lf.damperClicks, corners.lr.damperClicks, corners.rr.damperClicks]).toEqual([base.corners.lf.damperClicks, 8, 8]);
    expect([corners.lf.coldPressureKpa, corners.lr.toeMm]).toEqual([base.corners.lf.coldPressureKpa, base.corners.lr.toeMm]);
    expect(res.body.suggestion).toMatchObject({
      id: suggestion.id,
      status: 'accepted',
      acceptedSetupId: setupId,
      decidedBy: { id: driver.user.id, displayName: 'Nell Ashdown' },
      decidedAt: expect.any(String),
    });

    const list = await driver.c.get(`/api/cars/${driver.carId}/setups`);
    const links = Object.fromEntries(list.body.items.map((s: { id: string; suggestion: unknown }) => [s.id, s.suggestion]));
    expect(links).toEqual({
      [setupId]: { id: suggestion.id, title: SUGGESTION.title, shopName: SHOP_NAME },
      [later.id]: null,
      [setup.id]: null,
    });
    expect((await driver.c.get(`/api/setups/${setupId}`)).body.suggestion).toEqual({ id: suggestion.id, title: SUGGESTION.title, shopName: SHOP_NAME });
  });

  it('when nothing was in force at the chosen time, then the base snapshot is used, and a co-driver may accept with their own label', async () => {
    const { driver, co, setup, suggestion } = await carWithSuggestion();
    const res = await co.c.post(`/api/suggestions/${suggestion.id}/accept`, { effectiveFrom: '2026-01-05T08:00:00Z', label: 'Shop camber' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.setup).toMatchObject({ label: 'Shop camber', derivedFromId: setup.id, createdBy: { id: co.user.id } });
    expect(res.body.setup.corners.lf.camberDeg).toBe(-2);
    expect(await setupsOf(driver.carId)).toBe(2);
  });

  it('when the same accept is sent again with the same setupId, then 200 with the same result and no second snapshot', async () => {
    const { driver, suggestion } = await carWithSuggestion();
    const body = { setupId: randomUUID(), effectiveFrom: '2026-05-10T08:00:00Z' };
    const first = await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, body);
    const again = await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, body);
    expect([first.status, again.status]).toEqual([201, 200]);
    expect(again.body).toEqual(first.body);
    expect(await setupsOf(driver.carId)).toBe(2);
  });

  it('when an accepted suggestion is accepted again (other setupId or none) or declined, then 409 with the suggestion as it stands', async () => {
    const { driver, co, suggestion } = await carWithSuggestion();
    expect((await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, { effectiveFrom: '2026-05-10T08:00:00Z' })).status).toBe(201);
    const twice = await co.c.post(`/api/suggestions/${suggestion.id}/accept`, { effectiveFrom: '2026-05-10T08:00:00Z' });
    expectError(twice, 409, 'conflict');
    expect(twice.body.error.current).toMatchObject({ id: suggestion.id, status: 'accepted' });
    expectError(await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, { setupId: randomUUID(), effectiveFrom: '2026-05-10T08:00:00Z' }), 409, 'conflict');
    expectError(await driver.c.post(`/api/suggestions/${suggestion.id}/decline`, { note: 'Changed my mind' }), 409, 'conflict');
    expect(await setupsOf(driver.carId)).toBe(2);
  });

  it('when the setup in force then cannot take the changes, then 400 naming the change, no snapshot is made and the suggestion stays open', async () => {
    const { driver, suggestion } = await carWithSuggestion();
    // In force from 1 May: no camber recorded on the fronts, so a −0.5° change has nothing to start from.
    await postSetup(driver.c, driver.carId, { label: 'Bare', effectiveFrom: '2026-05-01T00:00:00Z', corners: { lr: { damperClicks: 6 } } });
    const res = await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, { effectiveFrom: '2026-05-10T08:00:00Z' });
    expectFieldErrors(res, ['changes.0.delta']);
    expect(await setupsOf(driver.carId)).toBe(2);
    expect((await driver.c.get(`/api/suggestions/${suggestion.id}`)).body.status).toBe('open');
  });

  it('when staff accept, then 403; other people get 404; a bad time is 400 at effectiveFrom', async () => {
    const { driver, staff, suggestion } = await carWithSuggestion();
    expectError(await staff.c.post(`/api/suggestions/${suggestion.id}/accept`, { effectiveFrom: '2026-05-10T08:00:00Z' }), 403, 'forbidden');
    expectError(await (await signedInClient(t)).c.post(`/api/suggestions/${suggestion.id}/accept`, { effectiveFrom: '2026-05-10T08:00:00Z' }), 404, 'not_found');
    expectError(await driver.c.post(`/api/suggestions/${randomUUID()}/accept`, { effectiveFrom: '2026-05-10T08:00:00Z' }), 404, 'not_found');
    expectFieldErrors(await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, { effectiveFrom: 'Saturday' }), ['effectiveFrom']);
    expect(await setupsOf(driver.carId)).toBe(1);
  });
});

describe('POST /api/suggestions/:id/decline', () => {
  it('when a driver declines with a note, then 200, declined with the note and who decided; sending it again changes nothing', async () => {
    const { driver, suggestion } = await carWithSuggestion();
    const res = await driver.c.post(`/api/suggestions/${suggestion.id}/decline`, { note: 'Staying with the current alignment for this season.' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({
      status: 'declined',
      decisionNote: 'Staying with the current alignment for this season.',
      decidedBy: { id: driver.user.id, displayName: 'Nell Ashdown' },
      acceptedSetupId: null,
    });
    const again = await driver.c.post(`/api/suggestions/${suggestion.id}/decline`, { note: 'Staying with the current alignment for this season.' });
    expect(again.status).toBe(200);
    expect(again.body).toEqual(res.body);
    expectError(await driver.c.post(`/api/suggestions/${suggestion.id}/accept`, { effectiveFrom: '2026-05-10T08:00:00Z' }), 409, 'conflict');
    expect(await setupsOf(driver.carId)).toBe(1);
  });

  it('when the note is missing or staff decline, then 400 or 403 and the suggestion stays open', async () => {
    const { driver, staff, suggestion } = await carWithSuggestion();
    expectFieldErrors(await driver.c.post(`/api/suggestions/${suggestion.id}/decline`, { note: '  ' }), ['note']);
    expectFieldErrors(await driver.c.post(`/api/suggestions/${suggestion.id}/decline`, {}), ['note']);
    expectError(await staff.c.post(`/api/suggestions/${suggestion.id}/decline`, { note: 'Withdrawn' }), 403, 'forbidden');
    expect((await driver.c.get(`/api/suggestions/${suggestion.id}`)).body.status).toBe('open');
  });
});

import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, signedInClient, type TestApp } from '../test-app';
import { addCoDriver, countOf, driverWithCarAndEvent, expectError, expectFieldErrors, postRun, postSetup } from '../season/season-fixtures';
import { grantedCar, postTreadReading, SHOP_NAME } from './shop-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t.close();
});

const commentsOf = (carId: string) => countOf(t, 'SELECT count(*) AS n FROM comments WHERE car_id = $1', [carId]);
const threadUrl = (type: string, id: string, carId?: string) => `/api/comments?type=${type}&id=${id}${carId ? `&carId=${carId}` : ''}`;

describe('POST and GET /api/comments', () => {
  it('when the owner and then the shop comment on a run, then the thread is oldest first, with the shop named beside its staff', async () => {
    const { driver, staff, shopId } = await grantedCar(t);
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    const target = { type: 'run', id: run.id };
    const first = await driver.c.post('/api/comments', { target, body: '  Pushed wide at the far cone.  ' });
    expect(first.status, JSON.stringify(first.body)).toBe(201);
    expect(first.body).toEqual({
      id: expect.any(String),
      carId: driver.carId,
      target,
      author: { id: driver.user.id, displayName: 'Nell Ashdown' },
      shop: null,
      body: 'Pushed wide at the far cone.',
      mine: true,
      editedAt: null,
      version: 1,
      createdAt: expect.any(String),
    });
    const second = await staff.c.post('/api/comments', { target, body: 'Try two clicks softer at the front.' });
    expect(second.status, JSON.stringify(second.body)).toBe(201);
    expect(second.body.author).toEqual({ id: staff.user.id, displayName: 'Dusty Okonjo' });
    expect(second.body.shop).toEqual({ id: shopId, name: SHOP_NAME });

    const thread = await driver.c.get(threadUrl('run', run.id));
    expect(thread.status).toBe(200);
    expect(thread.body.count).toBe(2);
    expect(thread.body.items.map((c: { id: string; mine: boolean }) => [c.id, c.mine])).toEqual([[first.body.id, true], [second.body.id, false]]);
    const asStaff = await staff.c.get(threadUrl('run', run.id));
    expect(asStaff.body.items.map((c: { mine: boolean }) => c.mine)).toEqual([false, true]);
  });

  it('when a run has comments, then the run itself carries the count, for the "Comments (n)" control', async () => {
    const { driver, staff } = await grantedCar(t);
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    const quiet = await postRun(driver.c, driver.carId, driver.eventId, { runNumber: 2, recordedAt: '2026-04-12T10:05:00Z' });
    expect((await driver.c.get(`/api/runs/${run.id}`)).body.commentCount).toBe(0);
    await driver.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Late on the brakes' });
    await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Hot pressures look high' });
    const summary = await driver.c.get(`/api/events/${driver.eventId}/summary?carId=${driver.carId}`);
    const counts = Object.fromEntries(summary.body.entries[0].runs.map((r: { id: string; commentCount: number }) => [r.id, r.commentCount]));
    expect(counts).toEqual({ [run.id]: 2, [quiet.id]: 0 });
  });

  it('when comments are made on a setup, a tread reading and an event day, then each lands in its own thread only', async () => {
    const { driver, staff } = await grantedCar(t);
    const setup = await postSetup(driver.c, driver.carId);
    const reading = await postTreadReading(driver.c, driver.carId);
    await postRun(driver.c, driver.carId, driver.eventId);
    const targets = [
      { type: 'setup', id: setup.id },
      { type: 'tread_reading', id: reading },
      { type: 'event', id: driver.eventId, carId: driver.carId },
    ];
    for (const target of targets) {
      const res = await staff.c.post('/api/comments', { target, body: `About the ${target.type}` });
      expect(res.status, JSON.stringify(res.body)).toBe(201);
      expect(res.body.target).toEqual({ type: target.type, id: target.id });
      expect(res.body.carId).toBe(driver.carId);
    }
    for (const target of targets) {
      const thread = await driver.c.get(threadUrl(target.type, target.id, target.carId));
      expect(thread.status, JSON.stringify(thread.body)).toBe(200);
      expect(thread.body.items.map((c: { body: string }) => c.body)).toEqual([`About the ${target.type}`]);
    }
  });

  it('when an event thread names no car, then 400 at target.carId (posting) or carId (reading)', async () => {
    const d = await driverWithCarAndEvent(t);
    await postRun(d.c, d.carId, d.eventId);
    expectFieldErrors(await d.c.post('/api/comments', { target: { type: 'event', id: d.eventId }, body: 'Windy' }), ['target.carId']);
    expectFieldErrors(await d.c.get(threadUrl('event', d.eventId)), ['carId']);
    expect(await commentsOf(d.carId)).toBe(0);
  });

  it('when the car has not run at the event, then its drivers may still talk about the day of an event they can see; a stranger\'s event is 404', async () => {
    const d = await driverWithCarAndEvent(t);
    const res = await d.c.post('/api/comments', { target: { type: 'event', id: d.eventId, carId: d.carId }, body: 'Walked the course twice.' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    const stranger = await driverWithCarAndEvent(t);
    expectError(await d.c.post('/api/comments', { target: { type: 'event', id: stranger.eventId, carId: d.carId }, body: 'Hi' }), 404, 'not_found');
    expectError(await d.c.get(threadUrl('event', stranger.eventId, d.carId)), 404, 'not_found');
    expect(await commentsOf(d.carId)).toBe(1);
  });

  it('when a co-driver comments, then 201; another driver gets 404 reading or writing, and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    const co = await addCoDriver(t, d);
    const res = await co.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'My turn next.' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.shop).toBeNull();
    const other = await signedInClient(t);
    expectError(await other.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Hello' }), 404, 'not_found');
    expectError(await other.c.get(threadUrl('run', run.id)), 404, 'not_found');
    expect(await commentsOf(d.carId)).toBe(1);
  });

  it('when the target does not exist, the body is empty or too long, or the type is unknown, then 404 or 400 and nothing is written', async () => {
    const d = await driverWithCarAndEvent(t);
    const run = await postRun(d.c, d.carId, d.eventId);
    expectError(await d.c.post('/api/comments', { target: { type: 'run', id: randomUUID() }, body: 'Hi' }), 404, 'not_found');
    expectError(await d.c.post('/api/comments', { target: { type: 'setup', id: run.id }, body: 'Hi' }), 404, 'not_found');
    expectFieldErrors(await d.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: '   ' }), ['body']);
    expectFieldErrors(await d.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'x'.repeat(4001) }), ['body']);
    expectFieldErrors(await d.c.post('/api/comments', { target: { type: 'lap', id: run.id }, body: 'Hi' }), ['target.type']);
    expectFieldErrors(await d.c.get(`/api/comments?type=run&id=nope`), ['id']);
    expect(await commentsOf(d.carId)).toBe(0);
  });

  it('when the same client-made id is sent twice, then 201 then 200 with the same comment, stored and notified once', async () => {
    const { driver, staff } = await grantedCar(t);
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    const body = { id: randomUUID(), target: { type: 'run', id: run.id }, body: 'Sent from the grid.' };
    const first = await driver.c.post('/api/comments', body);
    const again = await driver.c.post('/api/comments', body);
    expect([first.status, again.status]).toEqual([201, 200]);
    expect(again.body).toEqual(first.body);
    expect(await commentsOf(driver.carId)).toBe(1);
    expect(await countOf(t, 'SELECT count(*) AS n FROM notifications WHERE comment_id = $1', [body.id])).toBe(1);
    expect((await staff.c.get('/api/notifications')).body.count).toBe(2); // the grant and this comment
    // Someone else resending that id is refused rather than shown the comment.
    const co = await addCoDriver(t, driver);
    expectError(await co.c.post('/api/comments', body), 409, 'conflict');
  });

  it('when a shop loses its grant, then its staff can no longer read or write the car\'s threads', async () => {
    const { driver, staff, shopId } = await grantedCar(t);
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    await driver.c.delete(`/api/cars/${driver.carId}/shop-grants/${shopId}`);
    expectError(await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Still here?' }), 404, 'not_found');
    expectError(await staff.c.get(threadUrl('run', run.id)), 404, 'not_found');
  });
});

describe('PATCH and DELETE /api/comments/:commentId', () => {
  async function threadWithComment() {
    const { driver, staff } = await grantedCar(t);
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    const co = await addCoDriver(t, driver);
    const res = await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Two clicks softer.' });
    expect(res.status).toBe(201);
    return { driver, staff, co, run, comment: res.body as { id: string; version: number } };
  }

  it('when the author edits with the current version, then 200 with the new body, version 2 and an edit time; the shop name stays', async () => {
    const { staff, driver, comment } = await threadWithComment();
    const res = await staff.c.patch(`/api/comments/${comment.id}`, { body: 'Three clicks softer.', version: 1 });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toMatchObject({ id: comment.id, body: 'Three clicks softer.', version: 2, mine: true, shop: { name: SHOP_NAME } });
    expect(res.body.editedAt).toEqual(expect.any(String));
    const thread = await driver.c.get(`/api/comments?type=run&id=${res.body.target.id}`);
    expect(thread.body.items[0]).toMatchObject({ body: 'Three clicks softer.', version: 2, mine: false });
  });

  it('when the version is stale, then 409 with the comment as it stands, and the body is unchanged', async () => {
    const { staff, comment } = await threadWithComment();
    await staff.c.patch(`/api/comments/${comment.id}`, { body: 'First edit', version: 1 });
    const res = await staff.c.patch(`/api/comments/${comment.id}`, { body: 'Second edit from an old screen', version: 1 });
    expectError(res, 409, 'conflict');
    expect(res.body.error.current).toMatchObject({ id: comment.id, body: 'First edit', version: 2 });
    expect((await t.ds.query('SELECT body FROM comments WHERE id = $1', [comment.id]))[0].body).toBe('First edit');
  });

  it('when someone who sees the car but did not write the comment edits or deletes it, then 403; someone who cannot see it gets 404', async () => {
    const { driver, co, comment } = await threadWithComment();
    const other = await signedInClient(t);
    expectError(await driver.c.patch(`/api/comments/${comment.id}`, { body: 'Mine now', version: 1 }), 403, 'forbidden');
    expectError(await co.c.delete(`/api/comments/${comment.id}`), 403, 'forbidden');
    expectError(await other.c.patch(`/api/comments/${comment.id}`, { body: 'Mine now', version: 1 }), 404, 'not_found');
    expectError(await other.c.delete(`/api/comments/${comment.id}`), 404, 'not_found');
    expectError(await driver.c.delete(`/api/comments/${randomUUID()}`), 404, 'not_found');
    expect((await t.ds.query('SELECT body FROM comments WHERE id = $1', [comment.id]))[0].body).toBe('Two clicks softer.');
  });

  it('when the edit is empty or has no version, then 400 at that field', async () => {
    const { staff, comment } = await threadWithComment();
    expectFieldErrors(await staff.c.patch(`/api/comments/${comment.id}`, { body: '', version: 1 }), ['body']);
    expectFieldErrors(await staff.c.patch(`/api/comments/${comment.id}`, { body: 'Fine' }), ['version']);
  });

  it('when the author deletes, then 204, the thread is empty and its notifications go with it', async () => {
    const { staff, driver, run, comment } = await threadWithComment();
    expect(await countOf(t, 'SELECT count(*) AS n FROM notifications WHERE comment_id = $1', [comment.id])).toBe(2);
    expect((await staff.c.delete(`/api/comments/${comment.id}`)).status).toBe(204);
    expect((await driver.c.get(`/api/comments?type=run&id=${run.id}`)).body).toEqual({ items: [], count: 0 });
    expect(await countOf(t, 'SELECT count(*) AS n FROM notifications WHERE comment_id = $1', [comment.id])).toBe(0);
    expectError(await staff.c.delete(`/api/comments/${comment.id}`), 404, 'not_found');
  });
});

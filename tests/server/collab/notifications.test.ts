import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { captureMail, client, makeTestApp, signedInClient, type TestApp } from '../test-app';
import { addCoDriver, expectError, expectFieldErrors, postRun, postSetup, type Client } from '../season/season-fixtures';
import { addStaff, grantedCar, postTreadReading, SHOP_NAME, shopWithAdmin } from './shop-fixtures';

let t: TestApp;
const mail = captureMail();
beforeAll(async () => {
  t = await makeTestApp({ mail: mail.settings });
});
afterAll(async () => {
  await t.close();
});

interface Note {
  id: string;
  kind: string;
  carId: string | null;
  actor: { id: string; displayName: string } | null;
  summary: string;
  link: string;
  readAt: string | null;
}

const notes = async (c: Client) => {
  const res = await c.get('/api/notifications');
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as { items: Note[]; count: number; unread: number };
};
const unread = async (c: Client) => ((await c.get('/api/notifications/unread-count')).body as { unread: number }).unread;
const mailTo = (email: string) => mail.sent.filter((m) => m.to === email);

/** A granted car with a co-driver and a second member of the shop's staff; the co-driver has read that they were added. */
async function crew() {
  const g = await grantedCar(t);
  const co = await addCoDriver(t, g.driver, 'Teo Marsh');
  expect((await co.c.post('/api/notifications/read', { all: true })).body).toEqual({ updated: 1, unread: 0 });
  const wren = await addStaff(t, g.shopId, 'Wren Iyer');
  return { ...g, co, wren };
}

describe('who hears about a comment', () => {
  it('when shop staff comment on a run, then the owner and co-driver each get a link to the event\'s board as its driver and the other staff to the customer page; not the author', async () => {
    const { driver, co, staff, wren } = await crew();
    const run = await postRun(driver.c, driver.carId, driver.eventId, { runNumber: 3 });
    const before = (await notes(staff.c)).count;
    const comment = await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Two clicks softer at the front.' });
    expect(comment.status).toBe(201);

    const summary = `Dusty Okonjo (${SHOP_NAME}) commented on Nell Ashdown’s run 3 at Spring points round 1`;
    for (const person of [driver, co]) {
      const list = await notes(person.c);
      expect(list.items[0]).toEqual({
        id: expect.any(String),
        kind: 'comment',
        carId: driver.carId,
        actor: { id: staff.user.id, displayName: 'Dusty Okonjo' },
        summary,
        // Straight to the day's runs with the reader as the driver, not to the page asking which car and who drives,
        // with the run's thread opened over them.
        link: `/events/${driver.eventId}?carId=${driver.carId}&driverId=${person.user.id}&comments=${run.id}`,
        readAt: null,
        createdAt: expect.any(String),
      });
    }
    const forWren = (await notes(wren.c)).items[0]!;
    // The shop's page for the car with that event's runs out and the run's thread open.
    expect([forWren.kind, forWren.summary, forWren.link]).toEqual([
      'comment', summary, `/shop/customers/${driver.carId}?event=${driver.eventId}&comments=${run.id}`,
    ]);
    expect((await notes(staff.c)).count).toBe(before);
  });

  it('when the owner and the co-driver each have a run 3 that day, then a comment\'s notification and e-mail name the driver of the run it is on', async () => {
    const { driver, co, staff } = await crew();
    const owners = await postRun(driver.c, driver.carId, driver.eventId, { runNumber: 3 });
    const cos = await postRun(co.c, driver.carId, driver.eventId, { runNumber: 3, recordedAt: '2026-04-12T10:02:00Z' });

    await staff.c.post('/api/comments', { target: { type: 'run', id: cos.id }, body: 'Braked later than Nell into the box.' });
    const aboutCos = `Dusty Okonjo (${SHOP_NAME}) commented on Teo Marsh’s run 3 at Spring points round 1`;
    for (const person of [driver, co]) expect((await notes(person.c)).items[0]!.summary).toBe(aboutCos);
    expect(mailTo(driver.email).at(-1)!.text).toContain(aboutCos);

    // Not "your run": the same words go to everyone told, the run's own driver included.
    await co.c.post('/api/comments', { target: { type: 'run', id: owners.id }, body: 'Yours was the tidier line.' });
    const forOwner = (await notes(driver.c)).items[0]!;
    expect(forOwner.summary).toBe('Teo Marsh commented on Nell Ashdown’s run 3 at Spring points round 1');
    expect((await notes(staff.c)).items[0]!.summary).toBe(forOwner.summary);

    // Their own run: the name is not said twice.
    await co.c.post('/api/comments', { target: { type: 'run', id: cos.id }, body: 'Late on the brakes, I know.' });
    expect((await notes(driver.c)).items[0]!.summary).toBe('Teo Marsh commented on their own run 3 at Spring points round 1');
  });

  it('when the owner adds a co-driver, then the co-driver is told who added them, linked to the car, with an e-mail; adding again tells them nothing more', async () => {
    const g = await grantedCar(t);
    const co = await signedInClient(t, { displayName: 'Teo Marsh' });
    expect((await g.driver.c.post(`/api/cars/${g.driver.carId}/co-drivers`, { email: co.email })).status).toBe(201);

    const list = await notes(co.c);
    expect(list.items.map((n) => [n.kind, n.summary, n.link, n.actor?.displayName])).toEqual([
      ['co_driver_added', 'Nell Ashdown added you as a co-driver of Blue roadster', `/cars/${g.driver.carId}`, 'Nell Ashdown'],
    ]);
    const sent = mailTo(co.email);
    expect(sent).toHaveLength(1);
    expect(sent[0]!.subject).toBe('You were added as a co-driver of Blue roadster');
    expect(sent[0]!.text).toContain('take yourself off it under Drivers');
    // Nobody else hears: not the owner who acted, not the shop.
    expect((await notes(g.driver.c)).items.filter((n) => n.kind === 'co_driver_added')).toEqual([]);
    expect((await notes(g.staff.c)).items.filter((n) => n.kind === 'co_driver_added')).toEqual([]);

    expect((await g.driver.c.post(`/api/cars/${g.driver.carId}/co-drivers`, { email: co.email })).status).toBe(201);
    expect((await notes(co.c)).count).toBe(1);
    expect(mailTo(co.email)).toHaveLength(1);
  });

  it('when the owner comments on a setup and a tread reading, then co-drivers are sent to the setup\'s thread and the tread page, and every granted shop\'s staff hear', async () => {
    const { driver, co, staff } = await crew();
    const second = await shopWithAdmin(t, 'Upland Motorsport', 'Ola Brandt');
    await driver.c.post(`/api/cars/${driver.carId}/shop-grants`, { shopId: second.shopId });
    const setup = await postSetup(driver.c, driver.carId, { label: 'Spring baseline' });
    const reading = await postTreadReading(driver.c, driver.carId);

    await driver.c.post('/api/comments', { target: { type: 'setup', id: setup.id }, body: 'Felt lazy on turn-in.' });
    let latest = (await notes(co.c)).items[0]!;
    expect([latest.summary, latest.link]).toEqual(['Nell Ashdown commented on the setup "Spring baseline"', `/cars/${driver.carId}?comments=${setup.id}`]);
    await driver.c.post('/api/comments', { target: { type: 'tread_reading', id: reading }, body: 'Inside edges going fast.' });
    latest = (await notes(co.c)).items[0]!;
    expect([latest.summary, latest.link]).toEqual(['Nell Ashdown commented on a tread reading of Set A', `/cars/${driver.carId}/tread`]);

    for (const shopStaff of [staff, second.admin]) {
      const list = await notes(shopStaff.c);
      // Newest first: the tread reading's (the shop's page does not show tread), then the setup's, its thread open.
      expect(list.items.slice(0, 2).map((n) => n.link)).toEqual([`/shop/customers/${driver.carId}`, `/shop/customers/${driver.carId}?comments=${setup.id}`]);
    }
    expect((await notes(driver.c)).count).toBe(0);
  });

  it('when the owner comments on the day at an event, then the co-driver is sent to its board and the shop to that event with the day\'s thread open', async () => {
    const { driver, co, staff } = await crew();
    await postRun(driver.c, driver.carId, driver.eventId);
    const res = await driver.c.post('/api/comments', { target: { type: 'event', id: driver.eventId, carId: driver.carId }, body: 'Wet until noon.' });
    expect(res.status).toBe(201);
    expect((await notes(co.c)).items[0]!.link).toBe(`/events/${driver.eventId}?carId=${driver.carId}&driverId=${co.user.id}&comments=${driver.eventId}`);
    expect((await notes(staff.c)).items[0]!.link).toBe(`/shop/customers/${driver.carId}?event=${driver.eventId}&comments=${driver.eventId}`);
  });

  it('when a person both drives the car and works at its shop, then they get one notification, with the driver\'s link', async () => {
    const { driver, staff, shopId } = await crew();
    const mechanic = await addCoDriver(t, driver, 'Ivo Petrak');
    await t.ds.query('INSERT INTO shop_members (shop_id, user_id) VALUES ($1, $2)', [shopId, mechanic.user.id]);
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Tyres look scrubbed in.' });
    const list = await notes(mechanic.c);
    expect(list.items.filter((n) => n.kind === 'comment').map((n) => n.link)).toEqual([
      `/events/${driver.eventId}?carId=${driver.carId}&driverId=${mechanic.user.id}&comments=${run.id}`,
    ]);
  });
});

describe('who hears about grants and suggestions', () => {
  it('when the owner grants a shop, then each of its staff is told, linked to the customer page; the owner is not', async () => {
    const { driver, staff, wren, shopId } = await crew();
    const other = await shopWithAdmin(t, 'Upland Motorsport', 'Ola Brandt');
    const forDusty = (await notes(staff.c)).items.find((n) => n.kind === 'shop_grant')!;
    expect(forDusty).toMatchObject({
      carId: driver.carId,
      summary: `Nell Ashdown gave ${SHOP_NAME} access to Blue roadster`,
      link: `/shop/customers/${driver.carId}`,
      actor: { id: driver.user.id },
    });
    // Wren joined after the grant: nothing old is back-filled.
    expect((await notes(wren.c)).items.filter((n) => n.kind === 'shop_grant')).toEqual([]);
    await driver.c.post(`/api/cars/${driver.carId}/shop-grants`, { shopId: other.shopId });
    expect((await notes(other.admin.c)).items.map((n) => n.kind)).toEqual(['shop_grant']);
    // Granting again is not news.
    await driver.c.post(`/api/cars/${driver.carId}/shop-grants`, { shopId });
    expect((await notes(staff.c)).items.filter((n) => n.kind === 'shop_grant')).toHaveLength(1);
    expect((await notes(driver.c)).count).toBe(0);
  });

  it('when staff suggest, then the drivers are told with a link to the suggestion; when a driver decides, the author and the shop are told, not the driver', async () => {
    const { driver, co, staff, wren } = await crew();
    const setup = await postSetup(driver.c, driver.carId);
    const created = await staff.c.post(`/api/cars/${driver.carId}/suggestions`, {
      baseSetupId: setup.id, title: 'Softer rear', rationale: 'Rear steps out on entry.', changes: [{ field: 'damperClicks', corners: ['lr', 'rr'], delta: -2 }],
    });
    expect(created.status).toBe(201);
    const link = `/suggestions/${created.body.id}`;
    for (const person of [driver, co]) {
      expect((await notes(person.c)).items[0]).toMatchObject({ kind: 'suggestion', link, summary: `Dusty Okonjo (${SHOP_NAME}) suggested “Softer rear” for Blue roadster` });
    }
    expect((await notes(wren.c)).items.filter((n) => n.kind === 'suggestion')).toEqual([]);

    await co.c.post(`/api/suggestions/${created.body.id}/decline`, { note: 'Not before the final round.' });
    for (const person of [staff, wren]) {
      expect((await notes(person.c)).items[0]).toMatchObject({ kind: 'suggestion_decided', link, summary: 'Teo Marsh declined “Softer rear” for Blue roadster' });
    }
    expect((await notes(co.c)).items.filter((n) => n.kind === 'suggestion_decided')).toEqual([]);
    expect((await notes(driver.c)).items.filter((n) => n.kind === 'suggestion_decided')).toEqual([]);
  });
});

describe('reading notifications', () => {
  it('when some are marked read by id, then only those change and the unread count follows; ids of someone else\'s are ignored', async () => {
    const { driver, co, staff } = await crew();
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    for (const body of ['One', 'Two', 'Three']) await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body });
    expect(await unread(driver.c)).toBe(3);
    const mine = await notes(driver.c);
    expect(mine.unread).toBe(3);
    const theirs = await notes(co.c);

    const res = await driver.c.post('/api/notifications/read', { ids: [mine.items[0]!.id, theirs.items[1]!.id] });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ updated: 1, unread: 2 });
    const after = await notes(driver.c);
    expect(after.items.map((n) => n.readAt !== null)).toEqual([true, false, false]);
    expect(await unread(co.c)).toBe(3);

    expect((await co.c.post('/api/notifications/read', { all: true })).body).toEqual({ updated: 3, unread: 0 });
    expect(await unread(co.c)).toBe(0);
    expect(await unread(driver.c)).toBe(2);
  });

  it('when a user has more than 50, then the newest 50 are listed and the unread count covers them all', async () => {
    const { c, user } = await signedInClient(t);
    await t.ds.query(
      `INSERT INTO notifications (user_id, kind, summary, link, created_at)
       SELECT $1, 'comment', 'Note ' || i, '/cars', now() - (i || ' minutes')::interval FROM generate_series(1, 55) i`,
      [user.id],
    );
    const list = await notes(c);
    expect([list.count, list.unread, list.items.length]).toEqual([50, 55, 50]);
    expect([list.items[0]!.summary, list.items[49]!.summary]).toEqual(['Note 1', 'Note 50']);
  });

  it('when the mark-read body is malformed, then 400; signed out, every notification route is 401', async () => {
    const { c } = await signedInClient(t);
    expectError(await c.post('/api/notifications/read', { ids: [] }), 400, 'validation_failed');
    expectError(await c.post('/api/notifications/read', { all: false }), 400, 'validation_failed');
    expectFieldErrors(await c.post('/api/notifications/read', { ids: ['not-an-id'] }), ['ids.0']);
    const anon = client(t.app);
    expectError(await anon.get('/api/notifications'), 401, 'unauthenticated');
    expectError(await anon.get('/api/notifications/unread-count'), 401, 'unauthenticated');
    expectError(await anon.post('/api/notifications/read', { all: true }), 401, 'unauthenticated');
  });
});

describe('notification e-mails', () => {
  it('when a comment notifies someone, then they get an e-mail naming the car with text and HTML parts, a button to the page, why they got it and the unsubscribe link', async () => {
    const { driver, staff, wren } = await crew();
    const run = await postRun(driver.c, driver.carId, driver.eventId, { runNumber: 3 });
    await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Two clicks softer <front>.' });

    const [token] = (await t.ds.query('SELECT unsubscribe_token FROM users WHERE id = $1', [driver.user.id])) as { unsubscribe_token: string }[];
    const unsubscribeUrl = `http://scrubline.test/unsubscribe/${token!.unsubscribe_token}`;
    const pageUrl = `http://scrubline.test/events/${driver.eventId}?carId=${driver.carId}&driverId=${driver.user.id}&comments=${run.id}`;
    const sent = mailTo(driver.email);
    expect(sent).toHaveLength(1);
    const message = sent[0]!;
    expect(message.subject).toBe('New comment on Blue roadster');
    expect(message.unsubscribeUrl).toBe(unsubscribeUrl);
    expect(message.text).toContain(`Dusty Okonjo (${SHOP_NAME}) commented on Nell Ashdown’s run 3 at Spring points round 1`);
    expect(message.text).toContain('Two clicks softer <front>.');
    expect(message.text).toContain(pageUrl);
    expect(message.text).toContain('because you drive Blue roadster');
    expect(message.text).toContain(unsubscribeUrl);
    // In HTML the address's "&" is written "&amp;" (HTML Living Standard, 13.1.2.3 attribute values).
    expect(message.html).toContain(`href="${pageUrl.replaceAll('&', '&amp;')}"`);
    expect(message.html).toContain('Two clicks softer &lt;front&gt;.');
    expect(message.html).toContain(`href="${unsubscribeUrl}"`);
    expect(message.html).toContain('because you drive Blue roadster');

    const toWren = mailTo(wren.email).find((m) => m.subject === 'New comment on Blue roadster')!;
    expect(toWren.text).toContain(`http://scrubline.test/shop/customers/${driver.carId}?event=${driver.eventId}&comments=${run.id}`);
    expect(toWren.text).toContain(`because ${SHOP_NAME} looks after Blue roadster`);
    expect(mailTo(staff.email).filter((m) => m.subject === 'New comment on Blue roadster')).toEqual([]);
  });

  it('when a recipient has turned notification e-mails off, then they get the notification in the app but no e-mail', async () => {
    const { driver, co, staff } = await crew();
    await t.ds.query('UPDATE users SET email_notifications = false WHERE id = $1', [co.user.id]);
    const mailsBefore = mailTo(co.email).length;
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Check the rear pressures.' });
    expect((await notes(co.c)).unread).toBe(1);
    expect(mailTo(co.email)).toHaveLength(mailsBefore);
    expect(mailTo(driver.email)).toHaveLength(1);
  });

  it('when no e-mail is set up, then notifications are still written', async () => {
    const plain = await makeTestApp();
    try {
      const driver = await signedInClient(plain, { displayName: 'Nell Ashdown' });
      const car = await driver.c.post('/api/cars', { name: 'Quiet car', classCode: 'SS' });
      const shop = await signedInClient(plain, { displayName: 'Dusty Okonjo' });
      const made = await shop.c.post('/api/shops', { name: SHOP_NAME });
      await driver.c.post(`/api/cars/${car.body.id}/shop-grants`, { shopId: made.body.id });
      expect(((await shop.c.get('/api/notifications')).body as { unread: number }).unread).toBe(1);
    } finally {
      await plain.close();
    }
    expect(mail.sent.some((m) => m.subject === 'Quiet car is now shared with your shop')).toBe(false);
  });

  it('when a notification cannot be written, then the comment that caused it is not saved either', async () => {
    const { driver, staff } = await crew();
    const run = await postRun(driver.c, driver.carId, driver.eventId);
    // The database refuses this car's notifications (a trigger stands in for a failure mid-way).
    const name = `refuse_${randomUUID().replace(/-/g, '')}`;
    await t.ds.query(`CREATE FUNCTION ${name}() RETURNS trigger AS $$ BEGIN RAISE EXCEPTION 'refused'; END $$ LANGUAGE plpgsql`);
    await t.ds.query(`CREATE TRIGGER ${name} BEFORE INSERT ON notifications FOR EACH ROW WHEN (NEW.car_id = '${driver.carId}') EXECUTE FUNCTION ${name}()`);
    try {
      const res = await staff.c.post('/api/comments', { target: { type: 'run', id: run.id }, body: 'Lost?' });
      expectError(res, 500, 'internal');
      expect((await t.ds.query('SELECT count(*)::int AS n FROM comments WHERE run_id = $1', [run.id]))[0].n).toBe(0);
      expect(mailTo(driver.email)).toEqual([]);
    } finally {
      await t.ds.query(`DROP TRIGGER ${name} ON notifications`);
      await t.ds.query(`DROP FUNCTION ${name}()`);
    }
  });
});

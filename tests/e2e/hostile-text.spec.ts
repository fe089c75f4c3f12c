import { afterAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { DEMO_PASSWORD, openBrowser, screenshot, signIn, type OpenBrowser } from './browser';

/**
 * Text people type is stored as typed and drawn as text: markup in a car's name or a comment
 * never becomes an element, and its event handlers never run (OWASP, "Cross Site Scripting
 * Prevention Cheat Sheet": output encoding; React escapes text children by default).
 */
const baseUrl = inject('baseUrl');
const PAYLOAD = '<img src=x onerror="window.__scrublineXss = (window.__scrublineXss || 0) + 1">';
const SQL = "Robert'); DROP TABLE runs;--";

let browser: OpenBrowser | undefined;

afterAll(async () => {
  await browser?.close();
});

describe('markup and SQL typed into the notebook (390×844)', () => {
  it('when a car is named with an <img onerror> and a comment carries one, then both read as text and nothing runs', async () => {
    browser = await openBrowser('phone');
    // The second demo driver: no other browser test reads her cars.
    const page = await signIn(browser.page, baseUrl, 'priya@example.com', 'Priya Castellan');
    const { carId, setupLabel } = await page.evaluate(
      async ({ name, body }) => {
        const token = (await (await fetch('/api/auth/csrf')).json()).token as string;
        const post = (path: string, data: object) =>
          fetch(path, { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token }, body: JSON.stringify(data) });
        const car = await (await post('/api/cars', { name, classCode: 'SS' })).json();
        const setup = await (
          await post(`/api/cars/${car.id}/setups`, { label: 'Baseline', effectiveFrom: '2026-04-01T08:00:00.000Z', corners: {} })
        ).json();
        const comment = await post('/api/comments', { target: { type: 'setup', id: setup.id }, body });
        if (!comment.ok) throw new Error(`comment: ${comment.status}`);
        return { carId: car.id as string, setupLabel: setup.label as string };
      },
      { name: PAYLOAD, body: `${PAYLOAD} ${SQL}` },
    );

    // Straight to the new car's page: the car list seen at sign-in is kept on the device and may not
    // be asked for again yet, but this car has never been loaded, so its page reads it from the server.
    await page.goto(`${baseUrl}/cars/${carId}`);
    await page.getByText(PAYLOAD, { exact: true }).first().waitFor({ timeout: 20_000 });
    await page.getByRole('button', { name: new RegExp(`^Comments.* on “${setupLabel}”`) }).first().click();
    await page.getByText(`${PAYLOAD} ${SQL}`, { exact: true }).waitFor({ timeout: 20_000 });
    await screenshot(page, 'hostile-text-car');

    // Drawn as text: no <img src="x"> anywhere, and its handler never ran.
    expect(await page.locator('img[src="x"]').count()).toBe(0);
    expect(await page.evaluate(() => (window as unknown as { __scrublineXss?: number }).__scrublineXss)).toBeUndefined();
    // Stored as typed, and the runs table is still there to answer.
    const back = await page.evaluate(async (id) => (await (await fetch(`/api/cars/${id}`)).json()).name as string, carId);
    expect(back).toBe(PAYLOAD);
    expect(await page.evaluate(async (id) => (await fetch(`/api/runs?carId=${id}`)).status, carId)).toBe(200);
  });

  it('when a pasted code with no spaces fills a work order\'s requested work and a line, then the shop page, the visit and its invoice still fit the phone', async () => {
    browser ??= await openBrowser('phone');
    // Her own shop, for her own car: the demo shop's pages, read by the other browser tests, stay as they are.
    const page = browser.page;
    await page.context().clearCookies();
    await signIn(page, baseUrl, 'priya@example.com', 'Priya Castellan');
    const word = 'PART-CODE-' + 'X7Q2'.repeat(45);
    const { workOrderId, invoiceId } = await page.evaluate(async (word) => {
      const token = (await (await fetch('/api/auth/csrf')).json()).token as string;
      const send = async (method: string, path: string, data?: object) => {
        const res = await fetch(path, { method, headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token }, body: data ? JSON.stringify(data) : undefined });
        if (!res.ok) throw new Error(`${method} ${path}: ${res.status} ${await res.text()}`);
        return res.json();
      };
      const shop = await send('POST', '/api/shops', { name: 'Long Word Garage' });
      const car = await send('POST', '/api/cars', { name: 'Wide test car', classCode: 'SS' });
      await send('POST', `/api/cars/${car.id}/shop-grants`, { shopId: shop.id });
      const visit = await send('POST', `/api/cars/${car.id}/work-orders`, { shopId: shop.id, visitDate: '2026-06-12', requestedWork: word });
      await send('PUT', `/api/work-orders/${visit.id}/lines`, { lines: [{ kind: 'part', description: word.slice(0, 200), quantity: 2, unitPriceCents: 18950 }] });
      await send('POST', `/api/work-orders/${visit.id}/close`, { handoverAt: '2026-06-12T16:00:00.000Z' });
      const invoice = await send('POST', `/api/work-orders/${visit.id}/invoice`);
      return { workOrderId: visit.id as string, invoiceId: invoice.id as string };
    }, word);

    for (const [path, shown] of [
      ['/shop', word],
      [`/work-orders/${workOrderId}`, word.slice(0, 200)],
      [`/invoices/${invoiceId}`, word.slice(0, 200)],
    ] as const) {
      await page.goto(`${baseUrl}${path}`);
      await page.getByText(shown).first().waitFor({ timeout: 20_000 });
      await expectOnScreen(page, path);
    }
    await screenshot(page, 'hostile-text-long-word-invoice');
  });

  it('when a pasted address with no spaces fills every text of a car\'s season, then the event day, the car, its tyres and its season review still fit the phone', async () => {
    // A phone of its own, signed in only once the season is written: its first list of cars has the new one.
    const own = await openBrowser('phone');
    const page = own.page;
    // Written from a page of the app's origin that runs no script of its own.
    await page.goto(`${baseUrl}/api/health`);
    // A link to an onboard video, say: no space to break at.
    const word = (n: number) => ('https://video.example/onboard?run=' + 'a1b2c3d4'.repeat(40)).slice(0, n);
    const ids = await page.evaluate(async (texts) => {
      const csrf = async () => (await (await fetch('/api/auth/csrf')).json()).token as string;
      const signedIn = await fetch('/api/auth/login', {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': await csrf() },
        body: JSON.stringify({ email: 'priya@example.com', password: texts.password }),
      });
      if (!signedIn.ok) throw new Error(`sign-in: ${signedIn.status}`);
      const token = await csrf();
      const send = async (path: string, data: object) => {
        const res = await fetch(path, { method: 'POST', headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token }, body: JSON.stringify(data) });
        if (!res.ok) throw new Error(`POST ${path}: ${res.status} ${await res.text()}`);
        return res.json();
      };
      const now = new Date();
      const today = `${now.getFullYear()}-${String(now.getMonth() + 1).padStart(2, '0')}-${String(now.getDate()).padStart(2, '0')}`;
      const car = await send('/api/cars', { name: texts.w80, classCode: 'SS', notes: texts.w2000 });
      const setup = await send(`/api/cars/${car.id}/setups`, { label: texts.w80, effectiveFrom: new Date(now.getTime() - 3_600_000).toISOString(), corners: {}, notes: texts.w2000 });
      const event = await send('/api/events', { name: texts.w120, date: today, venue: texts.w120, notes: texts.w2000 });
      await send('/api/runs', { id: crypto.randomUUID(), carId: car.id, eventId: event.id, runNumber: 1, rawTimeSec: 48.5, cones: 0, status: 'finished', recordedAt: now.toISOString(), notes: texts.w2000 });
      await send(`/api/cars/${car.id}/changes`, { changedOn: today, what: texts.w200, notes: texts.w2000, setupId: setup.id });
      const set = await send(`/api/cars/${car.id}/tyre-sets`, { label: texts.w80, notes: texts.w2000 });
      const depth = { innerMm: 6, middleMm: 6, outerMm: 6 };
      await send(`/api/tyre-sets/${set.id}/readings`, { takenAt: now.toISOString(), corners: { lf: depth, rf: depth, lr: depth, rr: depth }, eventId: event.id, notes: texts.w2000 });
      await send('/api/comments', { target: { type: 'setup', id: setup.id }, body: texts.w2000 });
      return { carId: car.id as string, eventId: event.id as string };
    }, { w80: word(80), w120: word(120), w200: word(200), w2000: word(2000), password: DEMO_PASSWORD });
    await page.goto(`${baseUrl}/`);
    await page.getByRole('heading', { name: 'Hi, Priya Castellan' }).waitFor({ timeout: 20_000 });

    // Each page with the text it must show: the run's note, the change log's entry, the set's name, the season's log.
    for (const [path, shown] of [
      [`/events/${ids.eventId}?carId=${ids.carId}`, word(2000)],
      [`/cars/${ids.carId}`, word(200)],
      [`/cars/${ids.carId}/tread`, word(80)],
      [`/cars/${ids.carId}/review`, word(200)],
    ] as const) {
      await page.goto(`${baseUrl}${path}`);
      if (path.startsWith('/events/')) {
        // The car's name, on the choice of car and driver first.
        await page.getByText(word(80)).first().waitFor({ timeout: 20_000 });
        await expectOnScreen(page, `${path}, choosing the car`);
        await page.getByRole('button', { name: 'Start logging' }).click();
      }
      // The one on screen: the review also names the entry in a list of choices.
      await page.getByText(shown).filter({ visible: true }).first().waitFor({ timeout: 20_000 });
      await page.waitForLoadState('networkidle');
      await expectOnScreen(page, path);
    }
    await screenshot(page, 'hostile-text-long-word-review');
    await own.close();
  });
});

/**
 * Nothing scrolls sideways, and no text runs past the screen's right edge (a box that hides what overflows it hides it
 * from scrolling too). Measured against the phone's own width: a phone given a wider page zooms out to show it all,
 * and the window's width grows with it.
 */
async function expectOnScreen(page: Page, where: string) {
  const width = page.viewportSize()!.width;
  const seen = await page.evaluate((width) => {
    const past: string[] = [];
    const walker = document.createTreeWalker(document.body, NodeFilter.SHOW_TEXT);
    for (let node = walker.nextNode(); node; node = walker.nextNode()) {
      // Text for screen readers only sits in a clipped box of 1 px.
      if (!node.textContent?.trim() || node.parentElement!.closest('.sr-only')) continue;
      const range = document.createRange();
      range.selectNodeContents(node);
      const box = range.getBoundingClientRect();
      if (box.width > 0 && box.right > width + 1) past.push(`${node.parentElement!.tagName.toLowerCase()}.${node.parentElement!.className} "${node.textContent.slice(0, 30)}"`);
    }
    return { pageWidth: document.documentElement.scrollWidth, past: past.slice(0, 3) };
  }, width);
  expect(seen.pageWidth, `${where} is wider than the phone`).toBeLessThanOrEqual(width);
  expect(seen.past, `${where}: text past the right edge`).toEqual([]);
}

import { afterAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signIn, type OpenBrowser } from './browser';

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

    const sideways = () => page.evaluate(() => document.documentElement.scrollWidth - window.innerWidth);
    for (const [path, shown] of [
      ['/shop', word],
      [`/work-orders/${workOrderId}`, word.slice(0, 200)],
      [`/invoices/${invoiceId}`, word.slice(0, 200)],
    ] as const) {
      await page.goto(`${baseUrl}${path}`);
      await page.getByText(shown).first().waitFor({ timeout: 20_000 });
      expect(await sideways(), `${path} scrolls sideways`).toBeLessThanOrEqual(0);
    }
    await screenshot(page, 'hostile-text-long-word-invoice');
  });
});

import { describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openPhone, signIn } from './browser';

/** Changes waiting on a phone belong to the account that made them (a phone shared by co-drivers). */
const baseUrl = inject('baseUrl');

/** A call to the API from the page, as the app makes it (its session cookie and CSRF token). */
async function api<T>(page: Page, method: string, path: string, body?: unknown): Promise<{ status: number; json: T }> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const headers: Record<string, string> = { Accept: 'application/json' };
      if (method !== 'GET') {
        headers['X-CSRF-Token'] = ((await (await fetch('/api/auth/csrf')).json()) as { token: string }).token;
        headers['Content-Type'] = 'application/json';
      }
      const res = await fetch(path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
      return { status: res.status, json: res.status === 204 ? null : await res.json() };
    },
    { method, path, body },
  ) as Promise<{ status: number; json: T }>;
}

describe('whose waiting changes', () => {
  it('when a run waits on the phone, her session ends and her co-driver signs in there, then he neither uploads nor deletes it, the sign-in page says it waits, and it uploads once she is back', async () => {
    const phone = await openPhone();
    try {
      const { page, context } = phone;
      await signIn(page, baseUrl, 'maren@example.com', 'Maren Holloway');
      const cars = await api<{ items: { id: string; name: string }[] }>(page, 'GET', '/api/cars');
      const carId = cars.json.items.find((c) => c.name === 'Pebble')!.id;
      const today = new Date().toISOString().slice(0, 10);
      const event = await api<{ id: string }>(page, 'POST', '/api/events', { name: 'Borrowed phone practice', date: today, venue: 'Harrow Flats airfield' });
      expect(event.status).toBe(201);
      const runsAtEvent = async () => (await api<{ items: { rawTimeSec: number }[] }>(page, 'GET', `/api/runs?eventId=${event.json.id}&carId=${carId}`)).json.items;

      await page.goto(`${baseUrl}/events/${event.json.id}?carId=${carId}`);
      await page.getByRole('radio', { name: /Maren Holloway/ }).check({ force: true });
      await page.getByRole('button', { name: 'Start logging' }).click();
      await context.setOffline(true);
      for (const ch of '47.123') await page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name: ch === '.' ? 'Point' : ch, exact: true }).click();
      await page.getByRole('button', { name: /^Save run/ }).click();
      await page.getByRole('listitem', { name: /Run 1, Maren Holloway/ }).getByText(/waiting/i).first().waitFor();

      // Her session ends (here: its cookie is gone, as after it expired); her co-driver signs in on her phone, with signal.
      await context.clearCookies();
      await context.setOffline(false);
      await signIn(page, baseUrl, 'teo@example.com', 'Teo Varga');
      await page.getByText('All saved').first().waitFor();
      // Long enough for an upload the sign-in would have set off.
      await page.waitForTimeout(3000);
      expect(await runsAtEvent()).toEqual([]);

      // He signs out: nothing of his waits, so the phone says all is uploaded, and her run stays.
      await page.getByRole('button', { name: /Account: Teo Varga/ }).click();
      await page.getByRole('menuitem', { name: 'Sign out' }).click();
      await page.waitForURL(/\/sign-in/);
      // The sign-in page says her run is still there, waiting for her.
      await page.getByRole('status').filter({ hasText: '1 run is still on this phone only. It waits for the account that made it to sign in here again.' }).waitFor();

      await signIn(page, baseUrl, 'maren@example.com', 'Maren Holloway');
      await expect.poll(async () => (await runsAtEvent()).map((r) => r.rawTimeSec), { timeout: 20_000 }).toEqual([47.123]);
      await page.getByText('All saved').first().waitFor({ timeout: 20_000 });
      await page.waitForTimeout(1000);
      expect(await runsAtEvent()).toHaveLength(1);
    } finally {
      await phone.close();
    }
  });
});

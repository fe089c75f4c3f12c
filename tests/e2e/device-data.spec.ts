import { afterAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { onePhoneAtATime, openPhone, signIn } from './browser';

/**
 * What the app leaves in the phone's storage. The signed-in person's own data is kept in IndexedDB, so that the
 * notebook opens with no signal; other people's accounts, read by an admin, are never kept (OWASP ASVS 4.0.3
 * 8.2.2, sensitive data in browser storage), and signing out leaves nothing behind (8.2.3).
 */
const baseUrl = inject('baseUrl');
const phones = onePhoneAtATime(baseUrl);
afterAll(async () => {
  await phones.close();
});

interface KeptCopy {
  timestamp: number;
  clientState: { queries: { queryKey: unknown[] }[] };
}

/** The copy of the app's data kept on the device, as stored (JSON text), or '' when there is none. Read once the app has opened its store. */
function keptText(page: Page): Promise<string> {
  return page.evaluate(
    () =>
      new Promise<string>((resolve, reject) => {
        const opening = indexedDB.open('scrubline');
        opening.onerror = () => reject(opening.error);
        opening.onsuccess = () => {
          const db = opening.result;
          const read = db.transaction('device').objectStore('device').get('scrubline-cache');
          read.onerror = () => reject(read.error);
          read.onsuccess = () => {
            db.close();
            resolve(typeof read.result === 'string' ? read.result : '');
          };
        };
      }),
  );
}

async function keptCopy(page: Page): Promise<KeptCopy | null> {
  const text = await keptText(page);
  return text ? (JSON.parse(text) as KeptCopy) : null;
}

describe('what stays on the phone', () => {
  it('when the demo driver has opened her cars and signs out, then her data was kept while signed in and is gone after', async () => {
    const page = await phones.signInAs('maren@example.com', 'Maren Holloway');
    await page.goto(`${baseUrl}/cars`);
    await page.getByText('Pebble').first().waitFor();
    await expect.poll(() => keptText(page), { timeout: 10_000 }).toContain('Pebble');
    expect(await keptText(page)).toContain('maren@example.com');

    await page.getByRole('button', { name: /Account: Maren Holloway/ }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);

    await expect.poll(() => keptText(page), { timeout: 10_000 }).not.toContain('Pebble');
    const after = await keptText(page);
    expect(after).not.toContain('maren@example.com');
    expect(after).not.toContain('Maren');
  });

  it('when an admin has read the accounts and moved on, then the copy kept on the device holds their own data but no one else’s account', async () => {
    const page = await phones.signInAs('admin@example.com', 'Scrubline Admin');
    await page.goto(`${baseUrl}/accounts`);
    await page.getByText('maren@example.com').waitFor();
    const listShownAt = await page.evaluate(() => Date.now());
    // A later read, so that a copy written after the list arrived can be told apart.
    await page.getByRole('navigation', { name: 'Main' }).locator('a[href="/cars"]').click();
    await page.waitForURL(/\/cars$/);
    await expect.poll(async () => (await keptCopy(page))?.timestamp ?? 0, { timeout: 10_000 }).toBeGreaterThan(listShownAt);

    const copy = (await keptCopy(page))!;
    const kinds = copy.clientState.queries.map((q) => q.queryKey[0]);
    expect(kinds).toContain('auth');
    expect(kinds).not.toContain('admin');
    const text = await keptText(page);
    expect(text).toContain('admin@example.com');
    expect(text).not.toContain('maren@example.com');
    expect(text).not.toContain('ines@example.com');
  });
});

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
  it('when a run waits on the phone, her session ends and her co-driver signs in there, then he neither uploads nor deletes it, and it uploads once she is back', async () => {
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

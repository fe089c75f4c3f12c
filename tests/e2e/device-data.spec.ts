import { afterAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { onePhoneAtATime } from './browser';

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
    // A later read this page load has not made yet (the notifications list), so that a copy written after the
    // list arrived can be told apart; a page whose answers are still fresh may be drawn without a read, and
    // then nothing is written.
    await page.locator('a[href="/notifications"]').first().click();
    await page.waitForURL(/\/notifications$/);
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

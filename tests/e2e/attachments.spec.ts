import { afterAll, describe, expect, inject, it } from 'vitest';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import sharp from 'sharp';
import { openBrowser, screenshot, signIn, type OpenBrowser } from './browser';

/**
 * At phone size, the driver photographs a tyre and adds the photo to a tread reading of her car:
 * the thumbnail the server made shows under the reading, and it opens the full photo.
 */
const baseUrl = inject('baseUrl');

let browser: OpenBrowser | undefined;
const dir = mkdtempSync(join(tmpdir(), 'scrubline-e2e-photos-'));

afterAll(async () => {
  await browser?.close();
  rmSync(dir, { recursive: true, force: true });
});

describe('photos on a tread reading (phone)', () => {
  it('when the driver adds a photo to a tread reading, then its thumbnail loads under the reading and links to the photo', async () => {
    // A real JPEG, made here, so the server's byte check and thumbnailing have something genuine to work on.
    const fileName = `left-front-wear-${Date.now()}.jpg`;
    const photoPath = join(dir, fileName);
    writeFileSync(photoPath, await sharp({ create: { width: 640, height: 480, channels: 3, background: '#8a5' } }).jpeg().toBuffer());

    browser = await openBrowser('phone');
    const page = await signIn(browser.page, baseUrl, 'maren@example.com', 'Maren Holloway');

    // From "Your cars": a suggestion waiting on Pebble is a link that names the car too.
    await page.getByRole('region', { name: 'Your cars' }).getByRole('link', { name: /Pebble/ }).first().click();
    await page.getByRole('link', { name: 'Enter tread', exact: true }).click();
    const readings = page.getByRole('list', { name: 'Latest reading of each set' });
    await readings.waitFor({ timeout: 20_000 });
    const reading = readings.getByRole('listitem').first();
    // The strip is open under each latest reading; it starts with nothing on the demo data.
    const picker = reading.getByLabel(/^Add photos to the .+ reading$/);
    await picker.waitFor({ timeout: 15_000 });
    expect(await picker.getAttribute('accept')).toBe('image/*,application/pdf');
    const addButton = reading.locator('label:has(input[type="file"])');
    const box = (await addButton.boundingBox())!;
    expect(box.height).toBeGreaterThanOrEqual(48);

    await picker.setInputFiles(photoPath);

    const thumb = reading.getByRole('img', { name: `Photo: ${fileName}` });
    await thumb.waitFor({ timeout: 20_000 });
    await expect
      .poll(() => thumb.evaluate((img: HTMLImageElement) => (img.complete ? img.naturalWidth : 0)), { timeout: 15_000 })
      .toBeGreaterThan(0);
    await expect.poll(async () => (await reading.getByRole('status').textContent()) ?? '').toBe('Added 1 file.');
    await thumb.scrollIntoViewIfNeeded();
    await screenshot(page, 'attachments-tread-photo-phone');

    // The thumbnail is a small image, and its link serves the full photo to this signed-in driver.
    const thumbSrc = (await thumb.getAttribute('src'))!;
    const href = (await reading.getByRole('link', { name: new RegExp(`Photo: ${fileName.replace(/\./g, '\\.')}`) }).getAttribute('href'))!;
    expect(href).toMatch(/^\/api\/attachments\/[0-9a-f-]{36}\/file$/);
    const full = await page.request.get(`${baseUrl}${href}`);
    expect(full.status()).toBe(200);
    expect(full.headers()['content-type']).toContain('image/jpeg');
    expect((await sharp(await full.body()).metadata()).width).toBe(640);
    const small = await page.request.get(`${baseUrl}${thumbSrc}`);
    expect(small.status()).toBe(200);
    expect((await sharp(await small.body()).metadata()).width).toBeLessThan(640);

    // Her own photo: she may take it off again, after saying yes.
    await reading.getByRole('button', { name: `Delete ${fileName}` }).click();
    const dialog = page.getByRole('dialog', { name: 'Delete this file?' });
    await dialog.getByRole('button', { name: 'Delete', exact: true }).click();
    await reading.getByText('No photos yet.').waitFor({ timeout: 15_000 });
    expect((await page.request.get(`${baseUrl}${href}`)).status()).toBe(404);
  });
});

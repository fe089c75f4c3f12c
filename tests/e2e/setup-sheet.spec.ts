import { afterAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signIn, type OpenBrowser } from './browser';

/**
 * The printable setup sheet: one snapshot of the demo car, printed by Chromium to PDF at A4 and
 * at US Letter, must come out on one page each.
 */
const baseUrl = inject('baseUrl');

let browser: OpenBrowser | undefined;

afterAll(async () => {
  await browser?.close();
});

/** Chromium writes one "/Type /Page" object per page (and one "/Type /Pages" tree). */
const pageCount = (pdf: Buffer) => (pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []).length;

describe('a setup sheet on paper (390×844, then printed)', () => {
  it('when the driver opens a snapshot’s sheet and prints it, then it shows the car, the snapshot and its date, and fits one A4 and one Letter page', async () => {
    browser = await openBrowser('phone');
    const page = await signIn(browser.page, baseUrl, 'maren@example.com', 'Maren Holloway');
    const setup = await page.evaluate(async () => {
      const cars = await (await fetch('/api/cars')).json();
      const carId = (cars.items as { id: string; name: string }[]).find((c) => c.name === 'Pebble')!.id;
      const setups = (await (await fetch(`/api/cars/${carId}/setups`)).json()).items as { id: string; label: string }[];
      return setups[0]!;
    });

    await page.goto(`${baseUrl}/setups/${setup.id}/sheet`);
    await page.getByRole('heading', { name: 'Pebble', level: 1 }).waitFor({ timeout: 20_000 });
    await page.getByRole('heading', { name: setup.label }).waitFor();
    await page.getByRole('group', { name: 'Setup values by corner' }).waitFor();
    await screenshot(page, 'setup-sheet-phone');

    await page.emulateMedia({ media: 'print' });
    await screenshot(page, 'setup-sheet-print');
    expect(pageCount(await page.pdf({ format: 'A4', printBackground: true }))).toBe(1);
    expect(pageCount(await page.pdf({ format: 'Letter', printBackground: true }))).toBe(1);
  });
});

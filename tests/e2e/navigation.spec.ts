import { afterAll, describe, expect, inject, it } from 'vitest';
import { openBrowser, screenshot, signIn, type OpenBrowser } from './browser';

/** Moving between pages on a phone: each page a link opens starts at its top. */
const baseUrl = inject('baseUrl');

let browser: OpenBrowser | undefined;

afterAll(async () => {
  await browser?.close();
});

describe('moving between pages (390×844)', () => {
  it('when the driver scrolls to the foot of Home and taps Cars, then the cars page opens at its top, and so does each page opened from there; going back returns to where the driver was', async () => {
    browser = await openBrowser('phone');
    const page = await signIn(browser.page, baseUrl, 'maren@example.com', 'Maren Holloway');
    // Wait for the shell's later parts (the bell), which hold the rule, as a driver's phone would have them.
    await page.getByRole('link', { name: /notification/i }).waitFor();

    await page.evaluate(() => window.scrollTo(0, document.documentElement.scrollHeight));
    expect(await page.evaluate(() => window.scrollY)).toBeGreaterThan(100);
    await page.getByRole('navigation').getByRole('link', { name: 'Cars' }).last().click();
    await page.getByRole('heading', { name: 'Cars', level: 1 }).waitFor();
    expect(await page.evaluate(() => window.scrollY)).toBe(0);

    await page.getByRole('link', { name: /Pebble/ }).first().click();
    await page.getByRole('heading', { name: 'Pebble', level: 1 }).waitFor();
    await page.evaluate(() => window.scrollTo(0, document.documentElement.scrollHeight));
    expect(await page.evaluate(() => window.scrollY)).toBeGreaterThan(100);
    await page.getByRole('navigation').getByRole('link', { name: 'Calculators' }).last().click();
    await page.getByRole('heading', { name: 'Calculators', level: 1 }).waitFor();
    expect(await page.evaluate(() => window.scrollY)).toBe(0);
    await screenshot(page, 'navigation-new-page-at-top', { fullPage: false });

    // Back to the car: the browser puts it where the driver left it, not at its top.
    await page.goBack();
    await page.getByRole('heading', { name: 'Pebble', level: 1 }).waitFor();
    await page.waitForFunction(() => window.scrollY > 100, undefined, { timeout: 5_000 });
  });
});

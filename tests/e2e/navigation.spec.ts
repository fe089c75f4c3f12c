import { afterAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, screenshot, signIn, type OpenBrowser } from './browser';

/** Moving between pages on a phone: each page a link opens starts at its top. */
const baseUrl = inject('baseUrl');

let browser: OpenBrowser | undefined;

/**
 * Scrolls to `y` (the foot of the page when left out) once the page has stopped growing, and gives where it
 * settled. A page still drawing its later sections moves the reader's place with them (the browser keeps what
 * is on screen in view), so a place read at once would not be the place the reader was left at.
 */
async function scrollOnceDrawn(page: Page, y?: number): Promise<number> {
  await page.waitForFunction(
    () =>
      new Promise<boolean>((done) => {
        const before = document.documentElement.scrollHeight;
        setTimeout(() => done(document.documentElement.scrollHeight === before), 400);
      }),
  );
  await page.evaluate((to) => window.scrollTo(0, to ?? document.documentElement.scrollHeight), y);
  return page.evaluate(() => new Promise<number>((done) => requestAnimationFrame(() => requestAnimationFrame(() => done(window.scrollY)))));
}

afterAll(async () => {
  await browser?.close();
});

describe('moving between pages (390×844)', () => {
  it('when the driver scrolls to the foot of Home and taps Cars, then the cars page opens at its top, and so does each page opened from there; going back returns to where the driver was', async () => {
    browser = await openBrowser('phone');
    const page = await signIn(browser.page, baseUrl, 'maren@example.com', 'Maren Holloway');
    // Wait for the shell's later parts (the bell), which hold the rule, as a driver's phone would have them.
    await page.getByRole('link', { name: /notification/i }).waitFor();

    expect(await scrollOnceDrawn(page)).toBeGreaterThan(100);
    await page.getByRole('navigation').getByRole('link', { name: 'Cars' }).last().click();
    await page.getByRole('heading', { name: 'Cars', level: 1 }).waitFor();
    expect(await page.evaluate(() => window.scrollY)).toBe(0);

    await page.getByRole('link', { name: /Pebble/ }).first().click();
    await page.getByRole('heading', { name: 'Pebble', level: 1 }).waitFor();
    const carLeftAt = await scrollOnceDrawn(page);
    expect(carLeftAt).toBeGreaterThan(100);
    await page.getByRole('navigation').getByRole('link', { name: 'Calculators' }).last().click();
    await page.getByRole('heading', { name: 'Calculators', level: 1 }).waitFor();
    expect(await page.evaluate(() => window.scrollY)).toBe(0);
    await screenshot(page, 'navigation-new-page-at-top', { fullPage: false });

    // Back to the car: it returns where the driver left it, not at its top.
    await page.goBack();
    await page.getByRole('heading', { name: 'Pebble', level: 1 }).waitFor();
    await page.waitForFunction((y) => Math.abs(window.scrollY - y) <= 2, carLeftAt, { timeout: 5_000 });
  });

  it('when the driver leaves a long page from far down for a short one and goes back, then the long page returns to that place, not cut short', async () => {
    const page = browser!.page;
    await page.getByRole('navigation').getByRole('link', { name: 'Cars' }).last().click();
    // Wait for the list: a tap on the car page still showing would stand in place of it in the history.
    await page.getByRole('heading', { name: 'Cars', level: 1 }).waitFor();
    await page.getByRole('link', { name: /Pebble/ }).first().click();
    await page.getByRole('heading', { name: 'Pebble', level: 1 }).waitFor();
    await page.getByRole('heading', { name: 'Change log' }).waitFor();
    const at = await scrollOnceDrawn(page, 2500);
    expect(at).toBeGreaterThan(1500);

    // Event day is far shorter than the car page from where the driver was.
    await page.getByRole('navigation').getByRole('link', { name: 'Event day' }).last().click();
    await page.waitForURL((url) => !url.pathname.startsWith('/cars'));
    await page.getByRole('heading', { name: 'Pebble', level: 1 }).waitFor({ state: 'detached' });
    await page.goBack();
    await page.getByRole('heading', { name: 'Pebble', level: 1 }).waitFor();
    await page.waitForFunction((y) => Math.abs(window.scrollY - y) <= 2, at, { timeout: 5_000 });
  });

  it('when a calculator is jumped to from the links at the top, then it is scrolled to, clear of the top bar; the next page from the bottom bar still starts at its top', async () => {
    const page = browser!.page;
    await page.getByRole('navigation').getByRole('link', { name: 'Calculators' }).last().click();
    await page.getByRole('heading', { name: 'Calculators', level: 1 }).waitFor();
    await page.getByRole('navigation', { name: 'Jump to a calculator' }).getByRole('link', { name: 'Toe and camber' }).click();
    const heading = page.getByRole('heading', { name: 'Toe and camber', level: 2 });
    await page.waitForFunction(() => window.scrollY > 500);
    const headerBottom = await page.locator('header').first().evaluate((h) => h.getBoundingClientRect().bottom);
    const top = await heading.evaluate((h) => h.getBoundingClientRect().top);
    expect(top).toBeGreaterThanOrEqual(headerBottom);
    expect(top).toBeLessThan(300);
    await screenshot(page, 'calculators-jumped', { fullPage: false });

    await page.getByRole('navigation').getByRole('link', { name: 'Settings' }).last().click();
    await page.getByRole('heading', { name: 'Settings', level: 1 }).waitFor();
    expect(await page.evaluate(() => window.scrollY)).toBe(0);
  });

  it('when units are chosen and not yet saved, then Save sits right on top of the bottom bar, not under its edge', async () => {
    const page = browser!.page;
    await page.getByRole('navigation').getByRole('link', { name: 'Settings' }).last().click();
    const units = page.getByRole('form', { name: 'Units' });
    await units.getByRole('button', { name: 'Imperial' }).click();
    await units.getByText('Not saved yet', { exact: false }).waitFor();
    await page.evaluate(() => window.scrollTo(0, 0));

    const save = units.getByRole('button', { name: 'Save units' });
    const bar = await save.evaluate((b) => b.parentElement!.getBoundingClientRect());
    const nav = await page.getByRole('navigation', { name: 'Main' }).evaluate((n) => n.getBoundingClientRect());
    expect(Math.abs(bar.bottom - nav.top)).toBeLessThanOrEqual(0.5);
    await screenshot(page, 'settings-units-unsaved', { fullPage: false });
    // Nothing was saved: the choice goes back to what it was.
    await units.getByRole('button', { name: 'Metric' }).click();
  });
});

import { afterAll, describe, expect, inject, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { openBrowser, screenshot, SCREENSHOT_DIR, signIn, type OpenBrowser } from './browser';

/**
 * A service visit from both sides, once on a phone and once on a desktop: the shop opens a
 * work order on a customer's car, weighs the car before and after, closes it and prints the
 * handover sheet, and makes the invoice; the driver finds the setup the visit wrote and pays
 * through the hosted checkout (a local fake of the payment service, started by global-setup).
 */
const baseUrl = inject('baseUrl');
const SHOP = 'Kettle Lane Chassis Works';

type Corner = 'lf' | 'rf' | 'lr' | 'rr';
const CORNER_NAMES: Record<Corner, string> = { lf: 'Left front', rf: 'Right front', lr: 'Left rear', rr: 'Right rear' };

/** Scale readings; only ratios are asserted, so they read the same in kg or lb. */
const BEFORE: Record<Corner, number> = { lf: 312, rf: 296, lr: 281, rr: 303 };
const AFTER: Record<Corner, number> = { lf: 305, rf: 303, lr: 288, rr: 296 };

/**
 * Cross % = (LF + RR) / total, front % = (LF + RF) / total, left % = (LF + LR) / total, each to
 * one decimal: the usual corner-balance arithmetic (common practice), worked here by hand
 * rather than with the app's own calculation.
 */
function percentages(w: Record<Corner, number>) {
  const total = w.lf + w.rf + w.lr + w.rr;
  const pct = (part: number) => ((part / total) * 100).toFixed(1);
  return { cross: pct(w.lf + w.rr), front: pct(w.lf + w.rf), left: pct(w.lf + w.lr) };
}

/** One corner of a coilover build sheet, typed as the shop reads it off the bench (metric units). */
const BUILD_SHEET: [string, string][] = [
  ['Damper free length', '520'],
  ['Damper compressed length', '380'],
  ['Reference compressed length', '392'],
  ['Stroke', '140'],
  ['Body length setting', '14 threads showing'],
  ['Main spring rate', '80'],
  ['Main spring free length', '203'],
  ['Helper spring rate', '20'],
  ['Helper spring free length', '60'],
  ['Perch position', '32'],
  ['Preload', '4'],
  ['Bump clicks as delivered', '8'],
  ['Rebound clicks as delivered', '10'],
  ['Static wheel load', '300'],
  ['Wheel droop from ride height', '70'],
  ['Bump stop length', '40'],
  ['Notes', 'Threads cleaned and greased; lock rings torqued'],
];

let browser: OpenBrowser | undefined;

afterAll(async () => {
  await browser?.close();
});

async function signInAs(size: 'phone' | 'desktop', email: string, name: string): Promise<Page> {
  await browser?.close();
  browser = await openBrowser(size);
  return signIn(browser.page, baseUrl, email, name);
}

async function enterCornerWeights(form: Locator, stage: string, weights: Record<Corner, number>) {
  const grid = form.getByRole('group', { name: `${stage}: per corner` });
  for (const corner of Object.keys(weights) as Corner[]) {
    await grid.getByRole('group', { name: CORNER_NAMES[corner] }).getByLabel('Corner weight').fill(String(weights[corner]));
  }
}

async function noSidewaysScroll(page: Page) {
  const sideways = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
  expect(sideways).toBeLessThanOrEqual(0);
}

describe.each(['phone', 'desktop'] as const)('a service visit, staff then driver (%s)', (size) => {
  const requestedWork = `Corner balance with the driver in (${size})`;
  let workOrderUrl = '';
  let subtotalText = '';

  it('when staff open a work order, weigh the car before and after and close it, then the handover sheet prints on one page', async () => {
    const page = await signInAs(size, 'dusty@example.com', 'Dusty Okonjo');
    await page.getByRole('link', { name: /Your shop/ }).first().click();
    // The demo's coilover visit is still open on the shop's board.
    await page.getByRole('list', { name: 'Open work orders' }).getByRole('link').first().waitFor({ timeout: 20_000 });
    await page.getByRole('list', { name: 'Customers' }).getByRole('link', { name: /Pebble/ }).click();

    const open = page.getByRole('form', { name: 'Open a work order' });
    await open.getByLabel('Requested work').fill(requestedWork);
    await open.getByRole('button', { name: 'Open a work order' }).click();
    await page.getByLabel('Status').getByText('Open — work in progress').waitFor({ timeout: 15_000 });
    workOrderUrl = page.url();
    expect(workOrderUrl).toMatch(/\/work-orders\/[0-9a-f-]{36}$/);

    // Parts and labour.
    const lines = page.getByRole('form', { name: 'Parts and labour' });
    await lines.getByRole('button', { name: 'Add a part' }).click();
    const part = lines.getByRole('group', { name: 'Line 1' });
    await part.getByLabel('Description').fill('Rod-end boots');
    await part.getByLabel('Quantity').fill('2');
    await part.getByLabel('Price each').fill('12.50');
    await lines.getByRole('button', { name: 'Add labour' }).click();
    const labour = lines.getByRole('group', { name: 'Line 2' });
    await labour.getByLabel('Description').fill('Corner balance and alignment');
    await labour.getByLabel('Hours').fill('1.5');
    await labour.getByLabel('Rate per hour').fill('80');
    await lines.getByRole('button', { name: 'Save parts and labour' }).click();
    await lines.getByRole('status').getByText('Saved.').waitFor({ timeout: 15_000 });

    // The coilover build sheet, every corner filled: the longest handover sheet there can be.
    const sheet = page.getByRole('form', { name: 'Edit the build sheet' });
    for (const corner of ['LF', 'RF', 'LR', 'RR']) {
      await sheet.getByRole('radio', { name: corner }).check({ force: true });
      for (const [label, value] of BUILD_SHEET) await sheet.getByLabel(label, { exact: true }).fill(value);
    }
    await sheet.getByRole('button', { name: 'Save the build sheet' }).click();
    await sheet.getByRole('status').getByText('Saved.').waitFor({ timeout: 15_000 });
    if (size === 'phone') {
      // Read at the car, one corner at a time: each value sits under its label, over the corner's width, so none
      // is squeezed into a column a word wide ("38 mm of thread below the lock ring" took six lines beside its label).
      const grid = page.getByRole('group', { name: 'Build sheet, per corner' });
      await grid.getByRole('group', { name: 'Left front' }).getByText('Preload').waitFor({ timeout: 15_000 });
      const layout = await grid.evaluate(`[...document.querySelectorAll('[aria-label="Build sheet, per corner"] dd')].map((dd) => {
        const dt = dd.previousElementSibling.getBoundingClientRect(), box = dd.getBoundingClientRect();
        return { below: box.top >= dt.bottom - 1, lines: Math.round(box.height / parseFloat(getComputedStyle(dd).lineHeight)) };
      })`) as { below: boolean; lines: number }[];
      expect(layout.length).toBeGreaterThan(40);
      for (const dd of layout) {
        expect(dd.below).toBe(true);
        expect(dd.lines).toBeLessThanOrEqual(3);
      }
    }

    // Before: as the car came in, driver in the seat.
    const before = page.getByRole('form', { name: 'Before measurements' });
    await enterCornerWeights(before, 'Before', BEFORE);
    await before.getByLabel('Driver in the car').check();
    await before.getByLabel('Driver weight').fill('80');
    await before.getByLabel('Fuel level').fill('50');
    await before.getByRole('button', { name: 'Save before measurements' }).click();
    await before.getByRole('status').getByText('Saved.').waitFor({ timeout: 15_000 });

    // After: perches turned until the diagonals came closer to even.
    const after = page.getByRole('form', { name: 'After measurements' });
    await enterCornerWeights(after, 'After', AFTER);
    await after.getByLabel('Driver in the car').check();
    await after.getByLabel('Driver weight').fill('80');
    await after.getByLabel('Fuel level').fill('50');
    await after.getByRole('button', { name: 'Save after measurements' }).click();
    await after.getByRole('status').getByText('Saved.').waitFor({ timeout: 15_000 });

    const b = percentages(BEFORE);
    const a = percentages(AFTER);
    await page.getByText(`cross ${b.cross} % · front ${b.front} % · left ${b.left} %`).waitFor({ timeout: 15_000 });
    await page.getByText(`cross ${a.cross} % · front ${a.front} % · left ${a.left} %`).waitFor();
    await noSidewaysScroll(page);
    await screenshot(page, `service-${size}-measured`);

    const close = page.getByRole('form', { name: 'Close and hand over' });
    await close.getByRole('button', { name: 'Close and hand over…' }).click();
    await close.getByRole('button', { name: 'Yes, close and hand over' }).click();
    await page.getByLabel('Status').getByText(/^Closed — handed over/).waitFor({ timeout: 15_000 });
    // Nothing is editable any more.
    expect(await page.getByRole('form', { name: 'After measurements' }).count()).toBe(0);

    // The handover sheet: the page itself, printed.
    await page.emulateMedia({ media: 'print' });
    await expect(page.getByText(`Work order · ${SHOP}`).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('group', { name: 'Before → after, per corner' }).isVisible()).resolves.toBe(true);
    await expect(page.getByRole('table', { name: 'Parts and labour' }).isVisible()).resolves.toBe(true);
    await expect(page.getByText(/spring compressor/i).first().isVisible()).resolves.toBe(true);
    await expect(page.getByRole('button', { name: 'Print the handover sheet' }).isVisible()).resolves.toBe(false);
    await expect(page.getByRole('navigation').first().isVisible()).resolves.toBe(false);
    // Laid out at the width of an A4 page inside its margins (210 − 2 × 10 mm at 96 px to the inch).
    const screen = page.viewportSize()!;
    await page.setViewportSize({ width: 718, height: 1047 });
    await screenshot(page, `service-${size}-handover-print`);
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    mkdirSync(SCREENSHOT_DIR, { recursive: true });
    writeFileSync(join(SCREENSHOT_DIR, `service-${size}-handover.pdf`), pdf);
    await page.setViewportSize(screen);
    // Chromium writes one "/Type /Page" object per page (and one "/Type /Pages" tree).
    const pages = pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? [];
    expect(pages.length).toBe(1);
    await page.emulateMedia({ media: 'screen' });

    // The invoice, from the shop's side.
    await page.getByRole('button', { name: 'Make the invoice' }).click();
    const status = page.getByLabel('Invoice status');
    await status.getByText('Not paid yet').waitFor({ timeout: 15_000 });
    const invoice = page.getByRole('table', { name: 'Invoice lines' });
    subtotalText = (await invoice.getByRole('row', { name: /^Subtotal/ }).getByRole('cell').innerText()).trim();
    // 2 × 12.50 + 1.5 h × 80 = 145.00 before tax; the demo shop adds 8.25 %: 145.00 × 0.0825 = 11.9625,
    // 11.96 to the cent, 156.96 in all (worked by hand).
    expect(subtotalText).toMatch(/145\.00/);
    await invoice.getByRole('row', { name: /^Tax \(8\.25 %\)/ }).getByText(/11\.96/).waitFor();
    await invoice.getByRole('row', { name: /^Total/ }).getByText(/156\.96/).waitFor();
    await screenshot(page, `service-${size}-invoice-open`);
  });

  it('when the driver opens the car, then the new setup is there from the shop, and paying through the checkout marks the invoice paid', async () => {
    const page = await signInAs(size, 'maren@example.com', 'Maren Holloway');
    const workOrderId = workOrderUrl.split('/').pop()!;

    // Closing wrote exactly one snapshot, from the after stage, linked to the visit.
    const { carId, setups } = await page.evaluate(async () => {
      const cars = await (await fetch('/api/cars')).json();
      const carId = (cars.items as { id: string; name: string }[]).find((c) => c.name === 'Pebble')!.id;
      return { carId, setups: (await (await fetch(`/api/cars/${carId}/setups`)).json()).items };
    });
    type SetupRow = { id: string; label: string; workOrder: { id: string; shopName: string } | null; corners: Record<Corner, { cornerWeightKg: number | null }> };
    const written = (setups as SetupRow[]).filter((s) => s.workOrder?.id === workOrderId);
    expect(written).toHaveLength(1);
    expect(written[0]!.workOrder!.shopName).toBe(SHOP);
    const kg = written[0]!.corners;
    const total = kg.lf.cornerWeightKg! + kg.rf.cornerWeightKg! + kg.lr.cornerWeightKg! + kg.rr.cornerWeightKg!;
    expect((((kg.lf.cornerWeightKg! + kg.rr.cornerWeightKg!) / total) * 100).toFixed(1)).toBe(percentages(AFTER).cross);

    // On the car page: the visit, and its link to the snapshot it wrote.
    await page.goto(`${baseUrl}/cars/${carId}`);
    const visit = page.getByRole('list', { name: 'Shop visits' }).getByRole('listitem').filter({ hasText: requestedWork });
    await visit.getByRole('link', { name: 'Setup it wrote' }).click();
    const snapshot = page.locator(`#setup-${written[0]!.id}`);
    await snapshot.getByRole('link', { name: /^handed back by .+ after the visit of / }).waitFor({ timeout: 15_000 });
    await expect(snapshot.evaluate((el) => el.getBoundingClientRect().top < window.innerHeight)).resolves.toBe(true);
    await noSidewaysScroll(page);
    await screenshot(page, `service-${size}-driver-snapshot`, { fullPage: false });

    // The work order, read only, and its invoice.
    await snapshot.getByRole('link', { name: /^handed back by .+ after the visit of / }).click();
    await page.getByLabel('Invoice status').getByText('Not paid yet').waitFor({ timeout: 15_000 });
    expect(await page.getByRole('button', { name: 'Record a cash payment' }).count()).toBe(0);
    await page.getByRole('button', { name: 'Pay online' }).click();

    // The hosted checkout: another site, one Pay button.
    await page.waitForURL((url) => !url.href.startsWith(baseUrl), { timeout: 20_000 });
    await screenshot(page, `service-${size}-checkout`);
    await page.getByRole('button', { name: /^Pay .*156\.96/ }).click();

    // Back on the work order, paid.
    await page.waitForURL(`${workOrderUrl}?paid=1`, { timeout: 20_000 });
    await page.getByRole('status').getByText('Payment received — thank you').waitFor({ timeout: 20_000 });
    await page.getByLabel('Invoice status').getByText(/^Paid by card/).waitFor();
    expect(await page.getByRole('button', { name: 'Pay online' }).count()).toBe(0);
    await noSidewaysScroll(page);
    await screenshot(page, `service-${size}-paid`);

    // The invoice on a page of its own, as it prints: the shop's own lines on it, nothing of the app around it, one page.
    await page.getByRole('link', { name: 'Open the invoice to print' }).click();
    const doc = page.getByRole('article', { name: /^Invoice \d+$/ });
    await doc.waitFor({ timeout: 15_000 });
    await doc.getByLabel('Shop details').getByText(/Kettle Lane/).waitFor();
    await doc.getByRole('region', { name: 'For' }).getByText('Maren Holloway').waitFor();
    await noSidewaysScroll(page);
    await screenshot(page, `service-${size}-invoice-page`);
    await page.emulateMedia({ media: 'print' });
    expect(await page.getByRole('banner').isVisible()).toBe(false);
    expect(await page.getByRole('navigation', { name: 'Main' }).isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Print or save as PDF' }).isVisible()).toBe(false);
    expect(await doc.getByLabel('Invoice status').innerText()).toMatch(/^Paid by card/);
    const pdf = await page.pdf({ format: 'A4', printBackground: true });
    writeFileSync(join(SCREENSHOT_DIR, `service-${size}-invoice.pdf`), pdf);
    expect((pdf.toString('latin1').match(/\/Type\s*\/Page(?!s)/g) ?? []).length).toBe(1);
    await page.emulateMedia({ media: 'screen' });
  });

  it('when the shop opens the work order again, then it reads the invoice as paid', async () => {
    const page = await signInAs(size, 'dusty@example.com', 'Dusty Okonjo');
    await page.goto(workOrderUrl);
    await page.getByLabel('Invoice status').getByText(/^Paid by card/).waitFor({ timeout: 20_000 });
    expect(await page.getByRole('button', { name: 'Record a cash payment' }).count()).toBe(0);
  });
});

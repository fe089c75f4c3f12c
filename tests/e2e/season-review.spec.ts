import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, openPhone, screenshot, signIn } from './browser';

let phone: Awaited<ReturnType<typeof openPhone>>;
let page: Page;
const baseUrl = inject('baseUrl');
let carId: string;

beforeAll(async () => {
  phone = await openPhone();
  page = phone.page;
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('maren@example.com');
  await page.getByLabel('Password', { exact: true }).fill('cold-tyres-warm-coffee');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Hi, Maren Holloway' }).waitFor();
  const cars = await page.evaluate(async () => (await fetch('/api/cars')).json());
  carId = (cars.items as { id: string; name: string }[]).find((c) => c.name === 'Pebble')!.id;
}, 120_000);
afterAll(async () => {
  await phone?.close();
});

describe("the demo driver's season review (390×844)", () => {
  it('when camber is plotted against front wear, then the chart draws its points', async () => {
    await page.goto(`${baseUrl}/cars/${carId}/review`);
    await page.getByLabel('Setting (x)').selectOption('camber');
    await page.getByLabel('Where').selectOption('front');
    await page.getByLabel('Measured (y)').selectOption('wear');
    const chart = page.getByRole('img', { name: /Scatter plot of .*camber.* 16 points/i });
    await chart.waitFor({ timeout: 20_000 });
    // The canvas really drew: some pixels are not blank.
    const drawn = await page.evaluate(() => {
      const canvas = document.querySelector('canvas');
      if (!canvas) return 0;
      const ctx = canvas.getContext('2d')!;
      const data = ctx.getImageData(0, 0, canvas.width, canvas.height).data;
      let inked = 0;
      for (let i = 3; i < data.length; i += 4) if (data[i]! > 0) inked++;
      return inked;
    });
    expect(drawn).toBeGreaterThan(500);
    await chart.scrollIntoViewIfNeeded();
    await screenshot(page, 'review-scatter');
  });

  it('when the camber-arm change is compared, then the front inner edges wore less after it', async () => {
    const section = page.getByRole('region', { name: 'Before and after a change' });
    await section.getByLabel('Change to compare across').waitFor();
    const picked = await section.getByLabel('Change to compare across').evaluate((el) => (el as HTMLSelectElement).selectedOptions[0]?.textContent ?? '');
    // The default is the latest log entry about camber: one of the three written when the arms went on.
    expect(picked).toMatch(/2026.*camber/i);
    await section.getByText(/LF inner-edge wear fell/i).waitFor({ timeout: 20_000 });
    await section.getByText(/RF inner-edge wear fell/i).waitFor();
    await section.scrollIntoViewIfNeeded();
    await screenshot(page, 'review-before-after');
  });

  it('when the review opens on a phone, then every series of each chart is named in full below it, inside its card', async () => {
    await page.goto(`${baseUrl}/cars/${carId}/review`);
    // What the charts draw, from the same answers: one series per event (and the fitted line); one per driver
    // plus the setup-change and change-log marks.
    const scatter = await page.evaluate(async (id) => (await fetch(`/api/cars/${id}/analysis/scatter?x=camber&y=time&corner=front`)).json(), carId);
    const scatterSeries = new Set((scatter.points as { eventId: string | null }[]).map((p) => p.eventId)).size + (scatter.fit ? 1 : 0);
    const season = await page.evaluate(async (id) => (await fetch(`/api/cars/${id}/season?minDepthMm=1.6`)).json(), carId);
    const drivers = new Set(
      (season.events as { drivers: { driver: { id: string }; bestAdjustedSec: number | null }[] }[]).flatMap((e) =>
        e.drivers.filter((d) => d.bestAdjustedSec !== null).map((d) => d.driver.id),
      ),
    ).size;
    const timelineSeries = drivers + (season.setupChanges.length ? 1 : 0) + (season.changeLog.length ? 1 : 0);
    expect(scatterSeries).toBeGreaterThan(6); // more than Chart.js's own legend had room for at this size

    for (const [name, expected] of [['Setup against time and wear', scatterSeries], ['Season timeline', timelineSeries]] as const) {
      const card = page.getByRole('region', { name });
      await card.getByRole('img').waitFor({ timeout: 20_000 });
      const entries = card.getByRole('list', { name: 'Series on the chart' }).getByRole('button');
      expect(await entries.count()).toBe(expected);
      const cardBox = (await card.boundingBox())!;
      for (const entry of await entries.all()) {
        await entry.scrollIntoViewIfNeeded();
        expect(await entry.isVisible()).toBe(true);
        const box = (await entry.boundingBox())!;
        expect(box.x).toBeGreaterThanOrEqual(cardBox.x);
        expect(box.x + box.width).toBeLessThanOrEqual(Math.min(cardBox.x + cardBox.width, 390));
        // The whole label shows: nothing of it is clipped or scrolled out of the entry.
        expect(await entry.evaluate((el) => el.scrollWidth <= el.clientWidth && el.scrollHeight <= el.clientHeight)).toBe(true);
      }
    }
  });

  it('when the charts\' code is slow to arrive, then their keys are written out meanwhile and nothing below a chart moves when it lands', async () => {
    const slow = await openBrowser('phone', { serviceWorkers: 'block' });
    try {
      await signIn(slow.page, baseUrl, 'maren@example.com', 'Maren Holloway');
      let release: () => void = () => undefined;
      const held = new Promise<void>((resolve) => (release = resolve));
      await slow.page.route(/\/assets\/analysis-chart-[^/]+\.js$/, async (route) => {
        await held;
        await route.continue();
      });
      await slow.page.goto(`${baseUrl}/cars/${carId}/review`);
      const cards = ['Setup against time and wear', 'Season timeline'].map((name) => slow.page.getByRole('region', { name }));
      const below = cards.map((card) => card.getByRole('button', { name: 'Show as table' }));
      for (const card of cards) await card.getByText('Loading the chart…').waitFor({ timeout: 20_000 });
      const waiting = [];
      for (const [i, card] of cards.entries()) {
        const key = card.getByRole('list', { name: 'Series on the chart' }).getByRole('button');
        expect(await key.count()).toBeGreaterThan(1);
        expect(await key.first().isDisabled()).toBe(true);
        waiting.push({ entries: await key.allTextContents(), y: (await below[i]!.boundingBox())!.y });
      }
      await screenshot(slow.page, 'review-chart-loading');

      release();
      for (const card of cards) await card.locator('canvas').waitFor({ timeout: 20_000 });
      for (const [i, card] of cards.entries()) {
        const key = card.getByRole('list', { name: 'Series on the chart' }).getByRole('button');
        expect(await key.allTextContents()).toEqual(waiting[i]!.entries);
        expect(await key.first().isEnabled()).toBe(true);
        expect((await below[i]!.boundingBox())!.y).toBe(waiting[i]!.y);
      }
    } finally {
      await slow.close();
    }
  });

  it('when a series is pressed in the key, then the chart stops drawing it until it is pressed again', async () => {
    await page.goto(`${baseUrl}/cars/${carId}/review`);
    const card = page.getByRole('region', { name: 'Setup against time and wear' });
    await card.getByRole('img').waitFor({ timeout: 20_000 });
    const canvas = card.locator('canvas');
    const inked = () =>
      canvas.evaluate((el) => {
        const c = el as HTMLCanvasElement;
        const data = c.getContext('2d')!.getImageData(0, 0, c.width, c.height).data;
        let n = 0;
        for (let i = 3; i < data.length; i += 4) if (data[i]! > 0) n++;
        return n;
      });
    const before = await inked();
    const first = card.getByRole('list', { name: 'Series on the chart' }).getByRole('button').first();
    await first.click();
    expect(await first.getAttribute('aria-pressed')).toBe('false');
    await expect.poll(inked).toBeLessThan(before);
    await first.click();
    expect(await first.getAttribute('aria-pressed')).toBe('true');
    await expect.poll(inked).toBe(before);
    await card.getByRole('list', { name: 'Series on the chart' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'review-chart-key', { fullPage: false });
  });

  it('when the points are shown as a table on a phone, then each event heads its runs once, the plotted values are in view on one line each, and a swipe is asked for when the table is wider than its box', async () => {
    await page.goto(`${baseUrl}/cars/${carId}/review`);
    const card = page.getByRole('region', { name: 'Setup against time and wear' });
    await card.getByRole('img').waitFor({ timeout: 20_000 });
    await card.getByRole('button', { name: 'Show as table' }).click();
    // The points' table, not the one under it with each value's average.
    const table = card.getByRole('table', { name: /against .* points$/ });
    await table.waitFor();

    // Lines each cell's text is laid out on, and whether the measured value (y) ends inside the box unscrolled.
    const shape = await table.evaluate((t) => {
      const count = (el: Element) => {
        const range = document.createRange();
        range.selectNodeContents(el);
        return new Set([...range.getClientRects()].filter((r) => r.width > 0).map((r) => Math.round(r.top))).size;
      };
      const boxRight = t.parentElement!.getBoundingClientRect().right;
      const groups = [...t.querySelectorAll('tbody')];
      return {
        events: groups.map((g) => {
          const heading = g.querySelector('th[scope="rowgroup"]')!;
          return { name: heading.textContent ?? '', lines: count(heading) };
        }),
        rows: groups.flatMap((g) =>
          [...g.querySelectorAll('tr')]
            .filter((row) => row.firstElementChild?.getAttribute('scope') === 'row')
            .map((row) => {
              const [id, x, y] = [...row.children];
              return { id: count(id!), x: count(x!), y: count(y!), yInView: y!.getBoundingClientRect().right <= boxRight + 1 };
            }),
        ),
      };
    });
    expect(shape.rows.length).toBeGreaterThan(10);
    for (const row of shape.rows) expect(row).toEqual({ id: 1, x: 1, y: 1, yInView: true });
    expect(shape.events.length).toBeGreaterThan(1);
    expect(new Set(shape.events.map((e) => e.name)).size).toBe(shape.events.length);
    for (const event of shape.events) expect(event.lines).toBeLessThanOrEqual(3);

    // It scrolls inside its box, the page does not, and a line above says what is a swipe away exactly when it is wider.
    const box = card.getByRole('region', { name: /against .* points$/ });
    const wider = await box.evaluate((el) => el.scrollWidth > el.clientWidth);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBe(390);
    const hint = await box.getAttribute('aria-describedby');
    expect(hint !== null).toBe(wider);
    if (hint) {
      const line = page.locator(`[id="${hint}"]`);
      expect(await line.isVisible()).toBe(true);
      expect(await line.textContent()).toMatch(/^Swipe the table sideways for the setup/);
    }
    await box.scrollIntoViewIfNeeded();
    await screenshot(page, 'review-points-table', { fullPage: false });
  });

  it("when the timeline is shown as a table on a phone, then each date and each driver's time keep to one line, the first time in view", async () => {
    await page.goto(`${baseUrl}/cars/${carId}/review`);
    const card = page.getByRole('region', { name: 'Season timeline' });
    await card.getByRole('img').waitFor({ timeout: 20_000 });
    await card.getByRole('button', { name: 'Show as table' }).click();
    const table = card.getByRole('table');
    await table.waitFor();

    const lines = await table.evaluate((t) => {
      const count = (el: Node) => {
        const range = document.createRange();
        range.selectNodeContents(el);
        return new Set([...range.getClientRects()].filter((r) => r.width > 0).map((r) => Math.round(r.top))).size;
      };
      const boxRight = t.parentElement!.getBoundingClientRect().right;
      return [...t.querySelectorAll('tbody tr')].map((row) => {
        // The date, each driver's cell (the time, then the runs and cones under it), then the event.
        const [date, ...rest] = [...row.children];
        const drivers = rest.slice(0, -1);
        return {
          date: count(date!),
          times: drivers.map((d) => count(d.firstChild!)),
          firstInView: drivers[0]!.getBoundingClientRect().right <= boxRight + 1,
        };
      });
    });
    expect(lines.length).toBeGreaterThan(3);
    for (const row of lines) expect(row).toEqual({ date: 1, times: row.times.map(() => 1), firstInView: true });
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBe(390);
    const box = card.getByRole('region', { name: /^Best adjusted time per event/ });
    expect(await box.evaluate((el) => el.scrollWidth > el.clientWidth)).toBe(true);
    const hint = page.locator(`[id="${await box.getAttribute('aria-describedby')}"]`);
    expect(await hint.isVisible()).toBe(true);
    expect(await hint.textContent()).toMatch(/^Swipe the table sideways for/);
    await box.scrollIntoViewIfNeeded();
    await screenshot(page, 'review-timeline-table', { fullPage: false });
  });

  it("when a change is compared on a phone, then each corner's card is nearly the screen's width, one under another", async () => {
    await page.goto(`${baseUrl}/cars/${carId}/review`);
    const section = page.getByRole('region', { name: 'Before and after a change' });
    await section.getByText(/LF inner-edge wear/i).waitFor({ timeout: 20_000 });
    const wear = section.getByRole('group', { name: 'Tyre wear per run, before and after' });
    const boxes = [];
    for (const name of ['Left front', 'Right front', 'Left rear', 'Right rear']) boxes.push((await wear.getByRole('group', { name }).boundingBox())!);
    for (const box of boxes) {
      expect(box.width).toBeGreaterThanOrEqual(300);
      expect(box.x).toBeCloseTo(boxes[0]!.x, 0);
    }
    // Front before rear, left before right, each below the last.
    for (let i = 1; i < boxes.length; i++) expect(boxes[i]!.y).toBeGreaterThanOrEqual(boxes[i - 1]!.y + boxes[i - 1]!.height);
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBe(390);
    await wear.getByRole('group', { name: 'Left front' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'review-before-after-corners', { fullPage: false });
  });

  it('when corner weights are typed into the calculator, then it shows the cross weight', async () => {
    await page.goto(`${baseUrl}/calculators`);
    // REFERENCE worked example (common practice): LF 720, RF 680, LR 610, RR 590 → cross (LF + RR) 50.38 %.
    const values: Record<string, string> = { 'Left front': '720', 'Right front': '680', 'Left rear': '610', 'Right rear': '590' };
    for (const [corner, value] of Object.entries(values)) await page.getByLabel(`${corner} weight`).fill(value);
    const results = page.getByLabel('Corner balance', { exact: true });
    await page.getByText('50.38').first().waitFor();
    expect(await results.first().textContent()).toMatch(/Cross \(LF \+ RR\)\s*50\.38/);
    await screenshot(page, 'calculators-corner-balance');
  });
});

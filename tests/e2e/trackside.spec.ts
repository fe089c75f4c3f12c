import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { openBrowser, openPhone, screenshot, signIn } from './browser';

let phone: Awaited<ReturnType<typeof openPhone>>;
let page: Page;
const baseUrl = inject('baseUrl');
let eventId: string;
let carId: string;

/** Calls the API from the page's own session (same cookies, same CSRF token rules). */
async function api<T>(method: string, path: string, body?: unknown): Promise<{ status: number; json: T }> {
  return page.evaluate(
    async ({ method, path, body }) => {
      const headers: Record<string, string> = { Accept: 'application/json' };
      if (method !== 'GET') {
        const csrf = await (await fetch('/api/auth/csrf')).json();
        headers['X-CSRF-Token'] = csrf.token;
        headers['Content-Type'] = 'application/json';
      }
      const res = await fetch(path, { method, headers, body: body === undefined ? undefined : JSON.stringify(body) });
      return { status: res.status, json: res.status === 204 ? null : await res.json() };
    },
    { method, path, body },
  ) as Promise<{ status: number; json: T }>;
}

const runRows = () => page.getByRole('list', { name: 'Today’s runs, newest first' }).getByRole('listitem');

async function logRun(time: string | null, opts: { cones?: number; status?: 'DNF' | 'Off course' } = {}) {
  if (time) {
    for (const ch of time) {
      const name = ch === '.' ? 'Point' : ch === ':' ? 'Colon' : ch;
      await page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name, exact: true }).click();
    }
  }
  for (let i = 0; i < (opts.cones ?? 0); i++) await page.getByRole('button', { name: 'More: Cones' }).click();
  if (opts.status) await page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name: opts.status }).click();
  await page.getByRole('button', { name: /^Save run/ }).click();
  await page.getByText(/saved on this phone/).waitFor();
}

/** On a phone of its own at 320 × 640: Maren signs in and opens her board at the event; returns the keypad, on screen. */
async function boardAt320(own: Awaited<ReturnType<typeof openBrowser>>) {
  await own.page.setViewportSize({ width: 320, height: 640 });
  await signIn(own.page, baseUrl, 'maren@example.com', 'Maren Holloway');
  const me = await own.page.evaluate(async () => ((await (await fetch('/api/auth/me')).json()) as { user: { id: string } }).user.id);
  await own.page.goto(`${baseUrl}/events/${eventId}?carId=${carId}&driverId=${me}`);
  const keypad = own.page.getByRole('group', { name: 'Time keypad' });
  await keypad.waitFor();
  return keypad;
}

/** Waits until the service worker holds the app shell and answers for this page (a page opened before it was installed needs a reload). */
async function serviceWorkerInControl() {
  await page.waitForFunction(async () => (await navigator.serviceWorker.ready) && !!navigator.serviceWorker.controller, null, { timeout: 20_000 })
    .catch(async () => {
      await page.reload();
      await page.waitForFunction(() => !!navigator.serviceWorker.controller, null, { timeout: 20_000 });
    });
}

beforeAll(async () => {
  phone = await openPhone();
  page = phone.page;
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill('maren@example.com');
  await page.getByLabel('Password', { exact: true }).fill('cold-tyres-warm-coffee');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: 'Hi, Maren Holloway' }).waitFor();
  const cars = await api<{ items: { id: string; name: string }[] }>('GET', '/api/cars');
  carId = cars.json.items.find((c) => c.name === 'Pebble')!.id;
  const today = new Date().toISOString().slice(0, 10);
  const event = await api<{ id: string }>('POST', '/api/events', { name: 'Practice at Harrow Flats', date: today, venue: 'Harrow Flats airfield' });
  expect(event.status).toBe(201);
  eventId = event.json.id;
}, 120_000);
afterAll(async () => {
  await phone?.close();
});

describe('trackside on a phone (390×844)', () => {
  it('when the page is opened, then its text fonts are asked for with the page itself, not after the stylesheet, and every preloaded file is one the page draws with', async () => {
    const html = await (await fetch(`${baseUrl}/events/${eventId}?carId=${carId}`)).text();
    const preloaded = [...html.matchAll(/<link rel="preload" as="font" type="font\/woff2" href="([^"]+)" crossorigin>/g)].map((m) => m[1]!);
    expect(preloaded).toHaveLength(4);
    for (const href of preloaded) {
      const res = await fetch(baseUrl + href);
      expect(res.status).toBe(200);
      expect(res.headers.get('content-type')).toBe('font/woff2');
    }
    await page.goto(`${baseUrl}/events/${eventId}?carId=${carId}`);
    await page.getByRole('heading', { level: 1, name: 'Practice at Harrow Flats' }).waitFor();
    const used = await page.evaluate(async () => {
      await document.fonts.ready;
      return performance.getEntriesByType('resource').filter((e) => e.name.endsWith('.woff2')).map((e) => new URL(e.name).pathname);
    });
    // Nothing preloaded goes unused (which would cost a download for nothing on a weak signal).
    for (const href of preloaded) expect(used).toContain(href);
  });

  it('when the page is opened, then its document names every script the page runs before it draws, so none waits for another to be read first', async () => {
    const html = await (await fetch(`${baseUrl}/events/${eventId}?carId=${carId}`)).text();
    const named = [...html.matchAll(/<link rel="modulepreload" crossorigin href="([^"]+)">/g)].map((m) => m[1]!);
    const entry = /<script type="module" crossorigin src="([^"]+)"><\/script>/.exec(html)?.[1];
    expect(entry).toBeDefined();
    await page.goto(`${baseUrl}/events/${eventId}?carId=${carId}`);
    await page.getByRole('heading', { level: 1, name: 'Practice at Harrow Flats' }).waitFor();
    // The scripts fetched by the time the page is drawn: the entry, the main chunk and the page's own.
    const fetched = await page.evaluate(() =>
      performance.getEntriesByType('resource').map((e) => new URL(e.name).pathname).filter((p) => /^\/assets\/.+\.js$/.test(p)),
    );
    const drawnWith = fetched.filter((p) => /\/(app|rolldown-runtime|event-day|trackside|ui)-/.test(p));
    expect(drawnWith.length).toBeGreaterThanOrEqual(5);
    for (const p of drawnWith) expect(named, p).toContain(p);
  });

  it('when the page is opened from the server, then its event, setups and runs are asked for by the document, once each, and the page uses those answers', async () => {
    // A phone with no service worker, so the document comes from the server each time (as on a first visit).
    const own = await openBrowser('phone', { serviceWorkers: 'block' });
    try {
      await signIn(own.page, baseUrl, 'maren@example.com', 'Maren Holloway');
      const me = await own.page.evaluate(async () => ((await (await fetch('/api/auth/me')).json()) as { user: { id: string } }).user.id);
      const cdp = await own.context.newCDPSession(own.page);
      await cdp.send('Network.enable');
      const asked: { path: string; by: string }[] = [];
      cdp.on('Network.requestWillBeSent', (e) => {
        const url = new URL(e.request.url);
        if (url.pathname.startsWith('/api/')) asked.push({ path: url.pathname + url.search, by: e.initiator.type });
      });
      await own.page.goto(`${baseUrl}/events/${eventId}?carId=${carId}&driverId=${me}`);
      await own.page.getByRole('group', { name: 'Time keypad' }).waitFor();
      await own.page.getByText('No runs yet').waitFor();
      const reads = [`/api/events/${eventId}`, `/api/cars/${carId}/setups`, `/api/runs?carId=${carId}&eventId=${eventId}`];
      // "parser": named in the document; a second request of the same address would mean the page's own fetch
      // did not take the answer already on its way.
      for (const path of reads) expect(asked.filter((a) => a.path === path), path).toEqual([{ path, by: 'parser' }]);
    } finally {
      await own.close();
    }
  });

  it('when the page opens on the narrowest, shortest phone in common use (320 × 640), then the whole keypad and the Save bar are in reach without scrolling', async () => {
    const own = await openBrowser('phone');
    try {
      const keypad = await boardAt320(own);
      const saveBar = own.page.locator('form[aria-label="Log a run"] > .sticky');
      // The page has moved up by itself once the form is drawn: wait for it to settle.
      await expect.poll(() => own.page.evaluate(() => window.scrollY), { timeout: 5_000 }).toBeGreaterThan(0);
      const bar = (await saveBar.boundingBox())!;
      // The cones and Save share one row: a second row would cover the keypad's last keys.
      expect(bar.height, 'the Save bar is one row').toBeLessThan(100);
      for (const name of ['0', 'DNF', 'Off course', 'Clear']) {
        const key = (await keypad.getByRole('button', { name, exact: true }).boundingBox())!;
        expect(key.y + key.height, `the "${name}" key's bottom`).toBeLessThanOrEqual(bar.y);
      }
      // The time's own box is not under the page's header either.
      const headerBottom = await own.page.evaluate(() => document.querySelector('header')!.getBoundingClientRect().bottom);
      const timeBox = (await own.page.getByRole('textbox', { name: /Raw time/ }).boundingBox())!;
      expect(timeBox.y).toBeGreaterThanOrEqual(headerBottom);
      for (const name of ['Less: Cones', 'More: Cones', 'Save run 1']) {
        const tapped = await own.page.getByRole('button', { name }).evaluate((button) => {
          const box = button.getBoundingClientRect();
          return button.contains(document.elementFromPoint(box.x + box.width / 2, box.y + box.height / 2)) && box.bottom <= window.innerHeight;
        });
        expect(tapped, `a tap on "${name}"`).toBe(true);
      }
      await screenshot(own.page, 'trackside-320x640', { fullPage: false });
    } finally {
      await own.close();
    }
  });

  it('when a run waits on a 320 px phone with no signal, then the top bar shows the whole count with "offline" under it, and the bell and the account button stay on screen, on a small tablet and a laptop too', async () => {
    // A throwaway phone: its run never leaves it, so the event's runs below are not touched.
    const own = await openBrowser('phone');
    try {
      const keypad = await boardAt320(own);
      await own.context.setOffline(true);
      for (const name of ['4', '9', 'Point', '5']) await keypad.getByRole('button', { name, exact: true }).click();
      await own.page.getByRole('button', { name: /^Save run/ }).click();
      const badge = own.page.locator('header [role="status"]');
      await expect.poll(() => badge.textContent()).toContain('offline');

      // The narrowest phone, then a small tablet and a laptop, where the top bar also holds the page links (and,
      // on the laptop, the account's name).
      for (const [width, height] of [[320, 640], [768, 1024], [1024, 768]] as const) {
        await own.page.setViewportSize({ width, height });
        const bar = await badge.evaluate((status) => {
          // The line on screen (the full sentence is there too, for screen readers only).
          const count = [...status.querySelectorAll('span')].find((s) => s.textContent !== 'offline' && s.clientWidth > 1)!;
          const offline = [...status.querySelectorAll('span')].find((s) => s.textContent === 'offline') ?? null;
          return {
            count: count.textContent,
            cut: count.scrollWidth > count.clientWidth,
            countBottom: count.getBoundingClientRect().bottom,
            offlineTop: offline?.getBoundingClientRect().top ?? null,
            sideways: document.documentElement.scrollWidth - window.innerWidth,
          };
        });
        expect(bar.count, `at ${width} px`).toBe('1 waiting');
        expect(bar.cut, `the count is cut short at ${width} px`).toBe(false);
        expect(bar.offlineTop, '"offline" is on a line of its own').not.toBeNull();
        expect(bar.offlineTop!).toBeGreaterThanOrEqual(bar.countBottom - 1);
        expect(bar.sideways, `the page scrolls sideways at ${width} px`).toBeLessThanOrEqual(0);
        for (const name of [/^Account:/, /^(Notifications$|\d+ unread notification)/]) {
          const button = (await own.page.getByRole('button', { name }).or(own.page.getByRole('link', { name })).first().boundingBox())!;
          expect(button.x + button.width, `${String(name)} at ${width} px`).toBeLessThanOrEqual(width);
        }
      }
      await own.page.setViewportSize({ width: 320, height: 640 });
      await screenshot(own.page, 'trackside-320-offline', { fullPage: false });
    } finally {
      await own.close();
    }
  });

  it('when the driver logs a clean run, a run with 2 cones and a DNF, then adjusted times and the best show on screen', async () => {
    await page.goto(`${baseUrl}/events/${eventId}?carId=${carId}`);
    await page.getByRole('radio', { name: /Maren Holloway/ }).check({ force: true });
    await page.getByRole('button', { name: 'Start logging' }).click();
    await screenshot(page, 'trackside-empty');

    // The whole keypad is on the first screen, above the Save bar that stays at the bottom: "0", DNF, Off course
    // and "Clear" are not under it. The cones' − and + sit in the bar, so a tap on them lands on them, not on
    // something drawn over them; and the bar keeps its height once a run is saved.
    const firstScreen = async (when: string) => {
      await page.evaluate(() => window.scrollTo(0, 0));
      const saveBar = (await page.locator('form[aria-label="Log a run"] > .sticky').boundingBox())!;
      for (const name of ['0', 'DNF', 'Off course', 'Clear']) {
        const key = (await page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name, exact: true }).boundingBox())!;
        expect(key.y + key.height, `${when}: the "${name}" key's bottom`).toBeLessThanOrEqual(saveBar.y);
      }
      for (const name of ['Less: Cones', 'More: Cones']) {
        const tapped = await page.getByRole('button', { name }).evaluate((button) => {
          const box = button.getBoundingClientRect();
          return button.contains(document.elementFromPoint(box.x + box.width / 2, box.y + box.height / 2)) && box.bottom <= window.innerHeight;
        });
        expect(tapped, `${when}: a tap on "${name}"`).toBe(true);
      }
    };
    await firstScreen('before a run');

    await logRun('47.210');
    await firstScreen('after a run is saved');
    await logRun('46.905', { cones: 2 });
    // Pressing DNF changes the note under the time, in one line: the keys stay where the thumb is.
    const keyTop = () => page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name: '1', exact: true }).evaluate((k) => k.getBoundingClientRect().top);
    const before = await keyTop();
    await page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name: 'DNF' }).click();
    expect(await keyTop()).toBe(before);
    await page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name: 'DNF' }).click();
    await logRun(null, { status: 'DNF' });
    await page.waitForFunction(() => !document.body.textContent?.includes('Waiting'), null, { timeout: 15_000 }).catch(() => {});

    await expect.poll(() => runRows().count(), { timeout: 15_000 }).toBe(3);
    const best = page.getByRole('listitem', { name: /Run 1, Maren Holloway, best/ });
    await best.waitFor();
    // 46.905 s + 2 cones × 2 s = 50.905 s adjusted (time plus penalties, common practice); the clean 47.210 is best.
    await page.getByRole('listitem', { name: 'Run 2, Maren Holloway' }).getByText('50.905').waitFor();
    expect(await best.getByText('47.210').count()).toBeGreaterThan(0);
    await page.getByRole('listitem', { name: 'Run 3, Maren Holloway' }).getByText('DNF').first().waitFor();
    // Saved, the next run starts as finished again.
    expect(await page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name: 'DNF' }).getAttribute('aria-pressed')).toBe('false');
    await screenshot(page, 'trackside-three-runs');
  });

  it('when the phone goes offline and two runs are logged, then after a reload still offline both show as waiting', async () => {
    // The service worker must hold the app shell before the signal goes.
    await serviceWorkerInControl();
    await page.waitForTimeout(1500); // the query cache is written to the device at most once a second
    await phone.context.setOffline(true);
    await logRun('46.800');
    await logRun('46.650', { cones: 1 });
    await page.reload();
    await page.getByRole('heading', { name: 'Practice at Harrow Flats' }).waitFor({ timeout: 20_000 });
    await expect.poll(() => runRows().count(), { timeout: 15_000 }).toBe(5);
    expect(await page.getByRole('listitem', { name: /Run 4, Maren Holloway/ }).getByText(/waiting/i).count()).toBeGreaterThan(0);
    expect(await page.getByRole('listitem', { name: /Run 5, Maren Holloway/ }).getByText(/waiting/i).count()).toBeGreaterThan(0);
    await screenshot(page, 'trackside-offline-waiting');
  });

  it('when the page is reloaded offline a second time, after its reads have failed for want of signal, then it still opens with the same runs', async () => {
    // Reads asked again with no signal fail; the copy on the device must keep their last answers all the same.
    await page.goto(`${baseUrl}/`).catch(() => undefined);
    await page.getByRole('heading', { name: 'Hi, Maren Holloway' }).waitFor({ timeout: 20_000 });
    await page.waitForTimeout(6000); // retries given up, and the cache written again (at most once a second)
    await page.goto(`${baseUrl}/events/${eventId}?carId=${carId}`).catch(() => undefined);
    await page.getByRole('heading', { name: 'Practice at Harrow Flats' }).waitFor({ timeout: 20_000 });
    await expect.poll(() => runRows().count(), { timeout: 15_000 }).toBe(5);
    await page.waitForTimeout(6000);
    await page.reload();
    await page.getByRole('heading', { name: 'Practice at Harrow Flats' }).waitFor({ timeout: 20_000 });
    await expect.poll(() => runRows().count(), { timeout: 15_000 }).toBe(5);
    expect(await page.getByRole('listitem', { name: /Run 5, Maren Holloway/ }).getByText(/waiting/i).count()).toBeGreaterThan(0);
  });

  it('when the signal comes back, then the waiting runs upload exactly once', async () => {
    await phone.context.setOffline(false);
    await page.evaluate(() => window.dispatchEvent(new Event('online')));
    await expect
      .poll(async () => (await api<{ count: number }>('GET', `/api/runs?eventId=${eventId}&carId=${carId}`)).json.count, { timeout: 30_000 })
      .toBe(5);
    await page.getByText(/All saved/).first().waitFor({ timeout: 20_000 });
    // A second look later still finds five: nothing was sent twice.
    await page.waitForTimeout(1000);
    const runs = await api<{ items: { runNumber: number }[] }>('GET', `/api/runs?eventId=${eventId}&carId=${carId}`);
    expect(runs.json.items.map((r) => r.runNumber).sort()).toEqual([1, 2, 3, 4, 5]);
  });

  it('when the rear clicks go +2 in a quick change, then the next run shows the new setup', async () => {
    await page.getByRole('button', { name: 'Quick change' }).click();
    const form = page.getByRole('form', { name: 'Quick change' });
    await form.getByRole('button', { name: 'Rear', exact: true }).click();
    await form.getByRole('button', { name: /^More / }).click();
    await form.getByRole('button', { name: /^More / }).click();
    await screenshot(page, 'trackside-quick-change');
    await form.getByRole('button', { name: 'Save quick change' }).click();
    await page.getByText(/Setup now:/).waitFor();
    // The confirmation shows where it covers none of the next run's taps: the Save bar is free while it is up.
    const toast = page.getByText('Quick change saved').first();
    await toast.waitFor();
    await page.evaluate(() => window.scrollTo(0, 0));
    for (const name of [/^Save run/, 'More: Cones', 'Less: Cones']) {
      const free = await page.getByRole('button', { name }).evaluate((button) => {
        const box = button.getBoundingClientRect();
        return button.contains(document.elementFromPoint(box.x + box.width / 2, box.y + box.height / 2));
      });
      expect(free, `a tap on ${String(name)} while the toast shows`).toBe(true);
    }
    const label = (await page.getByText(/Setup now:/).locator('..').textContent()) ?? '';
    expect(label).toMatch(/rear/i);
    await logRun('46.400');
    const run6 = page.getByRole('listitem', { name: /Run 6, Maren Holloway/ });
    await run6.waitFor();
    await expect.poll(async () => (await run6.textContent()) ?? '').toMatch(/Setup: Quick change: rear clicks \+2/);
    await expect
      .poll(async () => {
        const runs = await api<{ items: { runNumber: number; setupId: string }[] }>('GET', `/api/runs?eventId=${eventId}&carId=${carId}`);
        const setups = await api<{ items: { id: string; label: string }[] }>('GET', `/api/cars/${carId}/setups`);
        const six = runs.json.items.find((r) => r.runNumber === 6);
        return six ? setups.json.items.find((s) => s.id === six.setupId)?.label : null;
      }, { timeout: 20_000 })
      .toMatch(/rear clicks \+2/);
    await screenshot(page, 'trackside-after-quick-change');
  });

  it('when a co-driver is picked at an earlier event and the page is reloaded, with signal and then without, then it stays on that event, car and driver, and the runs are headed with the event’s date', async () => {
    const day = new Date(Date.now() - 30 * 86_400_000).toISOString().slice(0, 10);
    const earlier = await api<{ id: string }>('POST', '/api/events', { name: 'Spring practice at Harrow Flats', date: day, venue: 'Harrow Flats airfield' });
    expect(earlier.status).toBe(201);
    const path = `/events/${earlier.json.id}`;
    await page.goto(baseUrl + path);
    await page.getByRole('radio', { name: /Pebble/ }).check({ force: true });
    // Not the one signed in, so a choice that was forgotten would show: the picker offers Maren first.
    await page.getByRole('radio', { name: /Teo Varga/ }).check({ force: true });
    await page.getByRole('button', { name: 'Open that day’s runs' }).click();

    const onTheEvent = async () => {
      await page.getByRole('heading', { level: 1, name: 'Spring practice at Harrow Flats' }).waitFor({ timeout: 20_000 });
      await page.getByRole('form', { name: 'Log a run' }).waitFor({ timeout: 20_000 });
      expect(new URL(page.url()).pathname).toBe(path);
      expect(await page.getByRole('form', { name: 'Car and driver' }).count()).toBe(0);
      const carLine = await page.getByRole('button', { name: 'Change car or driver' }).locator('..').textContent();
      expect(carLine).toMatch(/^Pebble #\d+ · Teo Varga/);
      expect(await page.getByRole('form', { name: 'Log a run' }).textContent()).toContain('Teo Varga');
      // A past event: its runs are not "today's".
      await page.getByRole('heading', { level: 2, name: /^Runs on / }).waitFor();
      expect(await page.getByRole('heading', { name: 'Today’s runs' }).count()).toBe(0);
    };
    await onTheEvent();

    await page.reload();
    await onTheEvent();

    // With no signal the page comes from the service worker, and the event and the car from the device.
    await serviceWorkerInControl();
    await page.waitForTimeout(1500); // the query cache is written to the device at most once a second
    await phone.context.setOffline(true);
    try {
      await page.reload();
      await onTheEvent();
      await screenshot(page, 'trackside-earlier-event-reloaded-offline', { fullPage: false });
    } finally {
      await phone.context.setOffline(false);
    }
  });
});

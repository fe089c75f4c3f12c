import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { afterAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { onePhoneAtATime } from './browser';

/**
 * Every main screen of each role, at phone size, checked with axe-core (Deque's open-source engine for the
 * WCAG 2.2 A and AA success criteria that can be tested automatically: names and labels, roles and their
 * required children, contrast, and so on). What axe cannot judge (reading order, wording) is left to review.
 */
const baseUrl = inject('baseUrl');
const AXE_SOURCE = readFileSync(createRequire(import.meta.url).resolve('axe-core/axe.min.js'), 'utf8');
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa'];

interface Violation {
  id: string;
  impact: string | null;
  help: string;
  nodes: { target: string[] }[];
}
interface Axe {
  run: (context: Document | { include: string[][] }, options: object) => Promise<{ violations: Violation[] }>;
}

const phones = onePhoneAtATime(baseUrl);
const signInAs = phones.signInAs;
afterAll(async () => {
  await phones.close();
});

/** The page's violations, each as "page: rule (impact) — what, at: first targets", so a failure says where. */
async function audit(page: Page, name: string): Promise<string[]> {
  // Whatever the page loads after its first drawing (its data, a lazy chart) is in before the check.
  await page.waitForLoadState('networkidle');
  await page.evaluate(AXE_SOURCE);
  const violations = await page.evaluate(async (tags) => {
    const { axe } = window as unknown as { axe: Axe };
    const found = (await axe.run(document, { runOnly: { type: 'tag', values: tags } })).violations;
    // Target size counts only the part of a control in view: one a sticky bar (the Save bar) covers at this
    // scroll position is judged again where it is in view, as the reader would reach it.
    for (const v of found.filter((x) => x.id === 'target-size')) {
      const still: typeof v.nodes = [];
      for (const node of v.nodes) {
        document.querySelector(node.target[0]!)?.scrollIntoView({ block: 'center' });
        const again = await axe.run({ include: [node.target] }, { runOnly: { type: 'rule', values: ['target-size'] } });
        if (again.violations.length) still.push(node);
      }
      v.nodes = still;
    }
    window.scrollTo(0, 0);
    return found.filter((v) => v.nodes.length);
  }, WCAG_TAGS);
  return violations.map((v) => `${name}: ${v.id} (${v.impact}) — ${v.help}, at: ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(' | ')}`);
}

async function auditAll(page: Page, paths: [name: string, path: string][]): Promise<string[]> {
  const found: string[] = [];
  for (const [name, path] of paths) {
    await page.goto(`${baseUrl}${path}`);
    await page.locator('main h1').first().waitFor({ timeout: 20_000 });
    found.push(...(await audit(page, name)));
  }
  return found;
}

const firstId = async (page: Page, url: string) => ((await page.evaluate(async (u) => (await fetch(u)).json(), url)) as { items: { id: string }[] }).items[0]!.id;

/** The demo driver's car (Pebble) and the newest event, with its board as she drives it, read as the signed-in driver. */
async function driverRecords(page: Page) {
  const cars = (await page.evaluate(async () => (await fetch('/api/cars')).json())) as { items: { id: string; name: string }[] };
  const carId = cars.items.find((c) => c.name === 'Pebble')!.id;
  const eventId = await firstId(page, '/api/events');
  const me = ((await page.evaluate(async () => (await fetch('/api/auth/me')).json())) as { user: { id: string } }).user.id;
  return { carId, board: `/events/${eventId}?carId=${carId}&driverId=${me}` };
}

/** The screens a driver goes through most, for the checks every driver's screen has to pass. */
function driverMainScreens({ carId, board }: { carId: string; board: string }): [name: string, path: string][] {
  return [
    ['home', '/'],
    ['events', '/events'],
    ['event day', board],
    ['car', `/cars/${carId}`],
    ['new setup', `/cars/${carId}/setups/new`],
    ['tread', `/cars/${carId}/tread`],
    ['season review', `/cars/${carId}/review`],
    ['calculators', '/calculators'],
    ['settings', '/settings'],
  ];
}

describe('WCAG 2.2 A and AA checks that axe-core can make, on every main screen at 390×844', () => {
  it('when someone not signed in opens the sign-in, registration and password-reset screens, then none breaks a rule', async () => {
    const page = await phones.fresh();
    const found = await auditAll(page, [
      ['sign-in', '/sign-in'],
      ['register', '/register'],
      ['forgot password', '/forgot-password'],
    ]);
    // A refused sign-in, its message on screen.
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText(/e-mail/i).first().waitFor();
    found.push(...(await audit(page, 'sign-in, refused')));
    expect(found).toEqual([]);
  });

  it('when the driver goes through their screens, then none breaks a rule', async () => {
    const page = await signInAs('maren@example.com', 'Maren Holloway');
    const records = await driverRecords(page);
    const { carId, board } = records;
    const found = await auditAll(page, [
      ...driverMainScreens(records),
      ['notifications', '/notifications'],
      ['teams', '/teams'],
      ['import results', `/cars/${carId}/import`],
      ['setup sheet', `/setups/${await firstId(page, `/api/cars/${carId}/setups`)}/sheet`],
    ]);
    // The run form's optional part, open, and a refused value marked on it.
    await page.goto(`${baseUrl}${board}`);
    await page.getByRole('button', { name: /Hot pressures and note/ }).click();
    await page.getByLabel('Left rear hot pressure').fill('3o');
    await page.getByRole('button', { name: /^Save run/ }).click();
    await page.getByText('Not saved: fix what is marked.').waitFor();
    found.push(...(await audit(page, 'event day, a refused run')));
    // Closing the account: the question open, with its password refused for being empty (nothing is sent).
    await page.goto(`${baseUrl}/settings`);
    await page.getByRole('button', { name: 'Close account…' }).click();
    await page.getByRole('button', { name: 'Close my account' }).click();
    await page.getByRole('form', { name: 'Close account' }).getByText('Enter your password').waitFor();
    found.push(...(await audit(page, 'settings, closing the account')));
    expect(found).toEqual([]);
  });

  it('when the phone asks for the dark theme, then the driver\'s main screens break no rule either (contrast above all)', async () => {
    const page = await signInAs('maren@example.com', 'Maren Holloway');
    await page.emulateMedia({ colorScheme: 'dark' });
    expect(await page.evaluate(() => matchMedia('(prefers-color-scheme: dark)').matches)).toBe(true);
    const { carId, board } = await driverRecords(page);
    const found = await auditAll(page, [
      ['home, dark', '/'],
      ['event day, dark', board],
      ['car, dark', `/cars/${carId}`],
      ['tread, dark', `/cars/${carId}/tread`],
      ['season review, dark', `/cars/${carId}/review`],
      ['calculators, dark', '/calculators'],
      ['settings, dark', '/settings'],
    ]);
    expect(found).toEqual([]);
  });

  it('when the shop goes through its screens, then none breaks a rule', async () => {
    const page = await signInAs('dusty@example.com', 'Dusty Okonjo');
    const found = await auditAll(page, [['shop', '/shop']]);
    await page.getByRole('list', { name: 'Customers' }).getByRole('link', { name: /Pebble/ }).click();
    await page.getByRole('heading', { name: 'Setup history' }).waitFor({ timeout: 20_000 });
    found.push(...(await audit(page, 'customer')));
    await page.goto(`${baseUrl}/shop`);
    await page.getByRole('region', { name: 'Open work orders' }).getByRole('link').first().click();
    await page.waitForURL(/\/work-orders\//);
    await page.locator('main h1').first().waitFor({ timeout: 20_000 });
    found.push(...(await audit(page, 'work order')));
    expect(found).toEqual([]);
  });

  it('when the captain opens the team, its class board and one event on it, then none breaks a rule', async () => {
    const page = await signInAs('ines@example.com', 'Ines Brandvold');
    const found = await auditAll(page, [['teams', '/teams']]);
    await page.getByRole('link', { name: /board/i }).first().click();
    await page.getByRole('heading', { name: 'Class board' }).waitFor({ timeout: 20_000 });
    found.push(...(await audit(page, 'class board')));
    await page.getByRole('link', { name: /Spring Round 1/ }).first().click();
    await page.getByRole('link', { name: 'Whole class board' }).waitFor({ timeout: 20_000 });
    found.push(...(await audit(page, 'class board, one event')));
    expect(found).toEqual([]);
  });

  it('when the admin opens the accounts and the question before a suspension, then neither breaks a rule', async () => {
    const page = await signInAs('admin@example.com', 'Scrubline Admin');
    const found = await auditAll(page, [['accounts', '/accounts']]);
    // The question with its field refused (no reason given); cancelled, so no account is suspended.
    await page.getByRole('button', { name: /^Suspend / }).first().click();
    await page.getByRole('button', { name: 'Suspend account' }).click();
    await page.getByText('Say why, for the next admin who reads this').waitFor();
    found.push(...(await audit(page, 'suspend question, refused')));
    await page.getByRole('button', { name: 'Cancel' }).click();
    expect(found).toEqual([]);
  });

  it('when the admin closes a suspended account for good, then the question breaks no rule, a wrong address is refused, and the account is gone', async () => {
    // An account of its own, registered from elsewhere, so that no demo account changes for the other tests.
    const email = `leaving-${randomUUID().slice(0, 8)}@example.com`;
    /** A write from a browser of its own: a fresh session and its CSRF token each time. */
    const postElsewhere = async (path: string, body: object) => {
      const csrf = await fetch(`${baseUrl}/api/auth/csrf`);
      const cookie = csrf.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
      const { token } = (await csrf.json()) as { token: string };
      return fetch(`${baseUrl}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie }, body: JSON.stringify(body) });
    };
    const registered = await postElsewhere('/api/auth/register', { email, password: 'long-enough-to-leave-with', displayName: 'Odile Marchetti' });
    expect(registered.status).toBe(201);

    const page = await signInAs('admin@example.com', 'Scrubline Admin');
    await page.goto(`${baseUrl}/accounts`);
    await page.getByLabel('Find an account').fill(email);
    await page.getByRole('button', { name: 'Suspend Odile Marchetti' }).click();
    await page.getByLabel('Why').fill('Asked by e-mail to be removed');
    await page.getByRole('button', { name: 'Suspend account' }).click();
    await page.getByRole('button', { name: 'Close for good Odile Marchetti' }).click();
    await page.getByRole('button', { name: 'Close the account' }).click();
    await page.getByText('Type the account’s e-mail address').waitFor();
    const found = await audit(page, 'close question, refused');
    await page.getByLabel('Their e-mail address').fill('someone-else@example.com');
    await page.getByRole('button', { name: 'Close the account' }).click();
    await page.getByText('Type the account’s e-mail address exactly as shown').waitFor();
    await page.getByLabel('Their e-mail address').fill(email);
    await page.getByRole('button', { name: 'Close the account' }).click();
    await page.getByText(`No account’s name or e-mail holds “${email}”.`).waitFor();
    expect(found).toEqual([]);

    expect((await postElsewhere('/api/auth/login', { email, password: 'long-enough-to-leave-with' })).status).toBe(401);
  });
});

/**
 * WCAG 2.2 SC 1.4.10 Reflow: at 320 CSS px wide nothing needs scrolling sideways, except content that needs two
 * dimensions to be read (a season table opened under the review's charts, which scrolls inside its own box; the
 * class board is a list at this width). And the bottom bar's tabs keep their words on one line, so no icon is
 * pushed out of line with the others.
 */
describe('reflow at 320 CSS px wide, the narrowest phone in common use', () => {
  /** For each page, how far it scrolls sideways and whether the bottom bar's tabs are all one height. */
  async function reflow(page: Page, paths: [name: string, path: string][]): Promise<string[]> {
    await page.setViewportSize({ width: 320, height: 640 });
    const found: string[] = [];
    for (const [name, path] of paths) {
      await page.goto(`${baseUrl}${path}`);
      await page.locator('main h1').first().waitFor({ timeout: 20_000 });
      await page.waitForLoadState('networkidle');
      const { sideways, tabHeights, tabsSpilling } = await page.evaluate(() => {
        // The bar drawn at this width (the one along the top is hidden on phones).
        const tabs = [...document.querySelectorAll('nav[aria-label="Main"] a')].filter((a) => a.getBoundingClientRect().height > 0);
        return {
          sideways: document.documentElement.scrollWidth - document.documentElement.clientWidth,
          tabHeights: tabs.map((a) => Math.round(a.getBoundingClientRect().height)),
          tabsSpilling: tabs.filter((a) => a.scrollWidth > a.clientWidth).map((a) => a.textContent),
        };
      });
      if (sideways > 0) found.push(`${name}: scrolls ${sideways} px sideways`);
      if (new Set(tabHeights).size > 1) found.push(`${name}: bottom bar tabs of heights ${tabHeights.join(', ')}`);
      if (tabsSpilling.length) found.push(`${name}: tab words wider than their tab: ${tabsSpilling.join(', ')}`);
    }
    return found;
  }

  it('when the driver, the shop and the captain go through their screens, then none scrolls sideways and the bottom bar stays level', async () => {
    let page = await signInAs('maren@example.com', 'Maren Holloway');
    const records = await driverRecords(page);
    const { carId } = records;
    const found = await reflow(page, driverMainScreens(records));

    page = await signInAs('dusty@example.com', 'Dusty Okonjo');
    found.push(...(await reflow(page, [['shop', '/shop'], ['customer', `/shop/customers/${carId}`]])));

    page = await signInAs('ines@example.com', 'Ines Brandvold');
    const teamId = await firstId(page, '/api/teams/mine');
    await page.goto(`${baseUrl}/teams/${teamId}/board`);
    const oneEvent = await page.getByRole('link', { name: /Spring Round 1/ }).first().getAttribute('href');
    found.push(
      ...(await reflow(page, [['team', `/teams/${teamId}`], ['class board', `/teams/${teamId}/board`], ['class board, one event', oneEvent!]])),
    );
    expect(found).toEqual([]);
  });
});

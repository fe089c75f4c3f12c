import { mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

export const PHONE = { width: 390, height: 844 };
export const DESKTOP = { width: 1280, height: 800 };
export const SCREENSHOT_DIR = join(import.meta.dirname, '..', '..', 'test-results', 'e2e');

const journals = new Map<Page, string[]>();

/** The pages of every browser the tests have open now (for the report on a failed test). */
export function openPages(): Page[] {
  return [...journals.keys()].filter((page) => !page.isClosed());
}

/** What a page logged and asked for, oldest first: console lines, failed requests and every API answer with its time. */
export function pageJournal(page: Page): string[] {
  return journals.get(page) ?? [];
}

function keepJournal(page: Page) {
  const journal: string[] = [];
  journals.set(page, journal);
  const started = Date.now();
  const note = (line: string) => {
    journal.push(`${((Date.now() - started) / 1000).toFixed(1)} s ${line}`);
    if (journal.length > 200) journal.shift();
  };
  page.on('console', (m) => note(`console ${m.type()}: ${m.text().slice(0, 300)}`));
  page.on('pageerror', (e) => note(`page error: ${e.message.slice(0, 300)}`));
  page.on('requestfailed', (r) => note(`failed ${r.method()} ${r.url()}: ${r.failure()?.errorText ?? ''}`));
  page.on('response', (r) => {
    if (r.url().includes('/api/')) note(`${r.request().method()} ${new URL(r.url()).pathname} ${r.status()}`);
  });
  page.on('framenavigated', (f) => {
    if (f === page.mainFrame()) note(`navigated to ${f.url()}`);
  });
}

export interface OpenBrowser {
  context: BrowserContext;
  page: Page;
  close: () => Promise<void>;
}

/** Debian's Chromium through playwright-core, on a fresh profile; never a downloaded browser. */
export function openPhone(): Promise<OpenBrowser> {
  return openBrowser('phone');
}

/** A phone (390×844, touch) or a desktop window (1280×800, mouse), each on a fresh profile. */
/** `serviceWorkers: 'block'` lets a test hold back the app's own files (routes do not see what a service worker answers). */
export async function openBrowser(size: 'phone' | 'desktop', { serviceWorkers = 'allow' }: { serviceWorkers?: 'allow' | 'block' } = {}): Promise<OpenBrowser> {
  const phone = size === 'phone';
  const profile = mkdtempSync(join(tmpdir(), 'scrubline-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: phone ? PHONE : DESKTOP,
    deviceScaleFactor: phone ? 2 : 1,
    isMobile: phone,
    hasTouch: phone,
    serviceWorkers,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'],
  });
  const page = context.pages()[0] ?? (await context.newPage());
  keepJournal(page);
  return {
    context,
    page,
    async close() {
      journals.delete(page);
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** The whole page by default; `{ fullPage: false }` for what the window shows (after a jump to an anchor). */
export async function screenshot(page: Page, name: string, { fullPage = true }: { fullPage?: boolean } = {}) {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const path = join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path, fullPage });
  return path;
}

/** The demo accounts' password (server/db/demo-accounts.ts). */
export const DEMO_PASSWORD = 'cold-tyres-warm-coffee';

/** Signs a demo account in through the sign-in page and waits for its home page. */
export async function signIn(page: Page, baseUrl: string, email: string, name: string): Promise<Page> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(DEMO_PASSWORD);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('heading', { name: `Hi, ${name}` }).waitFor({ timeout: 20_000 });
  return page;
}

/**
 * One person at a time, each on their own phone: a fresh browser profile for each, so nothing of the last person
 * is cached. `close()` in the spec's afterAll.
 */
export function onePhoneAtATime(baseUrl: string) {
  let open: OpenBrowser | undefined;
  const fresh = async (): Promise<Page> => {
    await open?.close();
    open = await openPhone();
    return open.page;
  };
  return {
    /** A new phone with nobody signed in. */
    fresh,
    signInAs: async (email: string, name: string): Promise<Page> => signIn(await fresh(), baseUrl, email, name),
    /** The phone now in hand. */
    get page(): Page | undefined {
      return open?.page;
    },
    close: async () => open?.close(),
  };
}

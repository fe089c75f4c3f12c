// Page speed of one page of the built app, two ways:
// - measureWithPlaywright: Debian's Chromium through playwright-core at phone size, with the CPU
//   slowed 4× (DevTools protocol Emulation.setCPUThrottlingRate), a cold profile each run, and the
//   metrics read from the page's own PerformanceObserver entries.
// - measureWithLighthouse: Lighthouse's performance category, mobile, in the same Chromium.
import { spawn } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { chromium, type Locator, type Page } from 'playwright-core';
import type { Flags, Result } from 'lighthouse';
import { ROOT } from './env';

export interface PageSpeedTarget {
  /** e.g. http://127.0.0.1:4173 */
  baseUrl: string;
  /** e.g. /events/<id>?carId=<id> */
  path: string;
  /** `scrubline.sid=…` of a signed-in session. */
  cookie: string;
  /**
   * localStorage entries of the app's origin, written before the app's scripts run on every load
   * (e.g. the car and driver already chosen for an event, as on the driver's phone).
   */
  localStorage?: Record<string, string>;
}

/** The control whose first tap is timed, and how the page shows that it answered. */
export interface TapProbe {
  control: (page: Page) => Locator;
  /** A JavaScript expression, evaluated in the page once per frame after the tap: true once the answer shows. */
  answered: string;
}

/** The trackside page: the keypad's "1", answered once the time display reads "1". */
export const TRACKSIDE_PROBE: TapProbe = {
  control: (page) => page.getByRole('group', { name: 'Time keypad' }).getByRole('button', { name: '1', exact: true }),
  answered: `[...document.querySelectorAll('form[aria-label="Log a run"] input')].some((input) => input.value === '1')`,
};

export interface PlaywrightRun {
  /** First Contentful Paint, from navigation start. */
  fcpMs: number;
  /** Largest Contentful Paint: the last `largest-contentful-paint` entry (no input came before it). */
  lcpMs: number;
  /** Description of the LCP element (tag, id, start of its text), to check what was measured. */
  lcpElement: string | null;
  /** Cumulative Layout Shift: the largest session window of shifts (see clsOf). */
  clsScore: number;
  /** Total Blocking Time between FCP and interactiveMs (see totalBlockingTime). */
  tbtMs: number;
  /** Time to Interactive, the lab approximation the TBT window ends at (see timeToInteractive). */
  interactiveMs: number;
  /** False when no 5 s quiet window came before the time limit: interactiveMs and tbtMs then end at the last sample. */
  settled: boolean;
  /**
   * Time until the page responds to input, measured on a second cold load: the probe's control is
   * tapped as soon as it is visible and stable, and this is the time from navigation start to the
   * first animation frame in which the page shows the answer.
   */
  inputReadyMs: number;
  /** On that load, from the tap (its Event Timing `first-input` start) to that frame: how long the tap waited. */
  inputWaitMs: number;
  /** The page's address at the end of the run (a sign-in redirect shows here). */
  finalUrl: string;
}

export interface PlaywrightOptions {
  probe?: TapProbe;
  /** Saves what the phone shows at the end of the last run's first load. */
  screenshotPath?: string;
  /** Longest wait for a quiet window after navigation, in wall time (ms). */
  maxWaitMs?: number;
}

export interface LighthouseRun {
  lcpMs: number;
  tbtMs: number;
  cls: number;
  fcpMs: number;
  /** The performance category score, 0–100 as the report shows it. */
  performanceScore: number;
  /** The URL shown at the end of the load (a sign-in redirect shows here). */
  finalUrl: string;
  /** Lighthouse's label of the LCP element (null when its audit failed: see warnings). */
  lcpElement: string | null;
  /** The final frame as a data: URL (JPEG), to check what was measured. */
  finalScreenshot: string | null;
  /** Lighthouse's run warnings, and the audits that failed (their ids and errors). */
  warnings: string[];
}

const CHROMIUM_PATH = process.env.CHROME_PATH ?? process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
/** The flags tests/e2e/browser.ts starts Chromium with: no sandbox (root in a container), nothing that calls home. */
const CHROMIUM_FLAGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
  '--disable-component-update', '--disable-sync'];
const PHONE = { width: 390, height: 844 };
/** The CPU slowdown of Lighthouse's mobile preset (cpuSlowdownMultiplier: 4 for "Slow 4G"), so both tools assume the same phone. */
const CPU_SLOWDOWN = 4;

// web.dev, "Time to Interactive (TTI)": a quiet window is at least 5 s with no long task and no
// more than two network GET requests in flight (https://web.dev/articles/tti).
const QUIET_WINDOW_MS = 5_000;
const QUIET_MAX_IN_FLIGHT = 2;
// web.dev, "Total Blocking Time (TBT)": a task longer than 50 ms blocks for its time above 50 ms
// (https://web.dev/articles/tbt).
const BLOCKING_THRESHOLD_MS = 50;

// ---------------------------------------------------------------------------------------------
// Playwright

interface Span {
  start: number;
  end: number;
}

/** What the page script (below) has collected, in milliseconds from navigation start. */
interface PageRecord {
  now: number;
  fcp: number | null;
  lcp: { time: number; element: string | null } | null;
  shifts: { time: number; value: number }[];
  longTasks: Span[];
  /** Finished requests of the page (Resource Timing) and the document itself (Navigation Timing). */
  requests: Span[];
  firstInput: { time: number } | null;
  answeredAt: number | null;
}

/** Writes the entries into localStorage when the document is of the origin. */
function storageScript(origin: string, storage: Record<string, string>): string {
  return `if (location.origin === ${JSON.stringify(origin)}) { const entries = ${JSON.stringify(storage)};
  for (const key of Object.keys(entries)) { try { localStorage.setItem(key, entries[key]); } catch {} } }`;
}

/**
 * Runs in every document before the app's own scripts (Playwright's addInitScript). A string,
 * not a function, so nothing the TypeScript loader adds to functions ends up in the page, and
 * nothing runs through eval (the app's Content-Security-Policy forbids it).
 */
function pageScript(origin: string, storage: Record<string, string>, answered: string): string {
  return `(() => {
  if (location.origin !== ${JSON.stringify(origin)}) return;
  ${storageScript(origin, storage)}
  try { performance.setResourceTimingBufferSize(5000); } catch {}
  const s = { fcp: null, lcp: null, shifts: [], longTasks: [], firstInput: null, answeredAt: null, watching: false };
  Object.defineProperty(window, '__pageSpeed', { value: s });
  const describe = (el) => {
    if (!el) return null;
    const text = (el.textContent || '').replace(/\\s+/g, ' ').trim().slice(0, 60);
    return el.tagName.toLowerCase() + (el.id ? '#' + el.id : '') + (text ? ' "' + text + '"' : '');
  };
  const observe = (type, each) => {
    try {
      new PerformanceObserver((list) => { for (const e of list.getEntries()) each(e); }).observe({ type, buffered: true });
    } catch {}
  };
  observe('paint', (e) => { if (e.name === 'first-contentful-paint') s.fcp = e.startTime; });
  observe('largest-contentful-paint', (e) => { s.lcp = { time: e.startTime, element: describe(e.element) }; });
  observe('layout-shift', (e) => { if (!e.hadRecentInput) s.shifts.push({ time: e.startTime, value: e.value }); });
  observe('longtask', (e) => { s.longTasks.push({ start: e.startTime, end: e.startTime + e.duration }); });
  observe('first-input', (e) => { s.firstInput = { time: e.startTime }; });
  const answered = () => { try { return Boolean(${answered}); } catch { return false; } };
  const watch = () => {
    if (s.watching) return;
    s.watching = true;
    const frame = () => {
      if (answered()) s.answeredAt = performance.now();
      else requestAnimationFrame(frame);
    };
    requestAnimationFrame(frame);
  };
  addEventListener('pointerdown', watch, { capture: true });
  addEventListener('touchstart', watch, { capture: true });
})();`;
}

const READ_RECORD = `(() => {
  const s = window.__pageSpeed;
  if (!s) return null;
  const nav = performance.getEntriesByType('navigation')[0];
  const requests = performance.getEntriesByType('resource').map((e) => ({ start: e.startTime, end: e.responseEnd }));
  if (nav) requests.push({ start: 0, end: nav.responseEnd });
  return { now: performance.now(), fcp: s.fcp, lcp: s.lcp, shifts: s.shifts, longTasks: s.longTasks, requests,
    firstInput: s.firstInput, answeredAt: s.answeredAt };
})()`;

/**
 * CLS as web.dev defines it: shifts without recent input, grouped into session windows (a gap of
 * under 1 s between shifts, at most 5 s long); the score is the largest window's sum
 * (https://web.dev/articles/cls).
 */
export function clsOf(shifts: { time: number; value: number }[]): number {
  let best = 0;
  let sum = 0;
  let windowStart = -Infinity;
  let last = -Infinity;
  for (const shift of [...shifts].sort((a, b) => a.time - b.time)) {
    if (shift.time - last >= 1_000 || shift.time - windowStart >= 5_000) {
      sum = 0;
      windowStart = shift.time;
    }
    sum += shift.value;
    last = shift.time;
    best = Math.max(best, sum);
  }
  return best;
}

/**
 * TTI as web.dev defines it (https://web.dev/articles/tti): from FCP, find the first quiet window
 * (5 s with no long task and at most two requests in flight); TTI is the end of the last long task
 * before it, or FCP when there is none. `now` is how far the record reaches: a window must end by
 * then; a request still open has `end: Infinity`. Null when no window fits yet.
 */
export function timeToInteractive(fcp: number, longTasks: Span[], requests: Span[], now: number): number | null {
  const candidates = new Set<number>([fcp]);
  for (const t of longTasks) if (t.end > fcp) candidates.add(t.end);
  for (const r of requests) if (r.end > fcp && Number.isFinite(r.end)) candidates.add(r.end);
  for (const start of [...candidates].sort((a, b) => a - b)) {
    const end = start + QUIET_WINDOW_MS;
    if (end > now) return null;
    if (longTasks.some((t) => t.end > start && t.start < end)) continue;
    // Busiest moment in the window: the count only rises at a request's start, so check those and the window's start.
    const inWindow = requests.filter((r) => r.end > start && r.start < end);
    const points = [start, ...inWindow.map((r) => r.start).filter((t) => t > start)];
    const busiest = Math.max(0, ...points.map((p) => inWindow.filter((r) => r.start <= p && r.end > p).length));
    if (busiest > QUIET_MAX_IN_FLIGHT) continue;
    return Math.max(fcp, ...longTasks.filter((t) => t.end <= start).map((t) => t.end));
  }
  return null;
}

/**
 * TBT between FCP and TTI (https://web.dev/articles/tbt): each long task counts its time above
 * 50 ms; a task that straddles FCP or TTI is first clipped to the window, as Lighthouse does
 * (calculateTbtImpactForEvent in its lantern/metrics/TBTUtils.js).
 */
export function totalBlockingTime(longTasks: Span[], from: number, to: number): number {
  let total = 0;
  for (const t of longTasks) {
    if (t.end < from || t.start > to) continue;
    const clipped = Math.min(t.end, to) - Math.max(t.start, from);
    if (clipped > BLOCKING_THRESHOLD_MS) total += clipped - BLOCKING_THRESHOLD_MS;
  }
  return total;
}

const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

/**
 * A phone on a fresh profile — so a cold load: no HTTP cache, no service worker (the app's
 * precache) and no stored query cache yet — signed in, its CPU slowed.
 */
async function openColdPhone(t: PageSpeedTarget, probe: TapProbe) {
  const profile = mkdtempSync(join(tmpdir(), 'scrubline-page-speed-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM_PATH,
    headless: true,
    viewport: PHONE,
    deviceScaleFactor: 2,
    isMobile: true,
    hasTouch: true,
    args: CHROMIUM_FLAGS,
  });
  const close = async () => {
    await context.close();
    rmSync(profile, { recursive: true, force: true });
  };
  try {
    const cut = t.cookie.indexOf('=');
    await context.addCookies([{ name: t.cookie.slice(0, cut), value: t.cookie.slice(cut + 1), url: t.baseUrl, httpOnly: true, sameSite: 'Lax' }]);
    await context.addInitScript(pageScript(new URL(t.baseUrl).origin, t.localStorage ?? {}, probe.answered));
    const page = context.pages()[0] ?? (await context.newPage());
    const cdp = await context.newCDPSession(page);
    await cdp.send('Emulation.setCPUThrottlingRate', { rate: CPU_SLOWDOWN });
    // GET requests of the page still open, by start time on this process's clock.
    const open = new Map<object, number>();
    page.on('request', (r) => {
      if (r.method() === 'GET' && /^https?:/.test(r.url())) open.set(r, performance.now());
    });
    page.on('requestfinished', (r) => open.delete(r));
    page.on('requestfailed', (r) => open.delete(r));
    return { page, open, close };
  } catch (error) {
    await close();
    throw error;
  }
}

async function readRecord(page: Page, open: Map<object, number>): Promise<{ record: PageRecord; pending: Span[] }> {
  const before = performance.now();
  const record = (await page.evaluate(READ_RECORD)) as PageRecord | null;
  const after = performance.now();
  if (!record) throw new Error(`the page script did not run at ${page.url()}`);
  // Requests still open, moved onto the page's clock (read halfway through the round trip).
  const offset = record.now - (before + after) / 2;
  const pending = [...open.values()].map((start) => ({ start: start + offset, end: Infinity }));
  return { record, pending };
}

/** One cold load left alone until it is quiet: LCP, CLS, TBT and TTI. */
async function passiveLoad(t: PageSpeedTarget, options: PlaywrightOptions, screenshotPath: string | undefined) {
  const phone = await openColdPhone(t, options.probe ?? TRACKSIDE_PROBE);
  try {
    const { page, open } = phone;
    await page.goto(t.baseUrl + t.path, { waitUntil: 'load' });
    const deadline = Date.now() + (options.maxWaitMs ?? 60_000);
    for (;;) {
      await sleep(500);
      const { record, pending } = await readRecord(page, open);
      const fcp = record.fcp;
      const tti = fcp === null ? null : timeToInteractive(fcp, record.longTasks, [...record.requests, ...pending], record.now);
      const settled = tti !== null;
      if (fcp !== null && (settled || Date.now() > deadline)) {
        if (!record.lcp) throw new Error(`no largest-contentful-paint entry at ${page.url()}`);
        const end = tti ?? record.now;
        if (screenshotPath) await page.screenshot({ path: screenshotPath });
        return {
          fcpMs: fcp,
          lcpMs: record.lcp.time,
          lcpElement: record.lcp.element,
          clsScore: clsOf(record.shifts),
          tbtMs: totalBlockingTime(record.longTasks, fcp, end),
          interactiveMs: end,
          settled,
          finalUrl: page.url(),
        };
      }
      if (Date.now() > deadline) throw new Error(`no first contentful paint at ${page.url()}`);
    }
  } finally {
    await phone.close();
  }
}

/** A second cold load: tap the probe's control as soon as it can be tapped, and time the answer. */
async function tapLoad(t: PageSpeedTarget, options: PlaywrightOptions) {
  const probe = options.probe ?? TRACKSIDE_PROBE;
  const phone = await openColdPhone(t, probe);
  try {
    const { page, open } = phone;
    await page.goto(t.baseUrl + t.path, { waitUntil: 'commit' });
    await probe.control(page).tap({ timeout: options.maxWaitMs ?? 60_000 });
    const deadline = Date.now() + 30_000;
    for (;;) {
      const { record } = await readRecord(page, open);
      if (record.answeredAt !== null && record.firstInput) {
        return { inputReadyMs: record.answeredAt, inputWaitMs: record.answeredAt - record.firstInput.time };
      }
      if (Date.now() > deadline) throw new Error(`the page did not answer the tap at ${page.url()}`);
      await sleep(100);
    }
  } finally {
    await phone.close();
  }
}

/**
 * `runs` measurements of the page in Debian's Chromium at phone size (390×844, touch), the CPU
 * slowed 4×, the network not slowed (the server is on this machine). Each run is two loads, each
 * on a fresh profile: one left alone for LCP, CLS and TBT, one for the time to the first answer to
 * a tap — a tap would end LCP and mask layout shifts, so the two cannot share a load.
 */
export async function measureWithPlaywright(t: PageSpeedTarget, runs = 3, options: PlaywrightOptions = {}): Promise<PlaywrightRun[]> {
  const results: PlaywrightRun[] = [];
  for (let i = 0; i < runs; i++) {
    const passive = await passiveLoad(t, options, i === runs - 1 ? options.screenshotPath : undefined);
    const tap = await tapLoad(t, options);
    results.push({ ...passive, ...tap });
  }
  return results;
}

// ---------------------------------------------------------------------------------------------
// Lighthouse

/**
 * One Lighthouse run, in a plain Node process. Lighthouse sends some of its own functions to the
 * page as source text; loaded through tsx (as `npm run bench` is), esbuild's keepNames wraps them
 * in calls to a `__name` helper that does not exist in the page, and the run fails. The job comes
 * in PAGE_SPEED_JOB; the report is written to job.out.
 */
const LIGHTHOUSE_CHILD = `
import { writeFileSync } from 'node:fs';
import lighthouse from 'lighthouse';
import { launch } from 'chrome-launcher';
import puppeteer from 'puppeteer-core';

const job = JSON.parse(process.env.PAGE_SPEED_JOB);
// A fresh profile in a temporary folder, removed by kill().
const chrome = await launch({ chromePath: job.chromePath, chromeFlags: job.chromeFlags, logLevel: 'silent' });
try {
  const browser = await puppeteer.connect({ browserURL: 'http://127.0.0.1:' + chrome.port, defaultViewport: null });
  try {
    const page = await browser.newPage();
    // Runs in each new document, before the page's own scripts.
    if (job.initScript) await page.evaluateOnNewDocument(job.initScript);
    const result = await lighthouse(job.url, job.flags, undefined, page);
    if (!result) throw new Error('Lighthouse returned no result');
    writeFileSync(job.out, JSON.stringify(result.lhr));
  } finally {
    await browser.disconnect();
  }
} finally {
  chrome.kill();
}
`;

function runLighthouseChild(job: { url: string; flags: Flags; initScript: string | null; chromePath: string; chromeFlags: string[] }): Promise<Result> {
  const dir = mkdtempSync(join(tmpdir(), 'scrubline-lighthouse-'));
  const out = join(dir, 'lhr.json');
  // Without NODE_OPTIONS, so no loader (tsx) comes in that way either.
  const { NODE_OPTIONS: _loader, ...env } = process.env;
  const child = spawn(process.execPath, ['--input-type=module', '--eval', LIGHTHOUSE_CHILD], {
    cwd: ROOT,
    env: { ...env, PAGE_SPEED_JOB: JSON.stringify({ ...job, out }) },
    stdio: ['ignore', 'inherit', 'pipe'],
  });
  let stderr = '';
  child.stderr.on('data', (chunk: Buffer) => (stderr += chunk.toString()));
  return new Promise<Result>((resolve, reject) => {
    child.on('error', reject);
    child.on('close', (code) => {
      try {
        if (code !== 0) throw new Error(`Lighthouse exited with ${code}:\n${stderr.trim()}`);
        resolve(JSON.parse(readFileSync(out, 'utf8')) as Result);
      } catch (error) {
        reject(error instanceof Error ? error : new Error(String(error)));
      } finally {
        rmSync(dir, { recursive: true, force: true });
      }
    });
  });
}

function lcpElementOf(lhr: Result): string | null {
  // 'largest-contentful-paint-element': a list whose first table holds the element's node.
  const details = lhr.audits['largest-contentful-paint-element']?.details as
    | { items?: { items?: { node?: { nodeLabel?: string; snippet?: string } }[] }[] }
    | undefined;
  const node = details?.items?.[0]?.items?.[0]?.node;
  return node ? `${node.snippet ?? ''} ${node.nodeLabel ? `"${node.nodeLabel}"` : ''}`.trim() : null;
}

/**
 * `runs` Lighthouse runs of the performance category, each in a fresh Chromium profile started by
 * chrome-launcher. Lighthouse's mobile defaults: a Moto G Power screen (412×823) and simulated
 * throttling ("Slow 4G": 150 ms RTT, 1.6 Mbit/s, CPU 4× slower), i.e. the page loads unthrottled
 * and Lighthouse's Lantern model estimates the metrics under those conditions. Nothing is fetched
 * from outside this machine.
 */
export async function measureWithLighthouse(t: PageSpeedTarget, runs = 3): Promise<LighthouseRun[]> {
  const flags: Flags = {
    logLevel: 'error',
    output: 'json',
    onlyCategories: ['performance'],
    formFactor: 'mobile',
    extraHeaders: { Cookie: t.cookie },
  };
  const initScript = t.localStorage ? storageScript(new URL(t.baseUrl).origin, t.localStorage) : null;
  const results: LighthouseRun[] = [];
  for (let i = 0; i < runs; i++) {
    const lhr = await runLighthouseChild({
      url: t.baseUrl + t.path,
      flags,
      initScript,
      chromePath: CHROMIUM_PATH,
      chromeFlags: ['--headless=new', ...CHROMIUM_FLAGS],
    });
    if (lhr.runtimeError) throw new Error(`Lighthouse: ${lhr.runtimeError.code} ${lhr.runtimeError.message}`);
    const metric = (id: string) => {
      const value = lhr.audits[id]?.numericValue;
      if (typeof value !== 'number') throw new Error(`Lighthouse gave no ${id}`);
      return value;
    };
    const screenshot = lhr.audits['final-screenshot']?.details as { data?: string } | undefined;
    results.push({
      lcpMs: metric('largest-contentful-paint'),
      tbtMs: metric('total-blocking-time'),
      cls: metric('cumulative-layout-shift'),
      fcpMs: metric('first-contentful-paint'),
      performanceScore: Math.round((lhr.categories.performance?.score ?? 0) * 100),
      finalUrl: lhr.finalDisplayedUrl,
      lcpElement: lcpElementOf(lhr),
      finalScreenshot: screenshot?.data ?? null,
      warnings: [
        ...lhr.runWarnings.map(String),
        ...Object.values(lhr.audits)
          .filter((a) => a.scoreDisplayMode === 'error')
          .map((a) => `${a.id}: ${a.errorMessage ?? 'error'}`),
      ],
    });
  }
  return results;
}

import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { Page } from 'playwright-core';
import { readBuildManifest } from '../../server/lib/build-manifest';
import { openPhone, screenshot } from './browser';

let phone: Awaited<ReturnType<typeof openPhone>>;
let page: Page;
const baseUrl = inject('baseUrl');

beforeAll(async () => {
  phone = await openPhone();
  page = phone.page;
});
afterAll(async () => {
  await phone?.close();
});

describe('signing up and in on a phone (390×844)', () => {
  const email = `e2e-${randomUUID().slice(0, 8)}@example.com`;
  const password = 'gravel-and-cones-e2e';

  it('when a password is typed at registration, then a strength meter judges it, its word lists fetched then and never kept by the service worker', async () => {
    await page.goto(`${baseUrl}/register`);
    const lists = page.waitForResponse((res) => /\/assets\/zxcvbn-[\w-]+\.js$/.test(res.url()));
    await page.getByLabel('Password', { exact: true }).fill('qwertyuiop12');
    expect((await lists).status()).toBe(200);
    await expect.poll(() => page.getByText(/^Strength: (Very weak|Weak)\./).count(), { timeout: 10_000 }).toBe(1);
    await page.getByLabel('Password', { exact: true }).fill('copper kettle under the grandstand');
    await expect.poll(() => page.getByText('Strength: Very strong.').count(), { timeout: 10_000 }).toBe(1);
    // The meter itself is kept for offline use; the word lists (over 200 KB) are not.
    const worker = await (await fetch(`${baseUrl}/sw.js`)).text();
    const meter = Object.values(readBuildManifest('dist')).find((chunk) => chunk.name === 'password-strength');
    expect(meter).toBeDefined();
    expect(worker).toContain(`"${meter!.file}"`);
    expect(worker).not.toMatch(/zxcvbn/);
  });

  it('when a signed-out phone opens the app, then it lands on sign-in with no failed request and no console error', async () => {
    const errors: string[] = [];
    const onConsole = (m: { type(): string; text(): string }) => void (m.type() === 'error' && errors.push(m.text()));
    const onResponse = (r: { status(): number; url(): string }) => void (r.status() >= 400 && errors.push(`${r.status()} ${r.url()}`));
    page.on('console', onConsole);
    page.on('response', onResponse);
    try {
      await page.goto(`${baseUrl}/`);
      await page.waitForURL(/\/sign-in/);
      await page.getByRole('button', { name: 'Sign in' }).waitFor();
      await page.waitForLoadState('networkidle');
    } finally {
      page.off('console', onConsole);
      page.off('response', onResponse);
    }
    expect(errors).toEqual([]);
  });

  it('when a new driver registers, then they land on home, signed in', async () => {
    await page.goto(`${baseUrl}/`);
    await page.waitForURL(/\/sign-in/);
    await page.getByRole('link', { name: 'Create an account' }).click();
    await page.getByLabel('Your name').fill('Wren Halloway');
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password', { exact: true }).fill(password);
    await screenshot(page, 'register');
    await page.getByRole('button', { name: 'Create account' }).click();
    await page.getByRole('heading', { name: 'Hi, Wren Halloway' }).waitFor();
    expect(new URL(page.url()).pathname).toBe('/');
    await screenshot(page, 'home-after-register');
  });

  it('when they sign out and back in, then home shows their name again', async () => {
    await page.getByRole('button', { name: /Account: Wren Halloway/ }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password', { exact: true }).fill('not-my-password-at-all');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail and password do not match an account.').waitFor();
    await screenshot(page, 'sign-in-wrong-password');
    await page.getByLabel('Password', { exact: true }).fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Hi, Wren Halloway' }).waitFor();
    const path = await screenshot(page, 'home-after-sign-in');
    expect(path).toMatch(/home-after-sign-in\.png$/);
  });

  it('when the page is at phone width, then nothing scrolls sideways', async () => {
    const overflow = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
    expect(overflow).toBeLessThanOrEqual(0);
  });

  it('when they move to a new sign-in address, then the link sent to it, opened signed in, makes it the one that works', async () => {
    const moved = `moved-${email}`;
    await page.goto(`${baseUrl}/settings`);
    await page.getByRole('button', { name: 'Change address' }).click();
    await page.getByLabel('New address').fill(moved);
    await page.getByLabel('Your password').fill(password);
    await page.getByRole('button', { name: 'Send the link' }).click();
    await page.getByText(`A link was sent to ${moved}.`, { exact: false }).waitFor();
    await screenshot(page, 'settings-address-waiting');

    // The e-mail, as the local mail catcher holds it; the old address got a warning.
    const inbox = async (to: string) =>
      (await page.evaluate(async (a) => (await (await fetch(`/api/dev/mailbox?to=${encodeURIComponent(a)}`)).json()).items, to)) as { subject: string; text: string }[];
    await expect.poll(async () => (await inbox(email)).map((m) => m.subject), { timeout: 10_000 }).toContain('Your Scrubline address is about to change');
    await expect.poll(async () => (await inbox(moved)).length, { timeout: 10_000 }).toBe(1);
    const link = /https?:\/\/\S+\/settings\?email-link=[\w-]+/.exec((await inbox(moved))[0]!.text)?.[0];
    expect(link).toBeDefined();

    await page.goto(`${baseUrl}${new URL(link!).pathname}${new URL(link!).search}`);
    await page.getByText(`Done: you now sign in with ${moved}.`).waitFor();
    expect(new URL(page.url()).search).toBe('');
    await screenshot(page, 'settings-address-changed');

    await page.getByRole('button', { name: /Account: Wren Halloway/ }).click();
    await page.getByRole('menuitem', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill(moved);
    await page.getByLabel('Password', { exact: true }).fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Hi, Wren Halloway' }).waitFor();
  });

  it('when they download their data and close their account, then the file holds the account, the phone is signed out, the sign-in page says so, and the address and password no longer sign in', async () => {
    const moved = `moved-${email}`;
    await page.goto(`${baseUrl}/settings`);
    // First the data, as the page suggests: one file the browser saves.
    const [saved] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: 'Download your data' }).click()]);
    expect(saved.suggestedFilename()).toMatch(/^scrubline-account-\d{4}-\d{2}-\d{2}\.json$/);
    const file = JSON.parse(readFileSync(await saved.path(), 'utf8')) as { format: string; account: { email: string; displayName: string } };
    expect(file).toMatchObject({ format: 'scrubline-account', account: { email: moved, displayName: 'Wren Halloway' } });

    await page.getByRole('button', { name: 'Close account…' }).click();
    await page.getByRole('form', { name: 'Close account' }).getByLabel('Your password').fill(password);
    await page.getByRole('form', { name: 'Close account' }).scrollIntoViewIfNeeded();
    await screenshot(page, 'settings-close-account');
    await page.getByRole('button', { name: 'Close my account' }).click();
    await page.waitForURL(/\/sign-in$/);
    await page.getByText('Your account is closed.').waitFor();
    await screenshot(page, 'sign-in-account-closed');

    await page.getByLabel('E-mail').fill(moved);
    await page.getByLabel('Password', { exact: true }).fill(password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByText('That e-mail and password do not match an account.').waitFor();
    // The settings page now sends the phone to sign in.
    await page.goto(`${baseUrl}/settings`);
    await page.waitForURL(/\/sign-in\?next=/);
  });

  it('when the demo driver signs in, then home greets her and lists the car she shares', async () => {
    await page.goto(`${baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('maren@example.com');
    await page.getByLabel('Password', { exact: true }).fill('cold-tyres-warm-coffee');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Hi, Maren Holloway' }).waitFor();
    await page.getByText('Pebble').waitFor();
    expect(await page.getByText(/shared with Teo Varga/).count()).toBe(1);
    await screenshot(page, 'home-demo-driver');
  });

  it('when an unknown address is opened, then the 404 page shows', async () => {
    await page.goto(`${baseUrl}/no-such-page`);
    await page.getByRole('heading', { level: 1 }).waitFor();
    expect(await page.getByRole('heading', { level: 1 }).textContent()).toMatch(/not|find/i);
    await screenshot(page, 'not-found');
  });
});

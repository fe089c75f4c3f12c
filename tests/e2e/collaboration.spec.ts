import { afterAll, describe, expect, inject, it } from 'vitest';
import type { MailboxMessage } from '@shared/collab/mailbox.schema';
import { onePhoneAtATime, PHONE, screenshot } from './browser';

/**
 * The demo shop reviews a customer's season and suggests a change; the driver hears of it
 * and accepts; the e-mail is caught by the local mail server; the team captain reads the
 * class board. Every step at phone size, as each person would do it.
 */
const baseUrl = inject('baseUrl');
const TITLE = 'Half a degree more front camber';

const phones = onePhoneAtATime(baseUrl);
const signInAs = phones.signInAs;

afterAll(async () => {
  await phones.close();
});

describe('a shop reviews a customer, the driver accepts its suggestion, the captain reads the board (390×844)', () => {
  it('when the shop opens a customer, comments on a run and suggests more front camber, then the suggestion is sent', async () => {
    const page = await signInAs('dusty@example.com', 'Dusty Okonjo');
    await page.getByRole('link', { name: /Your shop/ }).first().click();
    await page.getByRole('list', { name: 'Customers' }).getByRole('link', { name: /Pebble/ }).click();
    await page.getByRole('heading', { name: 'Setup history' }).waitFor({ timeout: 20_000 });

    // The newest event's runs, and a comment on its first run.
    const events = page.getByRole('list', { name: 'Events, newest first' });
    await events.getByRole('button', { name: 'Runs and comments' }).first().click();
    const runs = events.getByRole('list', { name: /^Runs at / }).first();
    await runs.getByRole('button', { name: /Comments.* on run 1$/ }).first().click();
    const form = runs.getByRole('form', { name: 'Write a comment' }).first();
    await form.getByLabel('Add a comment').fill('Fronts are still going off on the outer shoulder by the last run.');
    await form.getByRole('button', { name: 'Send' }).click();
    await runs.getByText('Kettle Lane Chassis Works').first().waitFor({ timeout: 15_000 });
    await screenshot(page, 'shop-customer-comment');

    // A suggestion against the setup in force now: the first in the history.
    await page.getByRole('link', { name: 'Suggest a change' }).first().click();
    const suggest = page.getByRole('form', { name: 'Suggest a setup change' });
    await suggest.getByLabel('Title').fill(TITLE);
    await suggest.getByLabel('Why').fill('The outer shoulders of both fronts wear faster than the inners since the arms went on.');
    await suggest.getByLabel('What').selectOption('camberDeg');
    await suggest.getByRole('button', { name: 'Front pair' }).click();
    await suggest.getByLabel(/Change camber by/).fill('-0.5');
    await screenshot(page, 'shop-suggestion-form');
    await suggest.getByRole('button', { name: 'Send the suggestion' }).click();
    await page.getByRole('heading', { name: TITLE }).waitFor({ timeout: 15_000 });
    await screenshot(page, 'shop-suggestion-sent');
  });

  it('when the driver signs in, then the bell counts the news, and accepting the suggestion records a new setup', async () => {
    const page = await signInAs('maren@example.com', 'Maren Holloway');
    const bell = page.getByRole('link', { name: /^\d+ unread notifications?$/ });
    await bell.waitFor({ timeout: 20_000 });
    const unread = Number((await bell.getAttribute('aria-label'))!.split(' ')[0]);
    // The run comment and the suggestion: one each.
    expect(unread).toBeGreaterThanOrEqual(2);
    await screenshot(page, 'driver-unread-bell');

    await bell.click();
    await page.getByRole('heading', { name: 'Notifications' }).waitFor();
    await screenshot(page, 'driver-notifications');
    await page.getByRole('button', { name: /suggest/i }).first().click();
    await page.getByRole('heading', { name: TITLE }).waitFor({ timeout: 15_000 });

    await page.getByRole('button', { name: 'Accept', exact: true }).click();
    const accept = page.getByRole('form', { name: 'Accept the suggestion' });
    await accept.getByRole('button', { name: 'Accept and record the setup' }).click();
    await page.getByText('Accepted. The new setup is recorded.').waitFor({ timeout: 15_000 });
    await screenshot(page, 'driver-suggestion-accepted');

    // The new snapshot is on the car, linked to the suggestion, with the front camber 0.5° more negative.
    const { carId, setups } = await page.evaluate(async () => {
      const cars = await (await fetch('/api/cars')).json();
      const carId = (cars.items as { id: string; name: string }[]).find((c) => c.name === 'Pebble')!.id;
      return { carId, setups: (await (await fetch(`/api/cars/${carId}/setups`)).json()).items };
    });
    type SetupRow = { id: string; derivedFromId: string | null; suggestion: { title: string } | null; corners: Record<string, { camberDeg?: number | null }> };
    const made = (setups as SetupRow[]).find((s) => s.suggestion?.title === TITLE)!;
    expect(made).toBeTruthy();
    const before = (setups as SetupRow[]).find((s) => s.id === made.derivedFromId)!;
    for (const corner of ['lf', 'rf']) {
      expect(made.corners[corner]!.camberDeg!).toBeCloseTo(before.corners[corner]!.camberDeg! - 0.5, 6);
    }
    expect(made.corners.lr!.camberDeg).toBe(before.corners.lr!.camberDeg);

    // From the suggestion to that snapshot on the car's page: it is drawn there however many newer ones the
    // other tests have made since (the history shows the newest few).
    await page.getByRole('link', { name: 'Open the new setup on the car’s page' }).click();
    await page.waitForURL(new RegExp(`/cars/${carId}#setup-${made.id}$`));
    const badge = page.getByRole('link', { name: `from Kettle Lane Chassis Works: ${TITLE}` });
    await badge.waitFor({ timeout: 15_000 });
    await badge.scrollIntoViewIfNeeded();
    await screenshot(page, 'driver-setup-from-suggestion');
  });

  it('when the mailbox is opened, then the notification e-mails to the driver are there, with text, HTML and a way to stop them', async () => {
    const page = phones.page!;
    const messages: MailboxMessage[] = await page.evaluate(async () => (await (await fetch('/api/dev/mailbox?to=maren@example.com')).json()).items);
    const suggestion = messages.find((m) => m.subject === 'A setup suggestion for Pebble');
    expect(suggestion, messages.map((m) => m.subject).join(' | ')).toBeTruthy();
    expect(suggestion!.text).toContain(TITLE);
    expect(suggestion!.html).toContain('Stop these e-mails');
    expect(messages.some((m) => m.subject === 'New comment on Pebble')).toBe(true);

    await page.goto(`${baseUrl}/dev/mailbox`);
    await page.getByText('A setup suggestion for Pebble').first().waitFor({ timeout: 15_000 });
    await screenshot(page, 'dev-mailbox');
  });

  it('when the captain opens the class board, then the three demo cars are there, each in its class', async () => {
    const page = await signInAs('ines@example.com', 'Ines Brandvold');
    // From Home, one tap: the team's board is listed there for its captain.
    await page.goto(baseUrl);
    await page.getByRole('link', { name: /^Gravel Pit Irregulars: class board/ }).click();
    await page.getByRole('heading', { name: 'Class board' }).waitFor({ timeout: 20_000 });
    const sr = page.getByRole('region', { name: 'Class SR' });
    const sh = page.getByRole('region', { name: 'Class SH' });
    await sr.getByText('Pebble').first().waitFor({ timeout: 20_000 });
    await sr.getByText('Gooseberry').first().waitFor();
    await sh.getByText('Biscuit Tin').first().waitFor();
    // Pebble shares its setup; Gooseberry and Biscuit Tin share results only.
    await sr.getByRole('table', { name: 'Setup of Pebble' }).waitFor();
    await sh.getByText(/setup and tread not shared/i).first().waitFor();
    // On a phone each car's events are a list, each event's gap to the class's fastest under its link, nothing a swipe
    // away; the table is not displayed, so screen readers meet the results once. At 320 px too.
    for (const width of [PHONE.width, 320]) {
      await page.setViewportSize({ width, height: 640 });
      for (const name of ['Pebble', 'Gooseberry', 'Biscuit Tin']) {
        expect(await page.getByRole('region', { name: `Results of ${name}` }).count(), `${name} at ${width} px`).toBe(0);
        const items = page.getByRole('list', { name: `Results of ${name}` }).getByRole('listitem');
        expect(await items.count(), `${name} at ${width} px`).toBeGreaterThan(0);
        for (const item of await items.all()) {
          const { text, right } = await item.evaluate((li) => ({ text: li.textContent ?? '', right: li.getBoundingClientRect().right }));
          expect(text, `${name} at ${width} px`).toMatch(/ off fastest|Fastest in class|No other time in class|DNF|Off course|No time/);
          expect(right, `${name} at ${width} px: ${text}`).toBeLessThanOrEqual(width);
          expect(await item.getByRole('link').count(), text).toBe(1);
        }
      }
      const sideways = await page.evaluate(() => document.documentElement.scrollWidth - document.documentElement.clientWidth);
      expect(sideways, `at ${width} px`).toBeLessThanOrEqual(0);
      await screenshot(page, `captain-class-board-${width}`);
    }
    // From the sm width up the table stands in for the list, its gap column within its box.
    await page.setViewportSize({ width: 1024, height: 768 });
    expect(await sr.getByRole('list', { name: 'Results of Pebble' }).count()).toBe(0);
    const results = sr.getByRole('region', { name: 'Results of Pebble' });
    const box = (await results.boundingBox())!;
    for (const head of [/^Adjusted \(s\)/, /^Off fastest/]) {
      const cell = (await results.getByRole('columnheader', { name: head }).boundingBox())!;
      expect(cell.x + cell.width, String(head)).toBeLessThanOrEqual(box.x + box.width + 1);
    }
    await screenshot(page, 'captain-class-board-wide');
    await page.setViewportSize(PHONE);
  });
});

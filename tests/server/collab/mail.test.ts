import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { METRIC_PREFERENCES } from '../../../shared/calc/units.calc';
import type { MailboxFile } from '../../../shared/collab/mailbox.schema';
import { startFakeSmtp, type FakeSmtp } from '../../../scripts/lib/fake-smtp';
import { DEFAULT_MAIL_FROM, loadConfig } from '../../../server/config';
import { localOrigin } from '../../../server/index';
import { sendInBackground, smtpMailer } from '../../../server/mail/mailer';
import { renderMail } from '../../../server/mail/templates';
import { client, makeTestApp, signedInClient, type TestApp } from '../test-app';

const BASE = { DATABASE_URL: 'postgres://x@127.0.0.1/x', SESSION_SECRET: 's'.repeat(32) };

describe('mail configuration', () => {
  it('when nothing is set in development, then there is no SMTP_URL or PUBLIC_URL and the sender is the default', () => {
    const config = loadConfig(BASE);
    expect(config.SMTP_URL).toBeUndefined();
    expect(config.PUBLIC_URL).toBeUndefined();
    expect(config.MAIL_FROM).toBe(DEFAULT_MAIL_FROM);
  });

  it('when PUBLIC_URL ends in a slash, then the slash is dropped so links do not get two', () => {
    expect(loadConfig({ ...BASE, PUBLIC_URL: 'https://scrubline.example.org/' }).PUBLIC_URL).toBe('https://scrubline.example.org');
  });

  it('when SMTP_URL or PUBLIC_URL has the wrong scheme, then start-up stops naming the variable', () => {
    expect(() => loadConfig({ ...BASE, SMTP_URL: 'http://mail.example.org' })).toThrow(/SMTP_URL: SMTP_URL must look like smtp:/);
    expect(() => loadConfig({ ...BASE, PUBLIC_URL: 'ftp://example.org' })).toThrow(/PUBLIC_URL/);
    expect(loadConfig({ ...BASE, SMTP_URL: 'smtps://user:pw@mail.example.org:465' }).SMTP_URL).toBe('smtps://user:pw@mail.example.org:465');
  });

  it('when NODE_ENV is production, then SMTP_URL and PUBLIC_URL are required and MAILBOX_DIR is refused', () => {
    expect(() => loadConfig({ ...BASE, NODE_ENV: 'production' })).toThrow(/SMTP_URL: SMTP_URL is required in production[\s\S]*PUBLIC_URL: PUBLIC_URL is required/);
    const prod = {
      ...BASE, NODE_ENV: 'production', SMTP_URL: 'smtp://u:p@mail.example.org:587', PUBLIC_URL: 'https://scrubline.example.org',
      // Also required in production (tested in service/payments.test.ts).
      STRIPE_SECRET_KEY: 'sk_live_example', STRIPE_WEBHOOK_SECRET: 'whsec_example',
    };
    expect(loadConfig(prod).PUBLIC_URL).toBe('https://scrubline.example.org');
    expect(() => loadConfig({ ...prod, MAILBOX_DIR: '/tmp/mailbox' })).toThrow(/MAILBOX_DIR is for development only/);
  });

  it('when PUBLIC_URL is not set, then links point at the listening host, or localhost when it listens on every address', () => {
    expect(localOrigin('0.0.0.0', 3000)).toBe('http://localhost:3000');
    expect(localOrigin('127.0.0.1', 4123)).toBe('http://127.0.0.1:4123');
    expect(localOrigin('::1', 80)).toBe('http://[::1]:80');
  });
});

describe('smtpMailer', () => {
  let smtp: FakeSmtp;
  let dir: string;
  beforeAll(async () => {
    dir = mkdtempSync(join(tmpdir(), 'scrubline-mail-'));
    smtp = await startFakeSmtp({ dir });
  });
  afterAll(async () => {
    await smtp.stop();
    rmSync(dir, { recursive: true, force: true });
  });
  const received = () =>
    readdirSync(dir)
      .filter((n) => n.endsWith('.json'))
      .sort()
      .map((n) => JSON.parse(readFileSync(join(dir, n), 'utf8')) as MailboxFile);

  it('when a notification is sent, then it has both parts, the sender, and one-click unsubscribe headers (RFC 2369, RFC 8058)', async () => {
    const mailer = smtpMailer(smtp.url, 'Scrubline <no-reply@example.org>');
    const content = renderMail({ subject: 'New comment on run 4', paragraphs: ['Pip wrote: try 2 clicks softer'], unsubscribeUrl: 'https://scrubline.example.org/unsubscribe/abc' });
    await mailer.send({ to: 'maren@example.com', ...content, unsubscribeUrl: 'https://scrubline.example.org/unsubscribe/abc' });
    const message = received().at(-1)!;
    expect(message).toMatchObject({ to: ['maren@example.com'], subject: 'New comment on run 4' });
    expect(message.from).toMatch(/Scrubline.*<no-reply@example\.org>/);
    expect(message.text).toContain('Stop these e-mails: https://scrubline.example.org/unsubscribe/abc');
    expect(message.html).toContain('href="https://scrubline.example.org/unsubscribe/abc"');
    expect(message.listUnsubscribe).toContain('<https://scrubline.example.org/unsubscribe/abc>');
    expect(message.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
  });

  it('when a message is not a notification, then it carries no unsubscribe headers', async () => {
    await smtpMailer(smtp.url, DEFAULT_MAIL_FROM).send({ to: 'teo@example.com', ...renderMail({ subject: 'Plain', paragraphs: ['x'] }) });
    const message = received().at(-1)!;
    expect(message.subject).toBe('Plain');
    expect(message.listUnsubscribe).toBeNull();
    expect(message.headers['list-unsubscribe-post']).toBeUndefined();
  });

  it('when the mail server is down, then sending in the background neither throws nor rejects', async () => {
    const settings = { mailer: smtpMailer('smtp://127.0.0.1:1', DEFAULT_MAIL_FROM), publicUrl: 'http://x', from: DEFAULT_MAIL_FROM };
    expect(() => sendInBackground(settings, { to: 'a@example.com', subject: 's', text: 't', html: 'h' })).not.toThrow();
    await new Promise((r) => setTimeout(r, 200));
  });
});

describe('turning notification e-mails off', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await makeTestApp();
  });
  afterAll(async () => {
    await t.close();
  });
  const tokenOf = async (userId: string) =>
    ((await t.ds.query(`SELECT unsubscribe_token FROM users WHERE id = $1`, [userId])) as { unsubscribe_token: string }[])[0]!.unsubscribe_token;

  it('when an account is new, then its preferences say notification e-mails are on', async () => {
    const { c } = await signedInClient(t);
    expect((await c.get('/api/auth/me')).body.user.preferences).toEqual({ units: METRIC_PREFERENCES, emailNotifications: true });
  });

  it('when the unsubscribe link is posted, then 204, no sign-in needed, and the preference reads off', async () => {
    const { c, user } = await signedInClient(t);
    const res = await client(t.app).post(`/api/unsubscribe/${await tokenOf(user.id)}`);
    expect(res.status).toBe(204);
    expect((await c.get('/api/auth/me')).body.user.preferences.emailNotifications).toBe(false);
    // Twice is fine: still off.
    expect((await client(t.app).post(`/api/unsubscribe/${await tokenOf(user.id)}`)).status).toBe(204);
  });

  it('when a mail program posts one-click to the page address, with no cookie or CSRF token, then e-mails are off (RFC 8058)', async () => {
    const { c, user } = await signedInClient(t);
    const res = await request(t.app)
      .post(`/unsubscribe/${await tokenOf(user.id)}`)
      .type('form')
      .send('List-Unsubscribe=One-Click');
    expect(res.status).toBe(204);
    expect((await c.get('/api/auth/me')).body.user.preferences.emailNotifications).toBe(false);
  });

  it('when the token is unknown or not a token, then 404', async () => {
    const unknown = await client(t.app).post('/api/unsubscribe/00000000-0000-4000-8000-000000000000');
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.code).toBe('not_found');
    expect((await client(t.app).post('/api/unsubscribe/not-a-token')).status).toBe(404);
    expect((await request(t.app).post('/unsubscribe/00000000-0000-4000-8000-000000000000')).status).toBe(404);
  });

  it('when the user switches e-mails in preferences, then it is saved and the units stay as they were', async () => {
    const { c } = await signedInClient(t);
    await c.patch('/api/auth/me/preferences', { units: { pressure: 'psi' } }).then((r) => expect(r.status).toBe(200));
    const off = await c.patch('/api/auth/me/preferences', { emailNotifications: false });
    expect(off.status).toBe(200);
    expect(off.body.user.preferences).toEqual({ units: { ...METRIC_PREFERENCES, pressure: 'psi' }, emailNotifications: false });
    expect((await c.get('/api/auth/me')).body.user.preferences.emailNotifications).toBe(false);
    const on = await c.patch('/api/auth/me/preferences', { emailNotifications: true });
    expect(on.body.user.preferences).toEqual({ units: { ...METRIC_PREFERENCES, pressure: 'psi' }, emailNotifications: true });
    // A units change leaves the e-mail choice alone.
    await c.patch('/api/auth/me/preferences', { emailNotifications: false });
    expect((await c.patch('/api/auth/me/preferences', { units: { temperature: 'degF' } })).body.user.preferences.emailNotifications).toBe(false);
  });

  it('when emailNotifications is not a boolean, then 400 with a field error', async () => {
    const { c } = await signedInClient(t);
    const res = await c.patch('/api/auth/me/preferences', { emailNotifications: 'no' });
    expect(res.status).toBe(400);
    expect(res.body.error.fieldErrors.emailNotifications).toEqual(['Choose on or off']);
  });
});

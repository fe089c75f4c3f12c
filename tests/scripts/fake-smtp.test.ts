import { mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import nodemailer from 'nodemailer';
import { afterEach, describe, expect, it } from 'vitest';
import { startFakeSmtp, type FakeSmtp } from '../../scripts/lib/fake-smtp';
import type { MailboxFile } from '../../shared/collab/mailbox.schema';

const started: FakeSmtp[] = [];
afterEach(async () => {
  for (const s of started.splice(0)) {
    await s.stop();
    rmSync(s.dir, { recursive: true, force: true });
  }
});

async function catcher() {
  const smtp = await startFakeSmtp({ dir: join(mkdtempSync(join(tmpdir(), 'scrubline-smtp-')), 'mailbox') });
  started.push(smtp);
  return smtp;
}

const files = (dir: string) =>
  readdirSync(dir)
    .filter((n) => n.endsWith('.json'))
    .sort()
    .map((n) => JSON.parse(readFileSync(join(dir, n), 'utf8')) as MailboxFile);

describe('the local mail catcher', () => {
  it('when nodemailer sends it a message, then it keeps one JSON file with the parts and headers', async () => {
    const smtp = await catcher();
    expect(smtp.url).toMatch(/^smtp:\/\/127\.0\.0\.1:\d+$/);
    expect(smtp.port).toBeGreaterThan(0);
    const transport = nodemailer.createTransport(smtp.url);
    await transport.sendMail({
      from: 'Scrubline <no-reply@example.com>',
      to: 'Rhea@Example.com',
      subject: 'Ride height after the corner balance',
      text: 'Plain words',
      html: '<p>Plain <b>words</b></p>',
      list: { unsubscribe: { url: 'https://scrubline.example.org/unsubscribe/abc', comment: 'Stop' } },
      headers: { 'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click' },
    });

    const [message, ...rest] = files(smtp.dir);
    expect(rest).toHaveLength(0);
    expect(message).toMatchObject({
      id: expect.any(String),
      from: expect.stringContaining('no-reply@example.com'),
      to: ['rhea@example.com'],
      subject: 'Ride height after the corner balance',
      text: expect.stringContaining('Plain words'),
      html: expect.stringContaining('<b>words</b>'),
      listUnsubscribe: expect.stringContaining('<https://scrubline.example.org/unsubscribe/abc>'),
    });
    expect(Date.parse(message!.date)).not.toBeNaN();
    expect(message!.headers['list-unsubscribe-post']).toBe('List-Unsubscribe=One-Click');
    expect(message!.headers.subject).toBe('Ride height after the corner balance');
  });

  it('when the sender signs in with any user name and password, then the message is still accepted', async () => {
    const smtp = await catcher();
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: smtp.port, secure: false, auth: { user: 'someone', pass: 'anything' } });
    await transport.sendMail({ from: 'a@example.com', to: 'b@example.com', bcc: 'c@example.com', subject: 'Signed in', text: 'x' });
    const [message] = files(smtp.dir);
    expect(message?.subject).toBe('Signed in');
    // Blind copies are known only from the envelope; the catcher lists them too.
    expect(message?.to.sort()).toEqual(['b@example.com', 'c@example.com']);
    expect(message?.html).toBe('');
  });

  it('when several messages arrive, then the file names sort in arrival order', async () => {
    const smtp = await catcher();
    const transport = nodemailer.createTransport(smtp.url);
    for (const subject of ['first', 'second', 'third']) {
      await transport.sendMail({ from: 'a@example.com', to: 'b@example.com', subject, text: subject });
      await new Promise((r) => setTimeout(r, 5));
    }
    expect(files(smtp.dir).map((m) => m.subject)).toEqual(['first', 'second', 'third']);
  });

  it('when it is stopped, then it no longer accepts connections', async () => {
    const smtp = await catcher();
    await smtp.stop();
    started.splice(started.indexOf(smtp), 1);
    rmSync(smtp.dir, { recursive: true, force: true });
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: smtp.port, connectionTimeout: 2000 });
    await expect(transport.sendMail({ from: 'a@example.com', to: 'b@example.com', subject: 'late', text: 'x' })).rejects.toThrow();
  });
});

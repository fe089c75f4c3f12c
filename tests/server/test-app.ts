import { randomUUID } from 'node:crypto';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import request from 'supertest';
import { inject } from 'vitest';
import { createApp, type AppOptions } from '../../server/app';
import { createDataSource } from '../../server/db/data-source';
import { createUser } from '../../server/features/users/user.service';
import type { MailMessage, MailSettings } from '../../server/mail/mailer';
import { diskStorage } from '../../server/files/disk-storage';

export const TEST_PASSWORD = 'long-enough-test-password';

export interface TestAppOptions {
  authLimits?: AppOptions['authLimits'];
  absoluteMs?: number;
  idleMs?: number;
  mail?: AppOptions['mail'];
  mailboxDir?: string;
  payments?: AppOptions['payments'];
  /** Where attachments go; by default a disk storage in a fresh temporary folder, removed on close. */
  storage?: AppOptions['storage'];
  /** Where log lines go; by default the app's logger, silent under test. */
  logger?: AppOptions['logger'];
}

/** Mail settings whose mailer keeps every message, for tests to read. */
export function captureMail() {
  const sent: MailMessage[] = [];
  const settings: MailSettings = {
    mailer: { send: async (message) => void sent.push(message) },
    publicUrl: 'http://scrubline.test',
    from: 'Scrubline <no-reply@example.com>',
  };
  return { sent, settings };
}

/**
 * The real app from createApp() against the real, migrated test database. Each
 * call gets its own rate-limit counters so test files do not see each other's.
 */
export async function makeTestApp(opts: TestAppOptions & { databaseUrl?: string } = {}) {
  const url = opts.databaseUrl ?? inject('databaseUrl');
  const ds = createDataSource(url, { poolSize: 4 });
  await ds.initialize();
  const pool = new pg.Pool({ connectionString: url, max: 4 });
  const uploadDir = opts.storage ? undefined : mkdtempSync(join(tmpdir(), 'scrubline-uploads-'));
  const app = createApp({
    ds,
    pool,
    session: {
      secret: 'test-secret-test-secret-test-secret!',
      idleMs: opts.idleMs ?? 60 * 60 * 1000,
      absoluteMs: opts.absoluteMs ?? 24 * 60 * 60 * 1000,
      secureCookie: false,
    },
    mail: opts.mail,
    mailboxDir: opts.mailboxDir,
    payments: opts.payments,
    storage: opts.storage ?? diskStorage(uploadDir),
    logger: opts.logger,
    authLimits: { loginPerIp: 1000, registerPerIp: 1000, resetPerIp: 1000, resetPerEmail: 1000, uploadsPerUser: 1000, keyPrefix: `test-${randomUUID()}`, ...opts.authLimits },
  });
  return {
    app,
    ds,
    pool,
    uploadDir,
    async close() {
      await pool.end();
      await ds.destroy();
      if (uploadDir) rmSync(uploadDir, { recursive: true, force: true });
    },
  };
}

export type TestApp = Awaited<ReturnType<typeof makeTestApp>>;

/** A cookie-keeping client that fetches and sends the CSRF token on writes. */
export function client(app: TestApp['app']) {
  const agent = request.agent(app);
  let token: string | undefined;
  const csrf = async () => {
    const res = await agent.get('/api/auth/csrf').expect(200);
    token = (res.body as { token: string }).token;
    return token;
  };
  const write = async (method: 'post' | 'put' | 'patch' | 'delete', path: string, body?: object) => {
    await csrf();
    const req = agent[method](path).set('X-CSRF-Token', token ?? '');
    return body === undefined ? req : req.send(body);
  };
  return {
    agent,
    csrf,
    get: (path: string) => agent.get(path),
    post: (path: string, body?: object) => write('post', path, body),
    patch: (path: string, body?: object) => write('patch', path, body),
    put: (path: string, body?: object) => write('put', path, body),
    delete: (path: string) => write('delete', path),
  };
}

export const uniqueEmail = (tag = 'driver') => `${tag}-${randomUUID().slice(0, 8)}@example.com`;

/** An account made directly through the service, and a client signed in as it. */
export async function signedInClient(t: TestApp, opts: { isAdmin?: boolean; displayName?: string } = {}) {
  const email = uniqueEmail(opts.isAdmin ? 'admin' : 'driver');
  const user = await createUser(
    t.ds,
    { email, password: TEST_PASSWORD, displayName: opts.displayName ?? 'Test Driver' },
    { isAdmin: opts.isAdmin },
  );
  const c = client(t.app);
  await (await c.post('/api/auth/login', { email, password: TEST_PASSWORD })).body;
  return { c, user, email };
}

/** The session id carried in a Set-Cookie header, if any. */
export function sessionCookie(setCookie: string | string[] | undefined): string | undefined {
  const list = Array.isArray(setCookie) ? setCookie : setCookie ? [setCookie] : [];
  const found = list.find((c) => c.startsWith('scrubline.sid='));
  return found?.split(';')[0];
}

/** The session ID inside a signed `scrubline.sid=s:<sid>.<signature>` cookie. */
export function sidOf(cookie: string): string {
  const value = decodeURIComponent(cookie.split(';')[0]!.split('=')[1] ?? '');
  return value.slice(2).split('.')[0]!;
}

/** The Cookie header a supertest request actually sent. */
export function sentCookie(res: object): string {
  return String((res as { req: { getHeader(name: string): unknown } }).req.getHeader('cookie') ?? '');
}

import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createApp } from '../../../server/app';
import { makeTestApp, type TestApp } from '../test-app';

let t: TestApp;
let clientDir: string;
let app: ReturnType<typeof createApp>;
beforeAll(async () => {
  t = await makeTestApp();
  clientDir = mkdtempSync(join(tmpdir(), 'scrubline-client-'));
  writeFileSync(join(clientDir, 'index.html'), '<html><head><meta name="csp-nonce" content="__CSP_NONCE__" /></head><body>app</body></html>');
  writeFileSync(join(clientDir, 'sw.js'), 'self.addEventListener("fetch", () => {});');
  app = createApp({ ds: t.ds, pool: t.pool, clientDir, session: { secret: 'x'.repeat(32), idleMs: 60_000, absoluteMs: 60_000, secureCookie: false } });
});
afterAll(async () => {
  await t.close();
  rmSync(clientDir, { recursive: true, force: true });
});

const nonceIn = (csp: string) => /style-src 'self' 'nonce-([A-Za-z0-9+/=]+)'/.exec(csp)?.[1];

describe('serving the client', () => {
  it('when any page is opened, then index.html carries the same fresh style nonce as its CSP header', async () => {
    const first = await request(app).get('/events/some-day');
    expect(first.status).toBe(200);
    const nonce = nonceIn(first.headers['content-security-policy'] as string);
    expect(nonce).toBeDefined();
    expect(first.text).toContain(`content="${nonce}"`);
    expect(first.text).not.toContain('__CSP_NONCE__');
    const second = await request(app).get('/index.html');
    expect(second.text).not.toContain('__CSP_NONCE__');
    expect(nonceIn(second.headers['content-security-policy'] as string)).not.toBe(nonce);
  });

  it('when a file of the build is asked for, then it is served as it is', async () => {
    const res = await request(app).get('/sw.js');
    expect(res.status).toBe(200);
    expect(res.text).toContain('addEventListener');
  });

  it('when an unknown /api path is asked for, then it is a JSON 404, not the page', async () => {
    const res = await request(app).get('/api/nothing-here');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

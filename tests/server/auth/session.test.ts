import { afterEach, describe, expect, it } from 'vitest';
import { makeTestApp, sidOf, sentCookie, signedInClient, type TestApp } from '../test-app';

const opened: TestApp[] = [];
afterEach(async () => {
  await Promise.all(opened.splice(0).map((t) => t.close()));
});
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

describe('session lifetime', () => {
  it('when the absolute time since sign-in has passed, then the session ends and its row is deleted, however active', async () => {
    const t = await makeTestApp({ absoluteMs: 3000 });
    opened.push(t);
    const { c } = await signedInClient(t);
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    const sid = sidOf(sentCookie(me));
    await sleep(1000);
    expect((await c.get('/api/auth/me')).status).toBe(200); // activity does not extend the absolute limit
    await sleep(2500);
    expect((await c.get('/api/auth/me')).status).toBe(401);
    expect(await t.ds.query('SELECT 1 FROM session WHERE sid = $1', [sid])).toHaveLength(0);
  });

  it('when the idle time has passed with no request, then the session has expired', async () => {
    const t = await makeTestApp({ idleMs: 2000 });
    opened.push(t);
    const { c } = await signedInClient(t);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    await sleep(2600);
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });
});

import { afterEach, describe, expect, it, vi } from 'vitest';
import { sessionStore, touchAfterMs } from '../../../server/auth/session';
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

  it('when a session is used again within a few minutes, then its stored expiry is not rewritten; once it is older than that, the next request moves it on by the idle timeout', async () => {
    const idleMs = 60 * 60 * 1000;
    const t = await makeTestApp({ idleMs });
    opened.push(t);
    const { c } = await signedInClient(t);
    const me = await c.get('/api/auth/me');
    const sid = sidOf(sentCookie(me));
    const expiry = async () => ((await t.ds.query('SELECT expire FROM session WHERE sid = $1', [sid])) as { expire: Date }[])[0]!.expire.getTime();
    const first = await expiry();

    await sleep(1100); // the expire column has whole-second precision (to_timestamp of seconds)
    for (let i = 0; i < 5; i++) expect((await c.get('/api/auth/me')).status).toBe(200);
    expect(await expiry()).toBe(first);

    // The row as a request older than the refresh interval would have left it.
    const stale = Date.now() + idleMs - touchAfterMs(idleMs) - 60_000;
    await t.ds.query('UPDATE session SET expire = to_timestamp($1 / 1000.0) WHERE sid = $2', [stale, sid]);
    const before = Date.now();
    expect((await c.get('/api/auth/me')).status).toBe(200);
    const moved = await expiry();
    expect(moved).toBeGreaterThanOrEqual(before + idleMs - 1000);
    expect(moved).toBeLessThanOrEqual(Date.now() + idleMs + 1000);
  });

  it('when a loaded session is saved, then the row holds the session alone, not the expiry and account read with it', async () => {
    const t = await makeTestApp();
    opened.push(t);
    const { c, user } = await signedInClient(t);
    const sid = sidOf(sentCookie(await c.get('/api/auth/me')));
    const store = sessionStore(t.pool, 60_000);
    const loaded = await new Promise<Record<string, unknown>>((resolve, reject) =>
      store.get(sid, (err, sess) => (err ? reject(err) : resolve(sess as unknown as Record<string, unknown>))),
    );
    expect(JSON.stringify(loaded)).toContain(user.email); // the account came with it
    await new Promise<void>((resolve, reject) => store.set(sid, { ...loaded, note: 'saved' } as never, (err) => (err ? reject(err) : resolve())));
    const [row] = (await t.ds.query('SELECT sess FROM session WHERE sid = $1', [sid])) as { sess: Record<string, unknown> }[];
    expect(row!.sess).toMatchObject({ note: 'saved', passport: { user: user.id } });
    expect(JSON.stringify(row!.sess)).not.toContain(user.email);
    expect(Object.keys(row!.sess).filter((k) => k.startsWith('__'))).toEqual([]);
  });

  it('when the idle timeout is short and requests keep coming, then the session stays open past it', async () => {
    const t = await makeTestApp({ idleMs: 2000 });
    opened.push(t);
    const { c } = await signedInClient(t);
    for (let i = 0; i < 6; i++) {
      expect((await c.get('/api/auth/me')).status).toBe(200);
      await sleep(700);
    }
  });

  it('when a signed-in request arrives, then its session and its account are read in one query, and nothing is written', async () => {
    const t = await makeTestApp();
    opened.push(t);
    const { c } = await signedInClient(t);
    expect((await c.get('/api/auth/me')).status).toBe(200);
    const storeQueries = vi.spyOn(t.pool, 'query');
    const appQueries = vi.spyOn(t.ds, 'query');
    const me = await c.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(storeQueries).toHaveBeenCalledTimes(1);
    expect(appQueries).not.toHaveBeenCalled();
    vi.restoreAllMocks();
  });

  it('when the account changes between two requests, then the second sees the change, and a deleted account reads as signed out', async () => {
    const t = await makeTestApp();
    opened.push(t);
    const { c, user } = await signedInClient(t);
    expect((await c.get('/api/auth/me')).body.user.roles).not.toContain('admin');
    await t.ds.query('UPDATE users SET is_admin = true, display_name = $2 WHERE id = $1', [user.id, 'Renamed Driver']);
    const after = await c.get('/api/auth/me');
    expect(after.body.user.roles).toContain('admin');
    expect(after.body.user.displayName).toBe('Renamed Driver');
    await t.ds.query('DELETE FROM users WHERE id = $1', [user.id]);
    expect((await c.get('/api/auth/me')).status).toBe(401);
  });
});

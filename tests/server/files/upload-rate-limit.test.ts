import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { attachmentWorld, png, upload } from './attachment-fixtures';

/** Uploads count per account, like sign-ins: past the limit the next one is refused before its body is read. */
let t: TestApp;
let w: Awaited<ReturnType<typeof attachmentWorld>>;

beforeAll(async () => {
  t = await makeTestApp({ authLimits: { uploadsPerUser: 3 } });
  w = await attachmentWorld(t);
});
afterAll(async () => {
  await t.close();
});

describe('the upload limit', () => {
  it('when one account sends more uploads than the limit allows, then the next gets 429 with Retry-After and nothing more is stored; another account still uploads', async () => {
    const target = { targetType: 'run', targetId: w.runId };
    const photo = { bytes: await png(20, 20), name: 'wear.png', type: 'image/png' };
    for (let i = 0; i < 3; i++) expect((await upload(w.owner.c, target, [photo])).status).toBe(201);
    const fourth = await upload(w.owner.c, target, [photo]);
    expect(fourth.status).toBe(429);
    expect(fourth.body.error.code).toBe('rate_limited');
    expect(Number(fourth.headers['retry-after'])).toBeGreaterThan(0);
    const listed = await w.owner.c.get(`/api/attachments?targetType=run&targetId=${w.runId}`);
    expect(listed.body.count).toBe(3);
    // The co-driver has a counter of their own.
    expect((await upload(w.coDriver.c, target, [photo])).status).toBe(201);
  });
});

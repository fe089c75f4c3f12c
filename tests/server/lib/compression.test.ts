import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeTestApp, type TestApp } from '../test-app';
import { driverWithCarAndEvent, postRun } from '../season/season-fixtures';

let t: TestApp;
beforeAll(async () => {
  t = await makeTestApp();
});
afterAll(async () => {
  await t?.close();
});

describe('compressed answers', () => {
  it('when a browser that takes gzip reads a car\'s runs, then the answer comes gzipped and reads back the same; a small answer is sent as it is', async () => {
    const d = await driverWithCarAndEvent(t);
    for (let n = 1; n <= 8; n++) await postRun(d.c, d.carId, d.eventId, { runNumber: n, recordedAt: `2026-04-12T10:0${n}:00Z` });

    const zipped = await d.c.agent.get(`/api/runs?carId=${d.carId}`).set('Accept-Encoding', 'gzip');
    expect(zipped.status).toBe(200);
    expect(zipped.headers['content-encoding']).toBe('gzip');
    expect(zipped.body.items).toHaveLength(8);
    const plain = await d.c.agent.get(`/api/runs?carId=${d.carId}`).set('Accept-Encoding', 'identity');
    expect(plain.headers['content-encoding']).toBeUndefined();
    expect(zipped.body).toEqual(plain.body);

    // Under the 1 KB threshold: not worth the work.
    const small = await d.c.agent.get(`/api/cars/${d.carId}`).set('Accept-Encoding', 'gzip');
    expect(Number(small.headers['content-length'] ?? small.text.length)).toBeLessThan(1024);
    expect(small.headers['content-encoding']).toBeUndefined();
  });
});

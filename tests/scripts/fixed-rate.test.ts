import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { performance } from 'node:perf_hooks';
import { afterEach, describe, expect, it } from 'vitest';
import { fixedRateLoad } from '../../scripts/lib/fixed-rate';

/** A local server that answers each request as `answer(n, arrivedAtMs)` says, counting from 0. */
async function localServer(answer: (n: number, res: http.ServerResponse) => void) {
  const arrivals: number[] = [];
  const server = http.createServer((req, res) => {
    const n = arrivals.length;
    arrivals.push(performance.now());
    req.resume();
    req.on('end', () => answer(n, res));
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  open.push(server);
  return { url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/x`, arrivals };
}

const open: http.Server[] = [];
afterEach(async () => {
  await Promise.all(open.splice(0).map((s) => new Promise((resolve) => s.close(resolve))));
});

describe('fixed-rate load', () => {
  it('when 100 requests a second are asked for one second, then they arrive spread over the second, not in a burst', async () => {
    const server = await localServer((_n, res) => res.end('ok'));
    const r = await fixedRateLoad({ url: server.url, ratePerSec: 100, durationSec: 1, connections: 10 });

    expect(r.sent).toBe(100);
    expect(r.errors).toBe(0);
    expect(server.arrivals).toHaveLength(100);
    // Due every 10 ms: about half of them in the first half second, the last about 990 ms after the first.
    // A generator that sends each connection's share of the second back to back would have them all in the
    // first few milliseconds.
    const first = server.arrivals[0]!;
    const inFirstHalf = server.arrivals.filter((t) => t - first < 500).length;
    expect(inFirstHalf).toBeGreaterThanOrEqual(35);
    expect(inFirstHalf).toBeLessThanOrEqual(65);
    expect(server.arrivals.at(-1)! - first).toBeGreaterThan(800);
  });

  it('when the server stalls one request on the only connection, then the requests that queued behind it count their wait', async () => {
    // Worked example (coordinated omission; Gil Tene, "How NOT to Measure Latency", 2015): one connection,
    // a request due every 50 ms, the third (due at 100 ms) held for 500 ms. The ones due at 150, 200, …
    // ms can only go out once it is answered, at about 600 ms, so from when they were due they took 450,
    // 400, 350, 300, 250 and 200 ms: seven requests of at least 200 ms, the held one with them. Timed from
    // when each went out, only the held one would be slow.
    const server = await localServer((n, res) => setTimeout(() => res.end('ok'), n === 2 ? 500 : 0));
    const r = await fixedRateLoad({ url: server.url, ratePerSec: 20, durationSec: 1.5, connections: 1 });

    expect(r.sent).toBe(30);
    expect(r.latencies).toHaveLength(30);
    const slow = r.latencies.filter((ms) => ms >= 190).length;
    expect(slow).toBeGreaterThanOrEqual(6);
    expect(slow).toBeLessThanOrEqual(9);
    expect(r.max).toBeGreaterThanOrEqual(495);
    expect(r.max).toBeLessThan(700);
    // Of 30 requests, p97.5 and p99 fall on the held one and the one right behind it; the median does not.
    expect(r.p97_5).toBeGreaterThanOrEqual(400);
    expect(r.p50).toBeLessThan(150);
  });

  it('when answers fail or never come, then they count as errors and the load still ends', async () => {
    const server = await localServer((n, res) => {
      if (n === 3) return; // never answered
      res.statusCode = n % 5 === 0 ? 503 : 200;
      res.end('x');
    });
    const r = await fixedRateLoad({ url: server.url, method: 'POST', body: () => '{"a":1}', ratePerSec: 50, durationSec: 0.4, connections: 4, timeoutMs: 300 });

    expect(r.sent).toBe(20);
    // Requests 0, 5, 10 and 15 answered 503, and request 3 never: five errors, fifteen latencies.
    expect(r.errors).toBe(5);
    expect(r.errorKinds).toEqual({ 'status 503': 4, timeout: 1 });
    expect(r.latencies).toHaveLength(15);
  });
});

// A fixed arrival rate, open loop: request i is due at start + i / rate, whether or not the earlier ones
// have been answered, and its latency is counted from when it was due, not from when a free connection
// let it go out. A server that stalls therefore shows its stall in every request that waited for it
// (Gil Tene, "How NOT to Measure Latency", 2015: coordinated omission; wrk2 schedules requests the same
// way). At most `connections` requests are on the wire at once, as with a load generator of that many
// connections; a request due while all are busy waits for one, and the wait counts.
import http from 'node:http';
import { performance } from 'node:perf_hooks';
import { quantileSorted } from 'simple-statistics';

export interface FixedRateOptions {
  url: string;
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  /** Called once per request, when it goes out. */
  body?: () => string;
  ratePerSec: number;
  durationSec: number;
  connections: number;
  /** A request not answered this long after it was due counts as an error. */
  timeoutMs?: number;
}

export interface FixedRateResult {
  sent: number;
  /** Latencies from each request's due time to the end of its answer, in ms, sorted (2xx answers only). */
  latencies: number[];
  p50: number;
  p97_5: number;
  p99: number;
  max: number;
  /** Answers that were not 2xx, connection errors and timeouts. */
  errors: number;
  /** The most any request went out after it was due while a connection was free (this process's own lag). */
  maxSendLagMs: number;
}

export async function fixedRateLoad(opts: FixedRateOptions): Promise<FixedRateResult> {
  const total = Math.round(opts.ratePerSec * opts.durationSec);
  const intervalMs = 1000 / opts.ratePerSec;
  const timeoutMs = opts.timeoutMs ?? 10_000;
  const agent = new http.Agent({ keepAlive: true, maxSockets: opts.connections });
  const url = new URL(opts.url);
  const latencies: number[] = [];
  let errors = 0;
  let maxSendLagMs = 0;
  let inFlight = 0;
  const waiting: number[] = [];

  const start = performance.now() + 20;
  const dueAt = (i: number) => start + i * intervalMs;
  let finished!: () => void;
  const allDone = new Promise<void>((resolve) => (finished = resolve));
  let settled = 0;
  const settle = () => {
    inFlight--;
    if (++settled === total) finished();
    else if (waiting.length > 0) send(waiting.shift()!);
  };

  function send(i: number) {
    inFlight++;
    const due = dueAt(i);
    const body = opts.body?.();
    const headers = { ...opts.headers, ...(body === undefined ? {} : { 'content-length': String(Buffer.byteLength(body)) }) };
    let done = false;
    const fail = () => {
      if (done) return;
      done = true;
      errors++;
      settle();
    };
    const req = http.request({ agent, host: url.hostname, port: url.port, path: url.pathname + url.search, method: opts.method ?? 'GET', headers }, (res) => {
      res.resume();
      res.on('end', () => {
        if (done) return;
        done = true;
        if (res.statusCode !== undefined && res.statusCode >= 200 && res.statusCode < 300) latencies.push(performance.now() - due);
        else errors++;
        settle();
      });
      res.on('error', fail);
    });
    req.setTimeout(Math.max(1, due + timeoutMs - performance.now()), () => {
      req.destroy();
      fail();
    });
    req.on('error', fail);
    req.end(body);
  }

  // Each request goes out when it is due, or as soon as one of the connections is free after that.
  let next = 0;
  const tick = () => {
    const now = performance.now();
    while (next < total && dueAt(next) <= now) {
      if (inFlight < opts.connections && waiting.length === 0) {
        maxSendLagMs = Math.max(maxSendLagMs, now - dueAt(next));
        send(next);
      } else {
        waiting.push(next);
      }
      next++;
    }
    if (next < total) setTimeout(tick, Math.max(0, dueAt(next) - performance.now()));
  };
  if (total === 0) finished();
  else setTimeout(tick, Math.max(0, start - performance.now()));
  await allDone;
  agent.destroy();

  latencies.sort((a, b) => a - b);
  const q = (p: number) => (latencies.length === 0 ? NaN : quantileSorted(latencies, p));
  return {
    sent: total,
    latencies,
    p50: q(0.5),
    p97_5: q(0.975),
    p99: q(0.99),
    max: latencies.at(-1) ?? NaN,
    errors,
    maxSendLagMs,
  };
}

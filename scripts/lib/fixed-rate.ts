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
  /** The errors by kind: "status 503", "ECONNRESET", "timeout". */
  errorKinds: Record<string, number>;
  /** The most any request went out after it was due while a connection was free (this process's own lag). */
  maxSendLagMs: number;
}

export async function fixedRateLoad(opts: FixedRateOptions): Promise<FixedRateResult> {
  const total = Math.round(opts.ratePerSec * opts.durationSec);
  const intervalMs = 1000 / opts.ratePerSec;
  const timeoutMs = opts.timeoutMs ?? 10_000;
  // FIFO: the connections take turns, as a load generator's do; with the default LIFO most of them would
  // sit idle until the server closed them, and a request sent as it did so would fail.
  const agent = new http.Agent({ keepAlive: true, maxSockets: opts.connections, scheduling: 'fifo' });
  const url = new URL(opts.url);
  const latencies: number[] = [];
  let errors = 0;
  const errorKinds: Record<string, number> = {};
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
    const fail = (kind: string) => {
      if (done) return;
      done = true;
      errors++;
      errorKinds[kind] = (errorKinds[kind] ?? 0) + 1;
      settle();
    };
    const req = http.request({ agent, host: url.hostname, port: url.port, path: url.pathname + url.search, method: opts.method ?? 'GET', headers }, (res) => {
      res.resume();
      res.on('end', () => {
        const status = res.statusCode ?? 0;
        if (status < 200 || status >= 300) return fail(`status ${status}`);
        if (done) return;
        done = true;
        latencies.push(performance.now() - due);
        settle();
      });
      res.on('error', (e: NodeJS.ErrnoException) => fail(e.code ?? e.message));
    });
    req.setTimeout(Math.max(1, due + timeoutMs - performance.now()), () => {
      fail('timeout');
      req.destroy();
    });
    req.on('error', (e: NodeJS.ErrnoException) => fail(e.code ?? e.message));
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
    errorKinds,
    maxSendLagMs,
  };
}

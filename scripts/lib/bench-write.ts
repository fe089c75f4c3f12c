// The write path under load: POST /api/runs through the whole app (session, CSRF, validation, access
// checks, the insert and the answer) against the floor of the same single-row INSERT sent through
// plain node-postgres at the same concurrency. autocannon reports p2.5/p50/p97.5/p99, not p95
// (https://github.com/mcollina/autocannon#readme). Its `overallRate` (the CLI's `-R`) neither spaces the
// requests nor times them from when they were due: each connection sends its share of the second back to
// back (lib/httpClient.js, `reqsMadeThisSecond`), and each answer is recorded with
// `recordValueWithExpectedInterval(responseTime, Math.ceil(1 / rate))` (lib/run.js), an interval of 1 ms for
// any rate above one request a second per connection, so an answer of L ms is counted L times. The fixed
// rate is therefore also measured open loop (`fixedRateApi`, scripts/lib/fixed-rate.ts), and
// `autocannonCalibration` shows on a known server what autocannon's figures make of it.
import { randomUUID } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { performance } from 'node:perf_hooks';
import autocannon from 'autocannon';
import pg from 'pg';
import { quantileSorted } from 'simple-statistics';
import type { BenchSession } from './bench-session';
import { fixedRateLoad } from './fixed-rate';

export interface LoadResult {
  label: string;
  connections: number;
  /** Requests per second over the whole step. */
  throughput: number;
  total: number;
  p50: number;
  p97_5: number;
  p99: number;
  errors: number;
}

/**
 * Each run of the load is a new run of its own: the next free (event, car, run number). A car runs
 * RUNS_PER_DAY times at an event, as at a real one, so that reading a run back (which scores it
 * among that day's runs of the car) costs what it costs at the track.
 */
export const RUNS_PER_DAY = 10;
export class RunSlots {
  private next = 0;
  constructor(
    private readonly carIds: string[],
    private readonly events: { id: string; date: string }[],
  ) {}

  take() {
    const i = this.next++;
    const slot = Math.floor(i / RUNS_PER_DAY);
    const event = this.events[Math.floor(slot / this.carIds.length)];
    if (!event) throw new Error(`the bench made room for ${this.events.length * this.carIds.length * RUNS_PER_DAY} runs; raise BENCH_EVENTS`);
    return {
      id: randomUUID(),
      carId: this.carIds[slot % this.carIds.length]!,
      eventId: event.id,
      runNumber: (i % RUNS_PER_DAY) + 1,
      rawTimeSec: 40 + (i % 997) / 100,
      cones: i % 3,
      status: 'finished' as const,
      recordedAt: `${event.date}T10:${String(i % RUNS_PER_DAY).padStart(2, '0')}:00.000Z`,
    };
  }
}

/** `count` cars of the session's driver, each with a baseline setup. */
export async function benchCars(s: BenchSession, name: string, count: number) {
  const ids: string[] = [];
  for (let n = 1; n <= count; n++) {
    const car = await s.post<{ id: string }>('/api/cars', {
      name: `${name} ${n}`,
      classCode: 'STR',
      carNumber: String(n),
      tyreSize: '205/50R15',
      damperAdjusters: { front: { positions: 12, countFrom: 'full_soft' }, rear: { positions: 12, countFrom: 'full_soft' } },
      motionRatios: { front: 0.7, rear: 0.75 },
    });
    await s.post(`/api/cars/${car.id}/setups`, {
      label: 'Bench baseline',
      effectiveFrom: '2026-01-01T00:00:00Z',
      corners: {
        lf: { camberDeg: -1.5, damperClicks: 4, coldPressureKpa: 220 },
        rf: { camberDeg: -1.5, damperClicks: 4, coldPressureKpa: 220 },
        lr: { camberDeg: -1, damperClicks: 6, coldPressureKpa: 210 },
        rr: { camberDeg: -1, damperClicks: 6, coldPressureKpa: 210 },
      },
    });
    ids.push(car.id);
  }
  return ids;
}

/** `count` events, one a day from February. */
export async function benchEvents(s: BenchSession, count: number) {
  const made: { id: string; date: string }[] = [];
  for (let i = 0; i < count; i++) {
    const day = new Date(Date.UTC(2026, 1, 1) + i * 86_400_000).toISOString().slice(0, 10);
    const e = await s.post<{ id: string }>('/api/events', { name: `Load day ${i + 1}`, date: day, venue: 'Bench lot', conePenaltySec: 2 });
    made.push({ id: e.id, date: day });
  }
  return made;
}

/** autocannon against POST /api/runs, each request a new run. */
export async function loadApi(
  s: BenchSession,
  slots: RunSlots,
  opts: { label: string; connections: number; durationSec: number; overallRate?: number },
): Promise<LoadResult> {
  const r = await autocannon({
    url: `${s.base}/api/runs`,
    method: 'POST',
    connections: opts.connections,
    duration: opts.durationSec,
    overallRate: opts.overallRate,
    headers: { 'content-type': 'application/json', cookie: s.cookie, 'x-csrf-token': s.csrfToken },
    requests: [{ setupRequest: (req) => ({ ...req, body: JSON.stringify(slots.take()) }) }],
  });
  return loadResult(opts, r);
}

/**
 * POST /api/runs at a fixed rate, open loop: a new run every 1/rate s, at most `connections` on the wire,
 * each timed from when it was due.
 */
export async function fixedRateApi(
  s: BenchSession,
  slots: RunSlots,
  opts: { label: string; connections: number; durationSec: number; ratePerSec: number },
): Promise<LoadResult> {
  const r = await fixedRateLoad({
    url: `${s.base}/api/runs`,
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie: s.cookie, 'x-csrf-token': s.csrfToken },
    body: () => JSON.stringify(slots.take()),
    ratePerSec: opts.ratePerSec,
    durationSec: opts.durationSec,
    connections: opts.connections,
  });
  if (r.errors > 0) console.log(`${opts.label}, ${opts.connections} connections: errors ${JSON.stringify(r.errorKinds)}`);
  return {
    label: opts.label,
    connections: opts.connections,
    throughput: r.latencies.length / opts.durationSec,
    total: r.sent,
    p50: r.p50,
    p97_5: r.p97_5,
    p99: r.p99,
    errors: r.errors,
  };
}

/**
 * autocannon's `overallRate` against a server whose answers are known: at once, except every 100th after
 * 200 ms. Returns the percentiles of the answers autocannon itself saw (its `response` events) beside the
 * ones it reports.
 */
export async function autocannonCalibration(opts: { connections: number; durationSec: number; overallRate: number }) {
  let n = 0;
  const server = http.createServer((req, res) => {
    req.resume();
    setTimeout(() => res.end('ok'), ++n % 100 === 0 ? 200 : 0);
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const seen: number[] = [];
  try {
    const r = await new Promise<autocannon.Result>((resolve, reject) => {
      const instance = autocannon(
        {
          url: `http://127.0.0.1:${(server.address() as AddressInfo).port}/`,
          connections: opts.connections,
          duration: opts.durationSec,
          overallRate: opts.overallRate,
        },
        (err, result) => (err ? reject(err) : resolve(result)),
      );
      instance.on('response', (_client: unknown, _status: number, _bytes: number, responseTime: number) => seen.push(responseTime));
    });
    seen.sort((a, b) => a - b);
    return {
      answers: seen.length,
      seen: { p50: quantileSorted(seen, 0.5), p97_5: quantileSorted(seen, 0.975), p99: quantileSorted(seen, 0.99) },
      reported: { p50: r.latency.p50, p97_5: r.latency.p97_5, p99: r.latency.p99, samples: (r.latency as { totalCount?: number }).totalCount },
    };
  } finally {
    await new Promise((resolve) => server.close(resolve));
  }
}

/** autocannon's answer as one row of the report: every request that failed or was not 2xx is an error. */
function loadResult(opts: { label: string; connections: number }, r: autocannon.Result): LoadResult {
  return {
    label: opts.label,
    connections: opts.connections,
    throughput: r.requests.total / r.duration,
    total: r.requests.total,
    p50: r.latency.p50,
    p97_5: r.latency.p97_5,
    p99: r.latency.p99,
    errors: r.errors + r.timeouts + r.non2xx,
  };
}

/**
 * The floor: `total` INSERTs of the same run row, `connections` at a time, through a pool as large as the
 * app's TypeORM pool (10), so both sides have the same number of database connections to work with.
 */
export async function loadRawInserts(
  databaseUrl: string,
  driverId: string,
  slots: RunSlots,
  opts: { label: string; connections: number; total: number; poolSize: number },
): Promise<LoadResult> {
  const pool = new pg.Pool({ connectionString: databaseUrl, max: opts.poolSize });
  const latencies: number[] = [];
  let errors = 0;
  let left = opts.total;
  const t0 = performance.now();
  const worker = async () => {
    while (left-- > 0) {
      const run = slots.take();
      const start = performance.now();
      try {
        await pool.query(
          `INSERT INTO runs (id, car_id, event_id, driver_id, run_number, raw_time_sec, cones, status, recorded_at, notes)
           VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10) ON CONFLICT DO NOTHING RETURNING id`,
          [run.id, run.carId, run.eventId, driverId, run.runNumber, run.rawTimeSec, run.cones, run.status, run.recordedAt, null],
        );
      } catch {
        errors++;
      }
      latencies.push(performance.now() - start);
    }
  };
  await Promise.all(Array.from({ length: opts.connections }, worker));
  const seconds = (performance.now() - t0) / 1000;
  await pool.end();
  latencies.sort((a, b) => a - b);
  return {
    label: opts.label,
    connections: opts.connections,
    throughput: latencies.length / seconds,
    total: latencies.length,
    p50: quantileSorted(latencies, 0.5),
    p97_5: quantileSorted(latencies, 0.975),
    p99: quantileSorted(latencies, 0.99),
    errors,
  };
}

/** autocannon against a GET, for the cost of what every request pays (session, user) before its handler. */
export async function loadGet(s: BenchSession | { base: string }, path: string, opts: { label: string; connections: number; durationSec: number }) {
  const r = await autocannon({
    url: s.base + path,
    connections: opts.connections,
    duration: opts.durationSec,
    headers: 'cookie' in s ? { cookie: s.cookie } : {},
  });
  return loadResult(opts, r);
}

export function formatLoad(rows: LoadResult[]): string {
  const head = `${'step'.padEnd(30)} ${'conns'.padStart(5)} ${'req/s'.padStart(8)} ${'p50'.padStart(6)} ${'p97.5'.padStart(6)} ${'p99'.padStart(6)} ${'errors'.padStart(6)}`;
  return [
    head,
    ...rows.map(
      (r) =>
        `${r.label.padEnd(30)} ${String(r.connections).padStart(5)} ${r.throughput.toFixed(0).padStart(8)} ${r.p50.toFixed(1).padStart(6)} ${r.p97_5.toFixed(1).padStart(6)} ${r.p99.toFixed(1).padStart(6)} ${String(r.errors).padStart(6)}`,
    ),
  ].join('\n');
}

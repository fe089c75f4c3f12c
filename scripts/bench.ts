// `npm run bench`: a production build of the client, a private PostgreSQL cluster in a temporary folder
// with the demo season, the real server on a free port, then a report: the client's size per route, the
// read paths for one car, the cost every request pays for its session, the write path under load against
// the raw-insert floor, growth to 1000 drivers, and the trackside page's speed in Chromium. Not part of
// `npm test`. BENCH_ONLY=size,read,session,write,growth,page runs some sections only.
import { spawnSync } from 'node:child_process';
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { cpus, tmpdir, totalmem } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { startCluster } from './lib/pg-cluster';
import { ROOT, say } from './lib/env';
import { formatSizes, routeSizes } from './lib/bundle-size';
import { register, signIn, type BenchSession } from './lib/bench-session';
import { benchCars, benchEvents, formatLoad, loadApi, loadGet, loadRawInserts, RunSlots, type LoadResult } from './lib/bench-write';
import { loadConfig } from '../server/config';
import { startServer } from '../server/index';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../server/db/demo-accounts';

const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 50);
/** Seconds of load per step of the write path. */
const STEP_SEC = Number(process.env.BENCH_STEP_SEC ?? 10);
const ONLY = new Set((process.env.BENCH_ONLY ?? 'size,read,session,write,growth,page').split(','));
/** The app's TypeORM pool (server/db/data-source.ts); the raw floor gets as many connections. */
const APP_POOL_SIZE = 10;

const targets: { what: string; met: boolean; detail: string }[] = [];
const target = (what: string, met: boolean, detail: string) => targets.push({ what, met, detail });

function quantile(sorted: number[], q: number) {
  const i = (sorted.length - 1) * q;
  const lo = Math.floor(i);
  const hi = Math.ceil(i);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (i - lo);
}

/** p50, p95 and max of `rounds` sequential GETs after 5 warm-ups. */
async function timeGet(s: BenchSession, path: string, rounds = ROUNDS) {
  for (let i = 0; i < 5; i++) await s.get(path);
  const times: number[] = [];
  for (let i = 0; i < rounds; i++) {
    const t0 = performance.now();
    await s.get(path);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { p50: quantile(times, 0.5), p95: quantile(times, 0.95), max: times.at(-1)! };
}

async function demoCarPaths(s: BenchSession) {
  const cars = await s.get<{ items: { id: string; name: string }[] }>('/api/cars');
  const carId = cars.items.find((c) => c.name === 'Pebble')!.id;
  const changes = await s.get<{ items: { id: string; what: string }[] }>(`/api/cars/${carId}/changes`);
  const armsId = changes.items.find((c) => /camber arms/i.test(c.what))!.id;
  const events = await s.get<{ items: { id: string }[] }>('/api/events');
  return {
    carId,
    eventId: events.items[0]!.id,
    paths: [
      ['event summary', `/api/events/${events.items[0]!.id}/summary?carId=${carId}`],
      ['runs of a car', `/api/runs?carId=${carId}`],
      ['season', `/api/cars/${carId}/season`],
      ['scatter camber × wear', `/api/cars/${carId}/analysis/scatter?x=camber&y=wear&corner=front`],
      ['scatter clicks × time', `/api/cars/${carId}/analysis/scatter?x=damperClicks&y=time&corner=rear`],
      ['compare (camber arms)', `/api/cars/${carId}/analysis/compare?changeId=${armsId}`],
    ] as [string, string][],
  };
}

function heading(title: string) {
  console.log(`\n## ${title}\n`);
}

async function readPaths(s: BenchSession) {
  heading(`Read paths: one car of the demo season, ${ROUNDS} sequential requests each after 5 warm-ups (ms)`);
  const { paths } = await demoCarPaths(s);
  console.log(`${'endpoint'.padEnd(24)} ${'p50'.padStart(7)} ${'p95'.padStart(7)} ${'max'.padStart(7)}`);
  let worst = 0;
  for (const [name, path] of paths) {
    const t = await timeGet(s, path);
    worst = Math.max(worst, t.p50);
    console.log(`${name.padEnd(24)} ${t.p50.toFixed(1).padStart(7)} ${t.p95.toFixed(1).padStart(7)} ${t.max.toFixed(1).padStart(7)}`);
  }
  target('read paths: p50 under 100 ms for one demo season', worst < 100, `slowest p50 ${worst.toFixed(1)} ms`);
}

async function sessionCost(s: BenchSession) {
  heading('What every request pays: 50 connections, 5 s each');
  const rows = [
    await loadGet({ base: s.base }, '/api/health', { label: 'GET /api/health (no session)', connections: 50, durationSec: 5 }),
    await loadGet(s, '/api/auth/me', { label: 'GET /api/auth/me (session)', connections: 50, durationSec: 5 }),
  ];
  console.log(formatLoad(rows));
  const [bare, withSession] = rows as [LoadResult, LoadResult];
  const perRequestMs = 1000 / withSession.throughput - 1000 / bare.throughput;
  console.log(`\nThe session (cookie check, row read, user read, expiry refresh) costs ${perRequestMs.toFixed(2)} ms of server time per request.`);
}

async function writePath(base: string, databaseUrl: string) {
  heading(`Write path: POST /api/runs, each a new run, ${STEP_SEC} s per step, against the same INSERT through plain pg`);
  const s = await register(base, `bench-${Date.now()}@example.invalid`, 'bench-password-long-enough', 'Load Tester');
  const me = await s.get<{ user: { id: string } }>('/api/auth/me');
  const events = await benchEvents(s, Number(process.env.BENCH_EVENTS ?? 150));
  const cars = Number(process.env.BENCH_CARS ?? 40);
  const apiSlots = new RunSlots(await benchCars(s, 'Load car', cars), events);
  const rawSlots = new RunSlots(await benchCars(s, 'Floor car', cars), events);
  // Warm-up: connections open, plans cached, JIT settled.
  await loadApi(s, apiSlots, { label: 'warm-up', connections: 10, durationSec: 2 });
  await loadRawInserts(databaseUrl, me.user.id, rawSlots, { label: 'warm-up', connections: 10, total: 1000, poolSize: APP_POOL_SIZE });

  const rows: LoadResult[] = [];
  let worstRatio = Infinity;
  for (const connections of [10, 50, 100]) {
    const a = await loadApi(s, apiSlots, { label: 'API POST /api/runs', connections, durationSec: STEP_SEC });
    const r = await loadRawInserts(databaseUrl, me.user.id, rawSlots, { label: 'raw INSERT (floor)', connections, total: a.total, poolSize: APP_POOL_SIZE });
    rows.push(a, r);
    worstRatio = Math.min(worstRatio, a.throughput / r.throughput);
    console.log(`${connections} connections: API ${a.throughput.toFixed(0)} req/s, floor ${r.throughput.toFixed(0)} inserts/s, ratio ${(a.throughput / r.throughput).toFixed(2)}`);
  }
  const fixed = await loadApi(s, apiSlots, { label: 'API at a fixed 200 req/s (-R)', connections: 20, durationSec: STEP_SEC * 3, overallRate: 200 });
  rows.push(fixed);
  console.log(`\n${formatLoad(rows)}`);
  target('write path: API ÷ raw insert ≥ 0.5 at every concurrency', worstRatio >= 0.5, `lowest ratio ${worstRatio.toFixed(2)}`);
  target(
    'write path at a fixed 200 req/s: p97.5 ≤ 25 ms, p99 ≤ 50 ms, no errors',
    fixed.p97_5 <= 25 && fixed.p99 <= 50 && fixed.errors === 0,
    `p97.5 ${fixed.p97_5} ms, p99 ${fixed.p99} ms, ${fixed.errors} errors`,
  );
  // autocannon stops counting at the end of a step, not its requests: let the last ones finish.
  await new Promise((r) => setTimeout(r, 2000));
}

async function main() {
  if (ONLY.has('size') || ONLY.has('page')) {
    say('building the client…');
    if (spawnSync(join(ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' }).status !== 0) {
      throw new Error('build failed');
    }
  }
  const work = mkdtempSync(join(tmpdir(), 'scrubline-bench-'));
  chmodSync(work, 0o755);
  const cluster = await startCluster({ dir: join(work, 'pg'), port: 0, database: 'scrubline_bench', log: say });
  const running = await startServer(
    loadConfig({ DATABASE_URL: cluster.url, SESSION_SECRET: 'bench-secret-bench-secret-bench-secret', PORT: '0', HOST: '127.0.0.1', LOG_LEVEL: 'silent', SEED_DEMO: 'true' }),
  );
  const base = `http://127.0.0.1:${running.port}`;
  try {
    console.log(`# Scrubline bench — ${new Date().toISOString()}`);
    console.log(`machine: ${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}`);
    console.log('PostgreSQL: a private cluster in a temporary folder (fsync off); client, server and database share the machine.');

    if (ONLY.has('size')) {
      heading('Client: gzipped JavaScript each route loads on first visit');
      const sizes = routeSizes();
      console.log(formatSizes(sizes));
      const trackside = sizes.find((x) => x.route.startsWith('event day'))!;
      target('trackside route ≤ 150 KB gzipped', !trackside.over, `${(trackside.bytes / 1024).toFixed(1)} KB`);
    }
    const driver = await signIn(base, DEMO_ACCOUNTS.driver.email, DEMO_PASSWORD);
    if (ONLY.has('read')) await readPaths(driver);
    if (ONLY.has('session')) await sessionCost(driver);
    if (ONLY.has('write')) await writePath(base, cluster.url);

    heading('Targets');
    for (const t of targets) console.log(`${t.met ? 'met   ' : 'MISSED'}  ${t.what} — ${t.detail}`);
    process.exitCode = targets.some((t) => !t.met && t.what.startsWith('trackside route')) ? 1 : 0;
  } finally {
    await running.close();
    cluster.stop();
    rmSync(work, { recursive: true, force: true });
  }
}

main().catch((err: unknown) => {
  console.error(err);
  process.exit(1);
});

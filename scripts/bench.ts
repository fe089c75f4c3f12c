// `npm run bench`: a production build of the client, a private PostgreSQL cluster in a
// temporary folder with the demo season, the real server on a free port, and timings
// of the read paths for one car. Prints a report; not part of `npm test`.
import { spawnSync } from 'node:child_process';
import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { cpus, tmpdir, totalmem } from 'node:os';
import { join } from 'node:path';
import { performance } from 'node:perf_hooks';
import { startCluster } from './lib/pg-cluster';
import { ROOT, say } from './lib/env';
import { loadConfig } from '../server/config';
import { startServer } from '../server/index';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../server/db/demo-accounts';

const ROUNDS = Number(process.env.BENCH_ROUNDS ?? 50);

function quantile(sorted: number[], q: number) {
  const i = (sorted.length - 1) * q;
  const lo = Math.floor(i);
  const hi = Math.ceil(i);
  return sorted[lo]! + (sorted[hi]! - sorted[lo]!) * (i - lo);
}

async function main() {
  say('building the client…');
  if (spawnSync(join(ROOT, 'node_modules', '.bin', 'vite'), ['build', '--logLevel', 'warn'], { cwd: ROOT, stdio: 'inherit' }).status !== 0) {
    throw new Error('build failed');
  }
  const work = mkdtempSync(join(tmpdir(), 'scrubline-bench-'));
  chmodSync(work, 0o755);
  const cluster = await startCluster({ dir: join(work, 'pg'), port: 0, database: 'scrubline_bench', log: say });
  const running = await startServer(
    loadConfig({ DATABASE_URL: cluster.url, SESSION_SECRET: 'bench-secret-bench-secret-bench-secret', PORT: '0', HOST: '127.0.0.1', LOG_LEVEL: 'silent' }),
  );
  const base = `http://127.0.0.1:${running.port}`;
  try {
    // Sign in as the demo driver, keeping the session cookie.
    let cookie = '';
    const keep = (res: Response) => {
      const set = res.headers.getSetCookie().find((c) => c.startsWith('scrubline.sid='));
      if (set) cookie = set.split(';')[0]!;
    };
    const csrfRes = await fetch(`${base}/api/auth/csrf`);
    keep(csrfRes);
    const { token } = (await csrfRes.json()) as { token: string };
    const login = await fetch(`${base}/api/auth/login`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token, Cookie: cookie },
      body: JSON.stringify({ email: DEMO_ACCOUNTS.driver.email, password: DEMO_PASSWORD }),
    });
    keep(login);
    const get = async (path: string) => {
      const res = await fetch(base + path, { headers: { Cookie: cookie } });
      if (!res.ok) throw new Error(`${path}: ${res.status}`);
      return res.json() as Promise<unknown>;
    };
    const cars = (await get('/api/cars')) as { items: { id: string; name: string }[] };
    const carId = cars.items.find((c) => c.name === 'Pebble')!.id;
    const changes = (await get(`/api/cars/${carId}/changes`)) as { items: { id: string; what: string }[] };
    const armsId = changes.items.find((c) => /camber arms/i.test(c.what))!.id;
    const events = (await get('/api/events')) as { items: { id: string }[] };

    const paths: [string, string][] = [
      ['event summary', `/api/events/${events.items[0]!.id}/summary?carId=${carId}`],
      ['runs of a car', `/api/runs?carId=${carId}`],
      ['season', `/api/cars/${carId}/season`],
      ['scatter camber × wear', `/api/cars/${carId}/analysis/scatter?x=camber&y=wear&corner=front`],
      ['scatter clicks × time', `/api/cars/${carId}/analysis/scatter?x=damperClicks&y=time&corner=rear`],
      ['compare (camber arms)', `/api/cars/${carId}/analysis/compare?changeId=${armsId}`],
    ];
    console.log(`\nScrubline read-path bench — ${new Date().toISOString()}`);
    console.log(`machine: ${cpus().length} × ${cpus()[0]?.model ?? 'cpu'}, ${(totalmem() / 2 ** 30).toFixed(0)} GiB, Node ${process.version}`);
    console.log(`one car of the demo season, ${ROUNDS} sequential requests each after 5 warm-ups (ms)\n`);
    console.log(`${'endpoint'.padEnd(24)} ${'p50'.padStart(7)} ${'p95'.padStart(7)} ${'max'.padStart(7)}`);
    let worstP50 = 0;
    for (const [name, path] of paths) {
      for (let i = 0; i < 5; i++) await get(path);
      const times: number[] = [];
      for (let i = 0; i < ROUNDS; i++) {
        const t0 = performance.now();
        await get(path);
        times.push(performance.now() - t0);
      }
      times.sort((a, b) => a - b);
      const p50 = quantile(times, 0.5);
      worstP50 = Math.max(worstP50, p50);
      console.log(`${name.padEnd(24)} ${p50.toFixed(1).padStart(7)} ${quantile(times, 0.95).toFixed(1).padStart(7)} ${times.at(-1)!.toFixed(1).padStart(7)}`);
    }
    console.log(`\nTarget: one demo season answers in under 100 ms — ${worstP50 < 100 ? 'met' : 'MISSED'} (slowest p50 ${worstP50.toFixed(1)} ms).`);
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

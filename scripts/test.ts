// `npm test`: a throwaway PostgreSQL cluster, typecheck, lint, a client build, then
// every vitest project (unit, API, end-to-end in Debian's Chromium). Ends with one
// tally line, "N passed, N failed", and leaves nothing running.
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, chmodSync, readFileSync, rmSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createDatabase, startCluster, type Cluster } from './lib/pg-cluster';
import { ROOT, say } from './lib/env';

export const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

const bin = (name: string) => join(ROOT, 'node_modules', '.bin', name);
let passed = 0;
let failed = 0;

function step(name: string, cmd: string, args: string[], env: NodeJS.ProcessEnv = process.env): boolean {
  say(`${name}…`);
  const res = spawnSync(cmd, args, { cwd: ROOT, stdio: 'inherit', env });
  const ok = res.status === 0;
  if (ok) passed += 1;
  else failed += 1;
  say(`${name}: ${ok ? 'ok' : 'FAILED'}`);
  return ok;
}

function ensureChromium() {
  if (existsSync(CHROMIUM)) return;
  const isRoot = process.getuid?.() === 0;
  if (!isRoot) {
    say(`Chromium was not found at ${CHROMIUM}. Install it with: sudo apt-get install -y chromium`);
    return;
  }
  say('installing Chromium from Debian packages (apt-get install chromium)…');
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' };
  spawnSync('apt-get', ['update'], { stdio: 'inherit', env });
  spawnSync('apt-get', ['install', '-y', '--no-install-recommends', 'chromium'], { stdio: 'inherit', env });
}

interface VitestJson {
  numPassedTests: number;
  numFailedTests: number;
  numTotalTests: number;
  success: boolean;
}

async function main() {
  ensureChromium();
  const work = mkdtempSync(join(tmpdir(), 'scrubline-test-'));
  chmodSync(work, 0o755);
  let cluster: Cluster | undefined;
  const cleanup = () => {
    cluster?.stop();
    rmSync(work, { recursive: true, force: true });
  };
  process.on('SIGINT', () => {
    cleanup();
    process.exit(130);
  });

  try {
    const clusterDir = join(work, 'pg');
    cluster = await startCluster({ dir: clusterDir, port: 0, database: 'scrubline_api', log: say });
    const e2eUrl = createDatabase(clusterDir, 'scrubline_e2e');

    step('typecheck', bin('tsc'), ['--noEmit', '-p', '.']);
    step('lint', bin('eslint'), ['.', '--max-warnings=0']);
    const built = step('client build', bin('vite'), ['build', '--logLevel', 'warn']);

    const resultsDir = join(ROOT, 'test-results');
    mkdirSync(resultsDir, { recursive: true });
    const jsonFile = join(resultsDir, 'vitest.json');
    rmSync(jsonFile, { force: true });
    const projects = built ? [] : ['--project', 'unit', '--project', 'api'];
    say('vitest (unit, API and end-to-end)…');
    spawnSync(bin('vitest'), ['run', ...projects, '--reporter=default', '--reporter=json', `--outputFile.json=${jsonFile}`], {
      cwd: ROOT,
      stdio: 'inherit',
      env: { ...process.env, NODE_ENV: 'test', TEST_DATABASE_URL: cluster.url, E2E_DATABASE_URL: e2eUrl, CHROMIUM_PATH: CHROMIUM },
    });
    if (existsSync(jsonFile)) {
      const result = JSON.parse(readFileSync(jsonFile, 'utf8')) as VitestJson;
      passed += result.numPassedTests;
      failed += result.numFailedTests;
      // A suite that failed to load counts as a failure even with no failed test in it.
      if (!result.success && result.numFailedTests === 0) failed += 1;
    } else {
      failed += 1;
      say('vitest wrote no results: it crashed before finishing.');
    }
  } finally {
    cleanup();
  }
  console.log(`${passed} passed, ${failed} failed`);
  process.exit(failed === 0 ? 0 : 1);
}

main().catch((err: unknown) => {
  console.error(err);
  console.log(`${passed} passed, ${failed + 1} failed`);
  process.exit(1);
});

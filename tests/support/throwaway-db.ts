import { chmodSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { startCluster } from '../../scripts/lib/pg-cluster';
import { createDataSource } from '../../server/db/data-source';

/**
 * The database URL from the environment (npm test starts one cluster for all suites),
 * or a throwaway cluster of our own when vitest is run by hand.
 */
export async function databaseForTests(envVar: string, name: string) {
  const fromEnv = process.env[envVar];
  if (fromEnv) return { url: fromEnv, stop: async () => {} };
  const work = mkdtempSync(join(tmpdir(), `scrubline-${name}-`));
  chmodSync(work, 0o755);
  const cluster = await startCluster({ dir: join(work, 'pg'), port: 0, database: name, log: () => {} });
  return {
    url: cluster.url,
    stop: async () => {
      cluster.stop();
      rmSync(work, { recursive: true, force: true });
    },
  };
}

/** Applies every migration, as the server does at start-up. */
export async function migrate(url: string) {
  const ds = createDataSource(url, { poolSize: 2 });
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  await ds.destroy();
}

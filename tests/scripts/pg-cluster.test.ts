import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createServer } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { findPgBin, portIsFree, startCluster } from '../../scripts/lib/pg-cluster';

const dirs: string[] = [];
afterEach(() => {
  for (const d of dirs.splice(0)) rmSync(d, { recursive: true, force: true });
});

describe('the private PostgreSQL cluster', () => {
  it('when the data folder was made by another PostgreSQL version, then start-up stops with a message naming both', async () => {
    const installed = findPgBin()?.split('/').at(-2);
    expect(installed).toBeDefined();
    const dir = mkdtempSync(join(tmpdir(), 'scrubline-oldpg-'));
    dirs.push(dir);
    mkdirSync(join(dir, 'data'), { recursive: true });
    writeFileSync(join(dir, 'data', 'PG_VERSION'), '9.6\n');
    writeFileSync(join(dir, 'cluster.json'), JSON.stringify({ port: 1, user: 'x', password: 'y', database: 'z' }));
    await expect(startCluster({ dir, port: 0, database: 'z', log: () => {} })).rejects.toThrow(
      new RegExp(`made by PostgreSQL 9\\.6, but this machine has PostgreSQL ${installed}`),
    );
  });

  it('when a port is taken, then portIsFree says so', async () => {
    const srv = createServer();
    await new Promise<void>((r) => srv.listen(0, '127.0.0.1', () => r()));
    const port = (srv.address() as { port: number }).port;
    expect(await portIsFree(port)).toBe(false);
    await new Promise<void>((r) => srv.close(() => r()));
    expect(await portIsFree(port)).toBe(true);
  });
});

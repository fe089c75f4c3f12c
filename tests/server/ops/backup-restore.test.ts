import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import pg from 'pg';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { backupDatabase, backupFileName, restoreDatabase } from '../../../scripts/lib/backup';
import { seededDatabaseUrl } from '../support-seeded';

/** Row counts of the tables a season lives in, and the newest migration: what a restore must bring back. */
async function census(url: string) {
  const c = new pg.Client({ connectionString: url });
  await c.connect();
  try {
    const counts: Record<string, number> = {};
    for (const table of ['users', 'cars', 'events', 'runs', 'setup_snapshots', 'setup_corners', 'tread_readings', 'work_orders', 'comments']) {
      counts[table] = Number((await c.query(`SELECT count(*) AS n FROM ${table}`)).rows[0].n);
    }
    const { rows } = await c.query('SELECT name FROM migrations ORDER BY id DESC LIMIT 1');
    const sum = await c.query("SELECT md5(string_agg(id::text || raw_time_sec::text || cones::text || status, ',' ORDER BY id)) AS h FROM runs");
    return { counts, newestMigration: rows[0]?.name as string, runsDigest: sum.rows[0].h as string };
  } finally {
    await c.end();
  }
}

describe('npm run db:backup and db:restore (pg_dump and pg_restore)', () => {
  let source: Awaited<ReturnType<typeof seededDatabaseUrl>>;
  let target: Awaited<ReturnType<typeof seededDatabaseUrl>>;
  const dir = mkdtempSync(join(tmpdir(), 'scrubline-backup-'));

  beforeAll(async () => {
    source = await seededDatabaseUrl();
    target = await seededDatabaseUrl();
  }, 120_000);

  afterAll(async () => {
    await source?.drop();
    await target?.drop();
    rmSync(dir, { recursive: true, force: true });
  });

  it('when the demo season is backed up, damaged and restored, then every table and run is as it was before the damage', async () => {
    const before = await census(source.url);
    expect(before.counts.runs).toBeGreaterThan(100);
    const file = backupFileName(dir, new Date('2026-12-02T05:40:00.123Z'));
    expect(file).toBe(join(dir, 'scrubline-2026-12-02T05-40-00Z.dump'));
    expect(backupDatabase(source.url, file)).toBeGreaterThan(1000);

    // The damage: runs gone, a car that was not there.
    const c = new pg.Client({ connectionString: source.url });
    await c.connect();
    await c.query('DELETE FROM runs');
    await c.query("INSERT INTO cars (id, owner_id, name, class_code) SELECT gen_random_uuid(), id, 'After the backup', 'SS' FROM users LIMIT 1");
    await c.end();
    expect((await census(source.url)).counts.runs).toBe(0);

    restoreDatabase(source.url, file);
    expect(await census(source.url)).toEqual(before);
  });

  it('when a backup is restored into another database (a new server), then it holds the same season', async () => {
    const file = join(dir, 'moved.dump');
    backupDatabase(source.url, file);
    restoreDatabase(target.url, file);
    expect(await census(target.url)).toEqual(await census(source.url));
  });

  it('when the file is not a backup, then the restore fails and the database is left as it was', async () => {
    const before = await census(target.url);
    expect(() => restoreDatabase(target.url, join(dir, 'missing.dump'))).toThrow(/No backup at/);
    const bogus = join(dir, 'bogus.dump');
    (await import('node:fs')).writeFileSync(bogus, 'not a dump at all');
    expect(() => restoreDatabase(target.url, bogus)).toThrow(/pg_restore failed/);
    expect(await census(target.url)).toEqual(before);
  });
});

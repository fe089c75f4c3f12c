import { randomUUID } from 'node:crypto';
import pg from 'pg';
import { inject } from 'vitest';
import { createDataSource } from '../../server/db/data-source';
import { seedDemoIfEmpty } from '../../server/db/seed';

/** A fresh database on the test cluster holding the demo season; drop() removes it. */
export function seededDatabaseUrl() {
  return migratedDatabaseUrl({ seed: true });
}

/** A fresh, migrated database on the test cluster, empty unless `seed` asks for the demo season; drop() removes it. */
export async function migratedDatabaseUrl({ seed = false }: { seed?: boolean } = {}) {
  const base = new URL(inject('databaseUrl'));
  const name = `${seed ? 'seed' : 'empty'}_${randomUUID().replace(/-/g, '').slice(0, 12)}`;
  const admin = new pg.Client({ connectionString: base.toString() });
  await admin.connect();
  await admin.query(`CREATE DATABASE ${name}`);
  await admin.end();
  const url = new URL(base.toString());
  url.pathname = `/${name}`;
  const ds = createDataSource(url.toString(), { poolSize: 2 });
  await ds.initialize();
  await ds.runMigrations({ transaction: 'each' });
  if (seed) await seedDemoIfEmpty(ds);
  await ds.destroy();
  return {
    url: url.toString(),
    async drop() {
      const c = new pg.Client({ connectionString: base.toString() });
      await c.connect();
      await c.query(`DROP DATABASE IF EXISTS ${name} WITH (FORCE)`);
      await c.end();
    },
  };
}

import { createHash } from 'node:crypto';
import type pg from 'pg';
import { DataSource, type EntityManager } from 'typeorm';
import type { PostgresDriver } from 'typeorm/driver/postgres/PostgresDriver.js';
import type { PostgresQueryRunner } from 'typeorm/driver/postgres/PostgresQueryRunner.js';

/**
 * Runs `text` as a named prepared statement. PostgreSQL then parses it once per connection and,
 * after five executions, may keep a generic plan instead of planning every call
 * (https://www.postgresql.org/docs/15/sql-prepare.html, "Notes"); node-postgres prepares a named
 * query on first use on each connection (https://node-postgres.com/features/queries#prepared-statements).
 * For the statements every run logged at the track goes through, planning cost more than running:
 * reading a run back with its setup and the day's scoring planned in about 3 ms and ran in 0.5 ms.
 * Use it only for fixed statement texts: each distinct text is kept by every connection.
 */
const names = new Map<string, string>();
const nameOf = (text: string) => {
  let name = names.get(text);
  if (!name) names.set(text, (name = `s_${createHash('sha1').update(text).digest('hex').slice(0, 20)}`));
  return name;
};

export async function queryPrepared<T>(db: DataSource | EntityManager, text: string, values: unknown[]): Promise<T[]> {
  const name = nameOf(text);
  if (db instanceof DataSource) {
    const pool = (db.driver as PostgresDriver).master as pg.Pool;
    return (await pool.query<T & pg.QueryResultRow>({ name, text, values })).rows;
  }
  // Inside a transaction: the transaction's own connection.
  const runner = db.queryRunner as PostgresQueryRunner | undefined;
  if (!runner) return db.query(text, values) as Promise<T[]>;
  const client = (await runner.connect()) as pg.PoolClient;
  return (await client.query<T & pg.QueryResultRow>({ name, text, values })).rows;
}

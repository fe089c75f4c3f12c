import { randomUUID } from 'node:crypto';
import type pg from 'pg';
import { afterAll, beforeAll, describe, expect, inject, it, vi } from 'vitest';
import type { DataSource } from 'typeorm';
import type { PostgresDriver } from 'typeorm/driver/postgres/PostgresDriver.js';
import { createDataSource } from '../../../server/db/data-source';
import { queryPrepared } from '../../../server/db/prepared';

let ds: DataSource;
beforeAll(async () => {
  ds = createDataSource(inject('databaseUrl'), { poolSize: 2 });
  await ds.initialize();
});
afterAll(async () => {
  await ds?.destroy();
});

describe('prepared statements', () => {
  it('when the same text runs twice, then it goes to PostgreSQL under one statement name, a different text under another, and the rows are what a plain query returns', async () => {
    const pool = (ds.driver as PostgresDriver).master as pg.Pool;
    const sent = vi.spyOn(pool, 'query');
    const text = 'SELECT $1::int + 1 AS n';
    expect(await queryPrepared<{ n: number }>(ds, text, [1])).toEqual(await ds.query(text, [1]));
    await queryPrepared(ds, text, [41]);
    await queryPrepared(ds, 'SELECT $1::int * 2 AS n', [2]);
    const names = sent.mock.calls.map(([config]) => (config as { name?: string }).name).filter(Boolean);
    vi.restoreAllMocks();
    expect(names).toHaveLength(3);
    expect(names[0]).toBe(names[1]);
    expect(names[2]).not.toBe(names[0]);
  });

  it('when it runs inside a transaction that then fails, then what it wrote is rolled back with the rest', async () => {
    const id = randomUUID();
    const table = `probe_${id.slice(0, 8)}`;
    await ds.query(`CREATE TABLE ${table} (id uuid PRIMARY KEY)`);
    try {
      await expect(
        ds.transaction(async (m) => {
          await queryPrepared(m, `INSERT INTO ${table} (id) VALUES ($1) RETURNING id`, [id]);
          // Seen inside the transaction: the same connection.
          expect(await m.query(`SELECT count(*)::int AS n FROM ${table}`)).toEqual([{ n: 1 }]);
          throw new Error('fails after the write');
        }),
      ).rejects.toThrow('fails after the write');
      expect(await ds.query(`SELECT count(*)::int AS n FROM ${table}`)).toEqual([{ n: 0 }]);
    } finally {
      await ds.query(`DROP TABLE ${table}`);
    }
  });
});

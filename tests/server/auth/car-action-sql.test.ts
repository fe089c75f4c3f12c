import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { createDataSource } from '../../../server/db/data-source';
import { carActionAllowedSql, type CarAction, type CarRelation } from '../../../server/auth/access';
import { ACCESS_MATRIX, allows } from '../../../server/auth/access-matrix';

let ds: DataSource;
beforeAll(async () => {
  ds = createDataSource(inject('databaseUrl'), { poolSize: 1 });
  await ds.initialize();
});
afterAll(async () => {
  await ds?.destroy();
});

const RELATIONS: CarRelation[] = ['owner', 'co_driver', 'shop_staff'];
// Every mix of the three relations one person can hold to a car, none included.
const MIXES = Array.from({ length: 8 }, (_, bits) => RELATIONS.map((_, i) => Boolean(bits & (1 << i))));

describe('carActionAllowedSql', () => {
  it.each(Object.keys(ACCESS_MATRIX.car) as CarAction[])(
    'when PostgreSQL evaluates the condition for "%s" over every mix of relations, then it allows exactly what the access table allows',
    async (action) => {
      const sql = `SELECT ${carActionAllowedSql('f', action)} AS ok FROM (VALUES ($1::boolean, $2::boolean, $3::boolean)) AS f (owner, co_driver, shop_staff)`;
      for (const mix of MIXES) {
        const [row] = await ds.query(sql, mix);
        const expected = RELATIONS.some((r, i) => mix[i] && allows('car', action, r));
        expect(row.ok, `${action} with ${RELATIONS.filter((_, i) => mix[i]).join('+') || 'no relation'}`).toBe(expected);
      }
    },
  );
});

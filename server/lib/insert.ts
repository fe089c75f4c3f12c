import type { EntityManager, EntityTarget, ObjectLiteral } from 'typeorm';

/**
 * INSERT … ON CONFLICT DO NOTHING for records whose id is made on the device.
 * Resolves true when this call inserted the row; false when the row (or another
 * unique value) was already there. When two requests race, PostgreSQL makes the
 * second wait for the first to commit, so the caller can then read the winner's row.
 */
export async function insertUnlessPresent<T extends ObjectLiteral>(
  m: EntityManager,
  target: EntityTarget<T>,
  values: Partial<T>,
): Promise<{ inserted: boolean; id: string | null }> {
  const result = await m
    .createQueryBuilder()
    .insert()
    .into(target)
    .values(values as never)
    .orIgnore()
    .returning('id')
    .execute();
  const row = (result.raw as { id: string }[])[0];
  return { inserted: !!row, id: row?.id ?? null };
}

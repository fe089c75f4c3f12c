import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Which tyre set each run was made on: the car's set fitted last before the run (its latest mounting not after
 * the run, as the car page shows "On the car"), computed at read time like `runs_with_setup`, so a backdated or
 * added rotation never leaves a stale tie. Null before any set of the car was fitted. The index serves the
 * lookup of a car's mountings by time.
 */
export class RunsOnTyreSets1765756800000 implements MigrationInterface {
  name = 'RunsOnTyreSets1765756800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE VIEW runs_with_tyre_set AS
      SELECT r.id AS run_id, r.car_id, r.recorded_at, t.tyre_set_id
        FROM runs r
        LEFT JOIN LATERAL (
          SELECT m.tyre_set_id FROM tyre_mountings m JOIN tyre_sets s ON s.id = m.tyre_set_id
           WHERE s.car_id = r.car_id AND m.mounted_at <= r.recorded_at
           ORDER BY m.mounted_at DESC, m.created_at DESC, m.id DESC
           LIMIT 1
        ) t ON true`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP VIEW IF EXISTS runs_with_tyre_set`);
  }
}

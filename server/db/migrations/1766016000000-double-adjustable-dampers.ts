import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A car may say its dampers are double-adjustable: each axle's adjuster may have a separate rebound adjuster with
 * its own number of clicks and its own end click 0 counts from. Cars stored before have none (null), as before. A
 * rebound adjuster is whole (both its values or neither) and only beside the axle's other adjuster.
 */
export class DoubleAdjustableDampers1766016000000 implements MigrationInterface {
  name = 'DoubleAdjustableDampers1766016000000';

  async up(q: QueryRunner): Promise<void> {
    for (const axle of ['front', 'rear']) {
      await q.query(`
        ALTER TABLE cars
          ADD COLUMN ${axle}_damper_rebound_positions integer CHECK (${axle}_damper_rebound_positions BETWEEN 1 AND 100),
          ADD COLUMN ${axle}_damper_rebound_count_from text CHECK (${axle}_damper_rebound_count_from IN ('full_stiff', 'full_soft')),
          ADD CONSTRAINT cars_${axle}_damper_rebound_check CHECK (
            (${axle}_damper_rebound_positions IS NULL) = (${axle}_damper_rebound_count_from IS NULL)
            AND (${axle}_damper_rebound_positions IS NULL OR ${axle}_damper_positions IS NOT NULL)
          )`);
    }
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE cars
        DROP COLUMN front_damper_rebound_positions, DROP COLUMN front_damper_rebound_count_from,
        DROP COLUMN rear_damper_rebound_positions, DROP COLUMN rear_damper_rebound_count_from`);
  }
}

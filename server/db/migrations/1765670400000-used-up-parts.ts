import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A work order's part line says whether the part stays on the car or is used up in the work (brake fluid, shop
 * supplies, balancing weights): only parts that stay go into the car's change log when the visit closes. Lines
 * written before this were all treated as fitted, so they stay fitted. Labour is never used up.
 */
export class UsedUpParts1765670400000 implements MigrationInterface {
  name = 'UsedUpParts1765670400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE work_order_lines
        ADD COLUMN used_up boolean NOT NULL DEFAULT false,
        ADD CONSTRAINT work_order_lines_used_up_part_check CHECK (kind = 'part' OR NOT used_up)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE work_order_lines DROP CONSTRAINT work_order_lines_used_up_part_check, DROP COLUMN used_up`);
  }
}

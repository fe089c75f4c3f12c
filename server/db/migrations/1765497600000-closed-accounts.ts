import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A person may close their own account (server/auth/close-account.ts). The row stays, so that runs driven on
 * other people's cars and the records a shop keeps still name someone, but it no longer holds anything that
 * says who: `closed_at` marks it, and the address, name and password are replaced.
 */
export class ClosedAccounts1765497600000 implements MigrationInterface {
  name = 'ClosedAccounts1765497600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users ADD COLUMN closed_at timestamptz`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users DROP COLUMN closed_at`);
  }
}

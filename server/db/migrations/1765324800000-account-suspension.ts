import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * An admin can suspend an account: while `suspended_at` is set it cannot sign in, and its sessions are
 * gone (server/features/admin/admin.service.ts). The note says why, for the next admin.
 */
export class AccountSuspension1765324800000 implements MigrationInterface {
  name = 'AccountSuspension1765324800000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      ALTER TABLE users
        ADD COLUMN suspended_at timestamptz,
        ADD COLUMN suspended_by uuid REFERENCES users (id) ON DELETE SET NULL,
        ADD COLUMN suspension_note text CHECK (char_length(suspension_note) <= 500),
        ADD CONSTRAINT users_suspension_consistent CHECK ((suspended_at IS NULL) = (suspension_note IS NULL))`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users DROP COLUMN suspended_at, DROP COLUMN suspended_by, DROP COLUMN suspension_note`);
  }
}

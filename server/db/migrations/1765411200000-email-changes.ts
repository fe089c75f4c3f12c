import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A change of sign-in address waits here until the link sent to the new address is opened by the same
 * account, signed in (server/auth/email-change.ts). Only the SHA-256 of the link's secret is kept, as for
 * password resets.
 */
export class EmailChanges1765411200000 implements MigrationInterface {
  name = 'EmailChanges1765411200000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE email_changes (
        token_hash text PRIMARY KEY,
        user_id uuid NOT NULL REFERENCES users (id) ON DELETE CASCADE,
        new_email text NOT NULL CHECK (char_length(new_email) <= 254),
        created_at timestamptz NOT NULL DEFAULT now(),
        expires_at timestamptz NOT NULL,
        used_at timestamptz
      )`);
    await q.query(`CREATE INDEX email_changes_user_idx ON email_changes (user_id)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE email_changes`);
  }
}

import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Sessions found by their account: the signed-in devices list, signing other devices out, and the
 * end of every session when a password changes or is reset (`SESSION_USER_SQL` in
 * server/auth/password.ts, whose expression this index must repeat exactly). Without it each of those
 * reads the whole `session` table. Partial: a session not yet signed in names no account.
 */
export class SessionAccountIndex1765238400000 implements MigrationInterface {
  name = 'SessionAccountIndex1765238400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE INDEX session_account_idx ON session ((sess #>> '{passport,user}'))
       WHERE (sess #>> '{passport,user}') IS NOT NULL`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP INDEX session_account_idx`);
  }
}

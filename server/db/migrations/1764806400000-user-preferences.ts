import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Each user's display preferences (units per quantity), kept with the account so every device shows the same. */
export class UserPreferences1764806400000 implements MigrationInterface {
  name = 'UserPreferences1764806400000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users ADD COLUMN preferences jsonb NOT NULL DEFAULT '{}'::jsonb`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users DROP COLUMN preferences`);
  }
}

import type { MigrationInterface, QueryRunner } from 'typeorm';

/** Accounts, shops and teams, sessions, and sign-in rate-limit counters. */
export class Foundation1764633600000 implements MigrationInterface {
  name = 'Foundation1764633600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE users (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        email text NOT NULL,
        display_name text NOT NULL,
        password_hash text NOT NULL,
        is_admin boolean NOT NULL DEFAULT false,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT users_email_key UNIQUE (email),
        CONSTRAINT users_email_lower CHECK (email = lower(email))
      )`);
    await q.query(`
      CREATE TABLE shops (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE shop_members (
        shop_id uuid NOT NULL REFERENCES shops(id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        is_shop_admin boolean NOT NULL DEFAULT false,
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (shop_id, user_id)
      )`);
    await q.query(`CREATE INDEX shop_members_user_idx ON shop_members (user_id)`);
    await q.query(`
      CREATE TABLE teams (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        name text NOT NULL,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`
      CREATE TABLE team_members (
        team_id uuid NOT NULL REFERENCES teams(id) ON DELETE CASCADE,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        is_captain boolean NOT NULL DEFAULT false,
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (team_id, user_id)
      )`);
    await q.query(`CREATE INDEX team_members_user_idx ON team_members (user_id)`);
    // The session store's table, as connect-pg-simple documents it (table.sql).
    await q.query(`
      CREATE TABLE session (
        sid varchar NOT NULL PRIMARY KEY,
        sess json NOT NULL,
        expire timestamp(6) NOT NULL
      )`);
    await q.query(`CREATE INDEX session_expire_idx ON session (expire)`);
    // Counters for sign-in and registration limits, in rate-limiter-flexible's layout.
    await q.query(`
      CREATE TABLE auth_rate_limits (
        key varchar(255) PRIMARY KEY,
        points integer NOT NULL DEFAULT 0,
        expire bigint
      )`);
  }

  async down(q: QueryRunner): Promise<void> {
    for (const table of ['auth_rate_limits', 'session', 'team_members', 'teams', 'shop_members', 'shops', 'users']) {
      await q.query(`DROP TABLE IF EXISTS ${table}`);
    }
  }
}

import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * People around the car: shop grants, comment threads, setup suggestions, in-app
 * notifications, team entries with class index factors, invitations, password resets
 * and the e-mail opt-out.
 */
export class Collaboration1764892800000 implements MigrationInterface {
  name = 'Collaboration1764892800000';

  async up(q: QueryRunner): Promise<void> {
    // A driver lets a shop see a car's season, comment and suggest; revoking deletes the row.
    await q.query(`
      CREATE TABLE shop_grants (
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        shop_id uuid NOT NULL REFERENCES shops(id) ON DELETE CASCADE,
        granted_by uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        created_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (car_id, shop_id)
      )`);
    await q.query(`CREATE INDEX shop_grants_shop_idx ON shop_grants (shop_id)`);

    // A shop's proposed change to a snapshot, as a list of per-corner deltas or values.
    await q.query(`
      CREATE TABLE setup_suggestions (
        id uuid PRIMARY KEY,
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        base_setup_id uuid NOT NULL REFERENCES setup_snapshots(id) ON DELETE CASCADE,
        shop_id uuid NOT NULL REFERENCES shops(id) ON DELETE CASCADE,
        author_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        title text NOT NULL,
        rationale text NOT NULL,
        changes jsonb NOT NULL,
        status text NOT NULL DEFAULT 'open' CHECK (status IN ('open', 'accepted', 'declined', 'withdrawn')),
        decided_by uuid REFERENCES users(id) ON DELETE SET NULL,
        decided_at timestamptz,
        decision_note text,
        accepted_setup_id uuid REFERENCES setup_snapshots(id) ON DELETE SET NULL,
        version integer NOT NULL DEFAULT 1,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX setup_suggestions_car_idx ON setup_suggestions (car_id, created_at DESC)`);
    await q.query(`ALTER TABLE setup_snapshots ADD COLUMN suggestion_id uuid REFERENCES setup_suggestions(id) ON DELETE SET NULL`);
    await q.query(`CREATE UNIQUE INDEX setup_snapshots_suggestion_key ON setup_snapshots (suggestion_id) WHERE suggestion_id IS NOT NULL`);

    // One thread per run, per (event, car), per setup snapshot and per tread reading.
    // Each target is a real foreign key, so a deleted record takes its thread with it.
    await q.query(`
      CREATE TABLE comments (
        id uuid PRIMARY KEY,
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        run_id uuid REFERENCES runs(id) ON DELETE CASCADE,
        event_id uuid REFERENCES events(id) ON DELETE CASCADE,
        setup_id uuid REFERENCES setup_snapshots(id) ON DELETE CASCADE,
        tread_reading_id uuid REFERENCES tread_readings(id) ON DELETE CASCADE,
        author_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        shop_id uuid REFERENCES shops(id) ON DELETE SET NULL,
        body text NOT NULL CHECK (length(body) BETWEEN 1 AND 4000),
        version integer NOT NULL DEFAULT 1,
        edited_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT comments_one_target CHECK (num_nonnulls(run_id, event_id, setup_id, tread_reading_id) = 1)
      )`);
    await q.query(`CREATE INDEX comments_run_idx ON comments (run_id, created_at) WHERE run_id IS NOT NULL`);
    await q.query(`CREATE INDEX comments_event_idx ON comments (event_id, car_id, created_at) WHERE event_id IS NOT NULL`);
    await q.query(`CREATE INDEX comments_setup_idx ON comments (setup_id, created_at) WHERE setup_id IS NOT NULL`);
    await q.query(`CREATE INDEX comments_tread_idx ON comments (tread_reading_id, created_at) WHERE tread_reading_id IS NOT NULL`);
    await q.query(`CREATE INDEX comments_car_idx ON comments (car_id, created_at DESC)`);

    await q.query(`
      CREATE TABLE notifications (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        kind text NOT NULL CHECK (kind IN ('comment', 'suggestion', 'suggestion_decided', 'shop_grant')),
        car_id uuid REFERENCES cars(id) ON DELETE CASCADE,
        comment_id uuid REFERENCES comments(id) ON DELETE CASCADE,
        suggestion_id uuid REFERENCES setup_suggestions(id) ON DELETE CASCADE,
        actor_id uuid REFERENCES users(id) ON DELETE SET NULL,
        summary text NOT NULL,
        link text NOT NULL,
        read_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX notifications_user_idx ON notifications (user_id, created_at DESC)`);
    await q.query(`CREATE INDEX notifications_unread_idx ON notifications (user_id) WHERE read_at IS NULL`);

    // A member's car entered in the team, in a class, with what the member shares.
    await q.query(`
      CREATE TABLE team_entries (
        team_id uuid NOT NULL REFERENCES teams(id) ON DELETE CASCADE,
        car_id uuid NOT NULL REFERENCES cars(id) ON DELETE CASCADE,
        class_code text NOT NULL CHECK (length(class_code) BETWEEN 1 AND 20),
        sharing text NOT NULL DEFAULT 'results' CHECK (sharing IN ('results', 'results_and_setup')),
        entered_by uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        created_at timestamptz NOT NULL DEFAULT now(),
        updated_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (team_id, car_id)
      )`);
    await q.query(`CREATE INDEX team_entries_car_idx ON team_entries (car_id)`);
    // Index factors are the captain's to enter, per class and season; none ship with the app.
    await q.query(`
      CREATE TABLE team_class_factors (
        team_id uuid NOT NULL REFERENCES teams(id) ON DELETE CASCADE,
        season integer NOT NULL CHECK (season BETWEEN 1950 AND 2200),
        class_code text NOT NULL CHECK (length(class_code) BETWEEN 1 AND 20),
        factor double precision NOT NULL CHECK (factor > 0 AND factor <= 2),
        updated_by uuid REFERENCES users(id) ON DELETE SET NULL,
        updated_at timestamptz NOT NULL DEFAULT now(),
        PRIMARY KEY (team_id, season, class_code)
      )`);

    // Tokens are stored only as SHA-256 hashes; the link in the e-mail carries the token itself.
    await q.query(`
      CREATE TABLE invitations (
        id uuid PRIMARY KEY DEFAULT gen_random_uuid(),
        token_hash text NOT NULL UNIQUE,
        shop_id uuid REFERENCES shops(id) ON DELETE CASCADE,
        team_id uuid REFERENCES teams(id) ON DELETE CASCADE,
        email text NOT NULL CHECK (email = lower(email)),
        as_admin boolean NOT NULL DEFAULT false,
        invited_by uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        used_by uuid REFERENCES users(id) ON DELETE SET NULL,
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT invitations_one_target CHECK (num_nonnulls(shop_id, team_id) = 1)
      )`);
    await q.query(`
      CREATE TABLE password_resets (
        token_hash text PRIMARY KEY,
        user_id uuid NOT NULL REFERENCES users(id) ON DELETE CASCADE,
        expires_at timestamptz NOT NULL,
        used_at timestamptz,
        created_at timestamptz NOT NULL DEFAULT now()
      )`);
    await q.query(`CREATE INDEX password_resets_user_idx ON password_resets (user_id)`);

    // Notification e-mails can be switched off from the link in each one.
    await q.query(`ALTER TABLE users ADD COLUMN email_notifications boolean NOT NULL DEFAULT true`);
    await q.query(`ALTER TABLE users ADD COLUMN unsubscribe_token uuid NOT NULL DEFAULT gen_random_uuid()`);
    await q.query(`CREATE UNIQUE INDEX users_unsubscribe_token_key ON users (unsubscribe_token)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`ALTER TABLE users DROP COLUMN unsubscribe_token, DROP COLUMN email_notifications`);
    await q.query(`ALTER TABLE setup_snapshots DROP COLUMN suggestion_id`);
    for (const table of ['password_resets', 'invitations', 'team_class_factors', 'team_entries', 'notifications', 'comments', 'setup_suggestions', 'shop_grants']) {
      await q.query(`DROP TABLE IF EXISTS ${table}`);
    }
  }
}

import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * Files attached to a tread reading, a run, a setup snapshot or an event. The bytes live in
 * the file storage (disk or S3) under server-made keys; this table says what they are, whose
 * record they hang on, and who sent them. Each target is a real foreign key, so deleting the
 * record deletes these rows with it (the stored objects stay until a sweep; see docs/uploads.md).
 */
export class Attachments1765065600000 implements MigrationInterface {
  name = 'Attachments1765065600000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE attachments (
        id uuid PRIMARY KEY,
        car_id uuid REFERENCES cars(id) ON DELETE CASCADE,
        tread_reading_id uuid REFERENCES tread_readings(id) ON DELETE CASCADE,
        run_id uuid REFERENCES runs(id) ON DELETE CASCADE,
        setup_id uuid REFERENCES setup_snapshots(id) ON DELETE CASCADE,
        event_id uuid REFERENCES events(id) ON DELETE CASCADE,
        storage_key text NOT NULL UNIQUE,
        thumbnail_key text UNIQUE,
        file_name text NOT NULL CHECK (length(file_name) BETWEEN 1 AND 255),
        content_type text NOT NULL CHECK (content_type IN ('image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif', 'application/pdf')),
        size_bytes integer NOT NULL CHECK (size_bytes > 0),
        width integer CHECK (width > 0),
        height integer CHECK (height > 0),
        uploaded_by uuid NOT NULL REFERENCES users(id),
        created_at timestamptz NOT NULL DEFAULT now(),
        CONSTRAINT attachments_one_target CHECK (num_nonnulls(tread_reading_id, run_id, setup_id, event_id) = 1),
        -- Everything but an event belongs to a car.
        CONSTRAINT attachments_car_matches_target CHECK ((event_id IS NULL) = (car_id IS NOT NULL))
      )`);
    await q.query(`CREATE INDEX attachments_tread_idx ON attachments (tread_reading_id, created_at) WHERE tread_reading_id IS NOT NULL`);
    await q.query(`CREATE INDEX attachments_run_idx ON attachments (run_id, created_at) WHERE run_id IS NOT NULL`);
    await q.query(`CREATE INDEX attachments_setup_idx ON attachments (setup_id, created_at) WHERE setup_id IS NOT NULL`);
    await q.query(`CREATE INDEX attachments_event_idx ON attachments (event_id, created_at) WHERE event_id IS NOT NULL`);
    await q.query(`CREATE INDEX attachments_car_idx ON attachments (car_id) WHERE car_id IS NOT NULL`);
    await q.query(`CREATE INDEX attachments_uploaded_by_idx ON attachments (uploaded_by)`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TABLE IF EXISTS attachments`);
  }
}

import type { MigrationInterface, QueryRunner } from 'typeorm';

/**
 * A queue of stored objects to remove. Deleting a record (a run, a setup snapshot, a tread
 * reading, an event or a whole car) deletes its attachment rows by `ON DELETE CASCADE`; a trigger
 * on `attachments` writes each deleted row's storage keys here in the same transaction, so a
 * delete that rolls back queues nothing, and one that commits can never lose its keys. The
 * server's sweep (`server/files/file-sweep.ts`) removes the objects and then the queue rows.
 */
export class StoredFileRemovals1765152000000 implements MigrationInterface {
  name = 'StoredFileRemovals1765152000000';

  async up(q: QueryRunner): Promise<void> {
    await q.query(`
      CREATE TABLE stored_file_removals (
        storage_key text PRIMARY KEY,
        queued_at timestamptz NOT NULL DEFAULT now(),
        -- A failed removal is tried again from this time on, later after each failure.
        not_before timestamptz NOT NULL DEFAULT now(),
        attempts integer NOT NULL DEFAULT 0 CHECK (attempts >= 0),
        last_error text
      )`);
    await q.query(`CREATE INDEX stored_file_removals_due_idx ON stored_file_removals (not_before)`);
    // Statement level with a transition table: deleting a car with hundreds of files is one INSERT.
    await q.query(`
      CREATE FUNCTION queue_stored_file_removals() RETURNS trigger LANGUAGE plpgsql AS $$
      BEGIN
        INSERT INTO stored_file_removals (storage_key)
        SELECT storage_key FROM gone
        UNION ALL
        SELECT thumbnail_key FROM gone WHERE thumbnail_key IS NOT NULL
        ON CONFLICT (storage_key) DO NOTHING;
        RETURN NULL;
      END
      $$`);
    await q.query(`
      CREATE TRIGGER attachments_queue_removals
      AFTER DELETE ON attachments
      REFERENCING OLD TABLE AS gone
      FOR EACH STATEMENT EXECUTE FUNCTION queue_stored_file_removals()`);
  }

  async down(q: QueryRunner): Promise<void> {
    await q.query(`DROP TRIGGER IF EXISTS attachments_queue_removals ON attachments`);
    await q.query(`DROP FUNCTION IF EXISTS queue_stored_file_removals()`);
    await q.query(`DROP TABLE IF EXISTS stored_file_removals`);
  }
}

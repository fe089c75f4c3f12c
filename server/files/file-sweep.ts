import type { DataSource } from 'typeorm';
import { logger } from '../lib/logger';
import type { FileStorage } from './storage';

/*
 * Removes the stored objects of deleted attachments. The database queues their keys
 * (`stored_file_removals`, written by a trigger in the deleting transaction); this takes a batch,
 * removes each object, and drops the keys it removed. Keys are claimed with FOR UPDATE SKIP LOCKED,
 * so app instances sweeping at the same time never take the same key. A removal that fails stays
 * queued and is tried again later, one minute after the first failure, doubling to an hour at most.
 */

export interface SweepResult {
  /** Objects removed (or already gone) and dropped from the queue. */
  removed: number;
  /** Objects whose removal failed this time; still queued. */
  failed: number;
}

export interface SweepOptions {
  /** Keys taken in one transaction. */
  batchSize?: number;
  /** Only these keys (the ones a request has just queued), due or not. */
  keys?: string[];
}

/** Queues the keys for the sweep; answers how many were not queued already. */
export async function queueForRemoval(ds: DataSource, keys: string[]): Promise<number> {
  if (keys.length === 0) return 0;
  const rows: unknown[] = await ds.query(
    'INSERT INTO stored_file_removals (storage_key) SELECT unnest($1::text[]) ON CONFLICT (storage_key) DO NOTHING RETURNING storage_key',
    [keys],
  );
  return rows.length;
}

/** One batch: at most `batchSize` due keys. */
export async function sweepStoredFiles(ds: DataSource, storage: FileStorage, { batchSize = 100, keys }: SweepOptions = {}): Promise<SweepResult> {
  return ds.transaction(async (m) => {
    const claimed: { storage_key: string; attempts: number }[] = keys
      ? await m.query(
          `SELECT storage_key, attempts FROM stored_file_removals WHERE storage_key = ANY($1::text[])
           ORDER BY storage_key FOR UPDATE SKIP LOCKED`,
          [keys],
        )
      : await m.query(
          `SELECT storage_key, attempts FROM stored_file_removals WHERE not_before <= now()
           ORDER BY not_before, storage_key LIMIT $1 FOR UPDATE SKIP LOCKED`,
          [batchSize],
        );
    const removed: string[] = [];
    let failed = 0;
    for (const { storage_key: key, attempts } of claimed) {
      try {
        await storage.delete(key);
        removed.push(key);
      } catch (err) {
        failed += 1;
        logger.warn({ err, key }, 'could not remove a stored file; it stays queued');
        await m.query(
          `UPDATE stored_file_removals
           SET attempts = attempts + 1, last_error = $2, not_before = now() + make_interval(mins => $3)
           WHERE storage_key = $1`,
          [key, err instanceof Error ? err.message.slice(0, 500) : String(err).slice(0, 500), Math.min(2 ** attempts, 60)],
        );
      }
    }
    if (removed.length > 0) await m.query('DELETE FROM stored_file_removals WHERE storage_key = ANY($1::text[])', [removed]);
    return { removed: removed.length, failed };
  });
}

/** Every due key, batch after batch, until a batch comes back short. */
export async function sweepAllStoredFiles(ds: DataSource, storage: FileStorage, batchSize = 100): Promise<SweepResult> {
  const total: SweepResult = { removed: 0, failed: 0 };
  for (;;) {
    const batch = await sweepStoredFiles(ds, storage, { batchSize });
    total.removed += batch.removed;
    total.failed += batch.failed;
    if (batch.removed + batch.failed < batchSize) return total;
  }
}

export interface FileSweeper {
  /** Sweeps as soon as the current sweep (if any) is over. */
  soon(): void;
  /** Stops the timer and waits for a sweep in progress. */
  stop(): Promise<void>;
}

/**
 * Sweeps every `intervalMs` (the timer does not keep the process alive). Nothing is kept between
 * sweeps but the timer: the queue is in the database, so any instance may sweep what another queued.
 */
export function startFileSweeper(ds: DataSource, storage: FileStorage, intervalMs = 60_000): FileSweeper {
  let running: Promise<void> | null = null;
  let again = false;
  let stopped = false;
  const run = () => {
    if (stopped) return;
    if (running) {
      again = true;
      return;
    }
    running = sweepAllStoredFiles(ds, storage)
      .then((r) => {
        if (r.removed + r.failed > 0) logger.info(r, 'stored files of deleted records swept');
      })
      .catch((err: unknown) => logger.warn({ err }, 'the stored-file sweep failed; it runs again later'))
      .finally(() => {
        running = null;
        if (again) {
          again = false;
          run();
        }
      });
  };
  const timer = setInterval(run, intervalMs);
  timer.unref();
  return {
    soon: run,
    async stop() {
      stopped = true;
      clearInterval(timer);
      while (running) await running;
    },
  };
}

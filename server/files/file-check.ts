import type { DataSource } from 'typeorm';
import type { FileStorage } from './storage';

/*
 * Compares the storage with the database. Two things can part them: a database restored from a backup
 * taken before or after the files were copied, and objects left behind before deletes were queued.
 * An upload writes its objects before its rows, so objects written within the grace period are not judged.
 */

export interface StorageCheck {
  /** Objects stored. */
  objects: number;
  /** Objects no attachment names and none queued for removal, older than the grace period. */
  orphans: string[];
  /** Objects written within the grace period: possibly an upload still in progress, not judged. */
  recent: number;
  /** Objects already queued for removal (the sweep will take them). */
  queued: number;
  /** Files the database lists whose object is not stored: their downloads answer 404. */
  missing: { attachmentId: string; key: string }[];
}

/** One hour: far longer than an upload of ten 10 MB files takes to reach its rows. */
export const DEFAULT_GRACE_MS = 60 * 60 * 1000;

export async function checkStoredFiles(ds: DataSource, storage: FileStorage, { now = new Date(), graceMs = DEFAULT_GRACE_MS } = {}): Promise<StorageCheck> {
  const rows: { id: string; storage_key: string; thumbnail_key: string | null }[] = await ds.query('SELECT id, storage_key, thumbnail_key FROM attachments');
  const named = new Map<string, string>();
  for (const r of rows) {
    named.set(r.storage_key, r.id);
    if (r.thumbnail_key) named.set(r.thumbnail_key, r.id);
  }
  const queuedKeys = new Set(((await ds.query('SELECT storage_key FROM stored_file_removals')) as { storage_key: string }[]).map((r) => r.storage_key));

  const result: StorageCheck = { objects: 0, orphans: [], recent: 0, queued: 0, missing: [] };
  const stored = new Set<string>();
  for await (const page of storage.list()) {
    for (const { key, modifiedAt } of page) {
      result.objects += 1;
      stored.add(key);
      if (named.has(key)) continue;
      if (queuedKeys.has(key)) result.queued += 1;
      else if (now.getTime() - modifiedAt.getTime() < graceMs) result.recent += 1;
      else result.orphans.push(key);
    }
  }
  for (const [key, attachmentId] of named) if (!stored.has(key)) result.missing.push({ attachmentId, key });
  result.orphans.sort();
  result.missing.sort((a, b) => a.key.localeCompare(b.key));
  return result;
}

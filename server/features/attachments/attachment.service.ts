import { randomUUID } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { Attachment, AttachmentContentType, AttachmentTarget, AttachmentTargetType } from '@shared/files/attachment.schema';
import { AppError } from '../../lib/app-error';
import { logger } from '../../lib/logger';
import { assertCarAccess, assertEventAccess, type Queryable } from '../../auth/access';
import type { FileStorage } from '../../files/storage';
import { queueForRemoval, sweepStoredFiles } from '../../files/file-sweep';
import { cleanFileName, describeImage, detectContentType } from '../../files/inspect';

/** The column each target type's id lives in. */
const TARGET_COLUMN: Record<AttachmentTargetType, 'tread_reading_id' | 'run_id' | 'setup_id' | 'event_id'> = {
  tread_reading: 'tread_reading_id',
  run: 'run_id',
  setup: 'setup_id',
  event: 'event_id',
};

const NOT_FOUND: Record<AttachmentTargetType, string> = {
  tread_reading: 'That tread reading was not found.',
  run: 'That run was not found.',
  setup: 'That setup was not found.',
  event: 'That event was not found.',
};

const FILE_NOT_FOUND = 'That file was not found.';

/** A record a file hangs on, as the service works with it. */
interface TargetRef {
  type: AttachmentTargetType;
  id: string;
}

const refOf = (target: AttachmentTarget): TargetRef => ({ type: target.targetType, id: target.targetId });

/** Named in every refusal of a file's type, so the person knows what to send instead. */
export const ALLOWED_TYPES_TEXT = 'Attach photos (JPEG, PNG, WebP or HEIC) or PDF files.';

/**
 * Checks the user may read (or add files to) the record and answers its car: null for an
 * event. Records of a car follow the car's rule (its drivers add files; its granted shop
 * reads); an event's files are read and added by anyone who may see the event. Anyone
 * else gets 404, never 403, for something they cannot see.
 */
async function resolveTarget(db: Queryable, user: User, target: TargetRef, action: 'read' | 'write'): Promise<string | null> {
  const missing = () => new AppError('not_found', NOT_FOUND[target.type]);
  if (target.type === 'event') {
    try {
      await assertEventAccess(db, user, target.id);
    } catch (err) {
      if (err instanceof AppError && err.code === 'not_found') throw missing();
      throw err;
    }
    return null;
  }
  const sql = {
    tread_reading: 'SELECT ts.car_id FROM tread_readings t JOIN tyre_sets ts ON ts.id = t.tyre_set_id WHERE t.id = $1',
    run: 'SELECT car_id FROM runs WHERE id = $1',
    setup: 'SELECT car_id FROM setup_snapshots WHERE id = $1',
  }[target.type];
  const rows: { car_id: string }[] = await db.query(sql, [target.id]);
  const carId = rows[0]?.car_id;
  if (!carId) throw missing();
  try {
    await assertCarAccess(db, user, carId, action);
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') throw missing();
    if (err instanceof AppError && err.code === 'forbidden' && action === 'write') {
      throw new AppError('forbidden', 'Only the car\'s drivers can add files to its records.');
    }
    throw err;
  }
  return carId;
}

interface AttachmentRow {
  id: string;
  car_id: string | null;
  tread_reading_id: string | null;
  run_id: string | null;
  setup_id: string | null;
  event_id: string | null;
  storage_key: string;
  thumbnail_key: string | null;
  file_name: string;
  content_type: AttachmentContentType;
  size_bytes: number;
  width: number | null;
  height: number | null;
  uploaded_by: string;
  uploader_name: string;
  can_delete: boolean;
  created_at: Date;
}

/** The rows with their uploader and whether user `$1` may delete each: the uploader, the car's owner, or the event's creator. */
const SELECT = `
  SELECT a.*, u.display_name AS uploader_name,
         (a.uploaded_by = $1 OR c.owner_id = $1 OR e.created_by = $1) IS TRUE AS can_delete
    FROM attachments a
    JOIN users u ON u.id = a.uploaded_by
    LEFT JOIN cars c ON c.id = a.car_id
    LEFT JOIN events e ON e.id = a.event_id`;

function targetOf(row: AttachmentRow): TargetRef {
  for (const type of Object.keys(TARGET_COLUMN) as AttachmentTargetType[]) {
    const id = row[TARGET_COLUMN[type]];
    if (id) return { type, id };
  }
  throw new Error(`Attachment ${row.id} has no target`);
}

function toDto(row: AttachmentRow): Attachment {
  const target = targetOf(row);
  return {
    id: row.id,
    target: { type: target.type, id: target.id },
    carId: row.car_id,
    fileName: row.file_name,
    contentType: row.content_type,
    sizeBytes: row.size_bytes,
    width: row.width,
    height: row.height,
    hasThumbnail: row.thumbnail_key !== null,
    uploadedBy: { id: row.uploaded_by, displayName: row.uploader_name },
    canDelete: row.can_delete,
    createdAt: row.created_at.toISOString(),
  };
}

/** The files on a record, oldest first. */
export async function listAttachments(ds: DataSource, user: User, input: AttachmentTarget): Promise<Attachment[]> {
  const target = refOf(input);
  await resolveTarget(ds, user, target, 'read');
  const rows: AttachmentRow[] = await ds.query(
    `${SELECT} WHERE a.${TARGET_COLUMN[target.type]} = $2 ORDER BY a.created_at, a.id`,
    [user.id, target.id],
  );
  return rows.map(toDto);
}

/**
 * Checks the user may add files to the record and answers its car (null for an event); refuses like
 * resolveTarget. The route runs it before the files are read; createAttachments runs it again once
 * they have arrived, since a long upload may outlast a co-driver's access.
 */
export async function assertCanAttach(db: Queryable, user: User, input: AttachmentTarget): Promise<string | null> {
  return resolveTarget(db, user, refOf(input), 'write');
}

export interface ReceivedFile {
  /** As the browser named it; kept only for the download's name. */
  originalName: string;
  bytes: Buffer;
}

/**
 * Stores every file or none, on a record the user may add files to (assertCanAttach). Each file's
 * type comes from its bytes; if any is not a photo or PDF the whole request is refused (415) before
 * anything is stored. The objects go to storage first and the rows are written in one transaction;
 * if either fails, the stored objects are removed again.
 */
export async function createAttachments(
  ds: DataSource,
  storage: FileStorage,
  user: User,
  input: AttachmentTarget,
  files: ReceivedFile[],
): Promise<Attachment[]> {
  const target = refOf(input);
  const carId = await assertCanAttach(ds, user, input);
  if (files.length === 0) {
    throw new AppError('validation_failed', 'Choose at least one file.', { files: ['Choose at least one photo or PDF'] });
  }

  const prepared = await Promise.all(
    files.map(async (file) => {
      const contentType = await detectContentType(file.bytes);
      const fileName = cleanFileName(file.originalName);
      return { fileName, bytes: file.bytes, contentType };
    }),
  );
  const refused = prepared.filter((p) => p.contentType === null).map((p) => `"${p.fileName}"`);
  if (refused.length > 0) {
    const names = refused.length > 3 ? `${refused.slice(0, 3).join(', ')} and ${refused.length - 3} more` : refused.join(', ');
    throw new AppError(
      'unsupported_media_type',
      `${names} ${refused.length === 1 ? 'is not a photo or PDF' : 'are not photos or PDFs'}, so nothing was added. ${ALLOWED_TYPES_TEXT}`,
    );
  }

  const stored: string[] = [];
  const rows: { id: string; storageKey: string; thumbnailKey: string | null; fileName: string; contentType: AttachmentContentType; size: number; width: number | null; height: number | null }[] = [];
  try {
    for (const p of prepared) {
      const contentType = p.contentType!;
      const id = randomUUID();
      const storageKey = `${id}/original`;
      const image = await describeImage(p.bytes, contentType);
      await storage.put(storageKey, p.bytes, contentType);
      stored.push(storageKey);
      let thumbnailKey: string | null = null;
      if (image) {
        thumbnailKey = `${id}/thumbnail`;
        await storage.put(thumbnailKey, image.thumbnail, 'image/webp');
        stored.push(thumbnailKey);
      }
      rows.push({
        id, storageKey, thumbnailKey, fileName: p.fileName, contentType, size: p.bytes.length,
        width: image?.width ?? null, height: image?.height ?? null,
      });
    }
    await ds.transaction(async (m) => {
      for (const r of rows) {
        // clock_timestamp(), not now(): files of one request keep the order they were sent in.
        await m.query(
          `INSERT INTO attachments (id, car_id, ${TARGET_COLUMN[target.type]}, storage_key, thumbnail_key, file_name, content_type, size_bytes, width, height, uploaded_by, created_at)
           VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11, clock_timestamp())`,
          [r.id, carId, target.id, r.storageKey, r.thumbnailKey, r.fileName, r.contentType, r.size, r.width, r.height, user.id],
        );
      }
    });
  } catch (err) {
    await removeObjects(ds, storage, stored);
    throw err;
  }

  const saved: AttachmentRow[] = await ds.query(`${SELECT} WHERE a.id = ANY($2::uuid[]) ORDER BY a.created_at, a.id`, [user.id, rows.map((r) => r.id)]);
  return saved.map(toDto);
}

/** One attachment the user may read (404 otherwise, the same as one that does not exist). */
async function readableAttachment(ds: DataSource, user: User, attachmentId: string): Promise<AttachmentRow> {
  const rows: AttachmentRow[] = await ds.query(`${SELECT} WHERE a.id = $2`, [user.id, attachmentId]);
  const row = rows[0];
  if (!row) throw new AppError('not_found', FILE_NOT_FOUND);
  try {
    await resolveTarget(ds, user, targetOf(row), 'read');
  } catch (err) {
    if (err instanceof AppError && err.code === 'not_found') throw new AppError('not_found', FILE_NOT_FOUND);
    throw err;
  }
  return row;
}

export interface FileBytes {
  bytes: Buffer;
  contentType: string;
  fileName: string;
}

/** The file as uploaded. */
export async function readAttachmentFile(ds: DataSource, storage: FileStorage, user: User, attachmentId: string): Promise<FileBytes> {
  const row = await readableAttachment(ds, user, attachmentId);
  const bytes = await storage.get(row.storage_key);
  if (!bytes) {
    logger.warn({ attachmentId, key: row.storage_key }, 'attachment bytes missing from storage');
    throw new AppError('not_found', FILE_NOT_FOUND);
  }
  return { bytes, contentType: row.content_type, fileName: row.file_name };
}

/** The small WebP made at upload; 404 for a file that has none (a PDF, or a photo sharp could not read). */
export async function readAttachmentThumbnail(ds: DataSource, storage: FileStorage, user: User, attachmentId: string): Promise<FileBytes> {
  const row = await readableAttachment(ds, user, attachmentId);
  const bytes = row.thumbnail_key ? await storage.get(row.thumbnail_key) : null;
  if (!bytes) throw new AppError('not_found', 'That file has no thumbnail.');
  const stem = row.file_name.replace(/\.[^.]*$/, '') || 'file';
  return { bytes, contentType: 'image/webp', fileName: `${stem}-thumbnail.webp` };
}

/**
 * Deletes the row, then its stored objects. The person who added the file may delete it, and
 * so may the car's owner (for an event's file, the event's creator); others who can see it get 403.
 */
export async function deleteAttachment(ds: DataSource, storage: FileStorage, user: User, attachmentId: string): Promise<void> {
  const row = await readableAttachment(ds, user, attachmentId);
  if (!row.can_delete) {
    throw new AppError(
      'forbidden',
      row.event_id ? 'Only the person who added this file or the event\'s creator can delete it.' : 'Only the person who added this file or the car\'s owner can delete it.',
    );
  }
  // The delete queues the row's objects (a trigger, in the same statement); they are removed at once,
  // or stay queued for the sweep if the storage refuses now.
  await ds.query('DELETE FROM attachments WHERE id = $1', [attachmentId]);
  await sweepStoredFiles(ds, storage, { keys: [row.storage_key, ...(row.thumbnail_key ? [row.thumbnail_key] : [])] }).catch((err: unknown) =>
    logger.warn({ err, attachmentId }, 'the deleted file\'s objects stay queued for the sweep'),
  );
}

/**
 * Objects stored for an upload whose rows were never written. Each is removed now; one the storage
 * refuses is queued for the sweep, if the database can be reached.
 */
async function removeObjects(ds: DataSource, storage: FileStorage, keys: string[]) {
  const left: string[] = [];
  for (const key of keys) {
    try {
      await storage.delete(key);
    } catch (err) {
      logger.warn({ err, key }, 'could not remove a stored file');
      left.push(key);
    }
  }
  if (left.length === 0) return;
  await queueForRemoval(ds, left).catch((err: unknown) => logger.warn({ err, keys: left }, 'could not queue stored files for removal; they stay unreachable'));
}

/**
 * Files attached to a record: photos of tyre wear or of a setup sheet, a club's PDF. The
 * server decides the type from the file's bytes; what the browser or the name says is ignored.
 */
import * as z from '../zod';

export const ATTACHMENT_TARGET_TYPES = ['tread_reading', 'run', 'setup', 'event'] as const;
export type AttachmentTargetType = (typeof ATTACHMENT_TARGET_TYPES)[number];

/** What may be attached, as detected from the bytes. */
export const ATTACHMENT_CONTENT_TYPES = ['image/jpeg', 'image/png', 'image/webp', 'image/heic', 'image/heif', 'application/pdf'] as const;
export type AttachmentContentType = (typeof ATTACHMENT_CONTENT_TYPES)[number];

export const MAX_ATTACHMENT_BYTES = 10 * 1024 * 1024;
export const MAX_ATTACHMENTS_PER_REQUEST = 10;

/** The record files hang on: the query string of an upload (read before its files) and of a list. */
export const attachmentTargetSchema = z.strictObject({
  targetType: z.enum(ATTACHMENT_TARGET_TYPES, { error: 'Choose what the file belongs to: tread_reading, run, setup or event' }),
  targetId: z.uuid({ error: 'That record id is not valid' }),
});
export type AttachmentTarget = z.infer<typeof attachmentTargetSchema>;

export interface Attachment {
  id: string;
  target: { type: AttachmentTargetType; id: string };
  /** The car the parent record belongs to; null for an event. */
  carId: string | null;
  /** As uploaded, for the download's name only. */
  fileName: string;
  contentType: AttachmentContentType;
  sizeBytes: number;
  /** Pixel size of an image; null for a PDF. */
  width: number | null;
  height: number | null;
  /** GET /api/attachments/:id/thumbnail answers a small image. */
  hasThumbnail: boolean;
  uploadedBy: { id: string; displayName: string };
  /** The uploader (or the car's owner) may delete it. */
  canDelete: boolean;
  createdAt: string;
}

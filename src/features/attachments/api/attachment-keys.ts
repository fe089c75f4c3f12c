import type { AttachmentTarget } from '@shared/files/attachment.schema';

/** Every attachment query key; a list's key holds its whole target. */
export const attachmentKeys = {
  all: ['attachments'] as const,
  list: (target: AttachmentTarget) => [...attachmentKeys.all, 'list', { type: target.targetType, id: target.targetId }] as const,
};

/** A record's files: GET lists them, POST adds to them (the server checks the target before it reads any file). */
export const attachmentsUrl = (target: AttachmentTarget) =>
  `/api/attachments?${new URLSearchParams({ targetType: target.targetType, targetId: target.targetId }).toString()}`;

/** The file itself, served only to people who may see its record (the session cookie goes along). */
export const attachmentFileUrl = (attachmentId: string) => `/api/attachments/${encodeURIComponent(attachmentId)}/file`;

/** A small image of a photo; only when the attachment says it has one. */
export const attachmentThumbnailUrl = (attachmentId: string) => `/api/attachments/${encodeURIComponent(attachmentId)}/thumbnail`;

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Attachment, AttachmentTarget } from '@shared/files/attachment.schema';
import { api } from '@/lib/api-client';
import { attachmentKeys } from './attachment-keys';

/** The photos and files on one record. */
export function getAttachments(
  target: AttachmentTarget,
  { signal }: { signal?: AbortSignal } = {},
): Promise<{ items: Attachment[]; count: number }> {
  const query = new URLSearchParams({ targetType: target.targetType, targetId: target.targetId });
  return api.get(`/api/attachments?${query.toString()}`, { signal });
}

export function attachmentsQueryOptions(target: AttachmentTarget) {
  return queryOptions({
    queryKey: attachmentKeys.list(target),
    queryFn: ({ signal }) => getAttachments(target, { signal }),
    meta: { errorsShownInline: true },
  });
}

export function useAttachments(target: AttachmentTarget) {
  return useQuery(attachmentsQueryOptions(target));
}

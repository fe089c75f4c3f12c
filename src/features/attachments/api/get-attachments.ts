import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Attachment, AttachmentTarget } from '@shared/files/attachment.schema';
import { api } from '@/lib/api-client';
import { attachmentKeys, attachmentsUrl } from './attachment-keys';

/** The photos and files on one record. */
export function getAttachments(
  target: AttachmentTarget,
  { signal }: { signal?: AbortSignal } = {},
): Promise<{ items: Attachment[]; count: number }> {
  return api.get(attachmentsUrl(target), { signal });
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

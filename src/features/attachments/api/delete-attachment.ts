import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { AttachmentTarget } from '@shared/files/attachment.schema';
import { api } from '@/lib/api-client';
import { attachmentKeys } from './attachment-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function deleteAttachment(attachmentId: string): Promise<void> {
  return api.delete(`/api/attachments/${encodeURIComponent(attachmentId)}`);
}

/** An online write: its error (no connection, not allowed) is shown beside the strip. */
export function useDeleteAttachment(target: AttachmentTarget) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteAttachment,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: attachmentKeys.list(target) }),
  });
}

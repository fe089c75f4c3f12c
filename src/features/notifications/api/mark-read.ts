import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MarkReadInput } from '@shared/collab/notification.schema';
import { api } from '@/lib/api-client';
import { notificationKeys } from './notification-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** Marks some notifications (or all of them) read. */
export function markRead(input: MarkReadInput): Promise<unknown> {
  return api.post('/api/notifications/read', input);
}

/** The list and the bell both refresh once the server has it. */
export function useMarkRead() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: markRead,
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: notificationKeys.all }),
  });
}

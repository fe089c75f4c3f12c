import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { MAILBOX_KEY } from './get-mailbox';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function emptyMailbox(): Promise<void> {
  return api.delete('/api/dev/mailbox');
}

/** Development only: deletes every caught e-mail. */
export function useEmptyMailbox() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: emptyMailbox,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: MAILBOX_KEY }),
  });
}

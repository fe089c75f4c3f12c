import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MailboxMessage } from '@shared/collab/mailbox.schema';
import { api } from '@/lib/api-client';

/** Query key of the development mailbox. */
export const MAILBOX_KEY = ['dev-mailbox'] as const;

/** Development only: the e-mails the local mail server caught, newest first. */
export function getMailbox({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: MailboxMessage[]; count: number }> {
  return api.get('/api/dev/mailbox', { signal });
}

export function mailboxQueryOptions() {
  return queryOptions({
    queryKey: MAILBOX_KEY,
    queryFn: ({ signal }) => getMailbox({ signal }),
    meta: { errorsShownInline: true },
    // New mail arrives while the developer clicks through the app in another tab.
    staleTime: 0,
    refetchOnWindowFocus: 'always',
  });
}

export function useMailbox() {
  return useQuery(mailboxQueryOptions());
}

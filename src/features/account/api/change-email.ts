import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ChangeEmailInput, PendingEmailChange } from '@shared/auth/account.schema';
import type { User } from '@shared/auth/auth.schema';
import { api } from '@/lib/api-client';
import { authKeys } from '@/features/auth/api/auth-keys';

const pendingKey = ['auth', 'email-change'] as const;

/** A change of sign-in address waiting for its link to be opened, or null. */
export function usePendingEmailChange() {
  return useQuery({
    queryKey: pendingKey,
    queryFn: ({ signal }) => api.get<PendingEmailChange>('/api/auth/me/email', { signal }).then((r) => r.pending),
    meta: { errorsShownInline: true },
  });
}

/** Asks to sign in with a new address: a link goes to it; nothing changes until the link is opened. */
export function useRequestEmailChange() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ChangeEmailInput) => api.post<PendingEmailChange>('/api/auth/me/email', input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: ({ pending }) => queryClient.setQueryData(pendingKey, pending),
  });
}

/** The link from the new address: the account signs in with it from now on. */
export function useConfirmEmailChange() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => api.post<{ user: User }>('/api/auth/me/email/confirm', { token }),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: ({ user }) => {
      queryClient.setQueryData(authKeys.me(), user);
      queryClient.setQueryData(pendingKey, null);
    },
  });
}

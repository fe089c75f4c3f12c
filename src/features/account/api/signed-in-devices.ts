import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { EndSessionsInput, SignedInDevice } from '@shared/auth/account.schema';
import { api } from '@/lib/api-client';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

const devicesKey = ['auth', 'devices'] as const;

/** The devices signed in to this account, this one first. */
export function useSignedInDevices() {
  return useQuery({
    queryKey: devicesKey,
    queryFn: ({ signal }) => api.get<{ items: SignedInDevice[] }>('/api/auth/me/sessions', { signal }).then((r) => r.items),
    meta: { errorsShownInline: true },
  });
}

/** Signs out one other device, or all of them, with the password typed again. */
export function useEndSessions() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: EndSessionsInput) => api.post<{ ended: number }>('/api/auth/me/sessions/end', input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSettled: () => refreshAfterWrite(queryClient, { queryKey: devicesKey }),
  });
}

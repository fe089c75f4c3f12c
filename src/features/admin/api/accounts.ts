import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { AdminAccount, AdminAccountList, CloseAccountByAdminInput, SetAdminInput, SuspendAccountInput } from '@shared/auth/admin.schema';
import { api } from '@/lib/api-client';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** Every accounts query key; a write refreshes them all. */
export const accountKeys = {
  all: ['admin', 'accounts'] as const,
  search: (q: string) => [...accountKeys.all, q] as const,
};

const accountPath = (userId: string) => `/api/admin/users/${encodeURIComponent(userId)}`;

export function getAccounts(q: string, { signal }: { signal?: AbortSignal } = {}): Promise<AdminAccountList> {
  return api.get(`/api/admin/users${q ? `?${new URLSearchParams({ q }).toString()}` : ''}`, { signal });
}

export function accountsQueryOptions(q: string) {
  return queryOptions({
    queryKey: accountKeys.search(q),
    queryFn: ({ signal }) => getAccounts(q, { signal }),
    meta: { errorsShownInline: true, notKeptOnDevice: true },
  });
}

/** The accounts whose name or e-mail holds `q`; the last answer stays in view while the next one comes. */
export function useAccounts(q: string) {
  return useQuery({ ...accountsQueryOptions(q.trim()), placeholderData: keepPreviousData });
}

/**
 * Suspending, restoring or closing: an online write, made at a desk, not at the car. Tried at once, never queued,
 * its error shown where it was asked; every list is refreshed before it counts as done.
 */
function useAccountWrite<TInput, TOutput = AdminAccount>(write: (input: TInput) => Promise<TOutput>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: write,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: accountKeys.all }),
  });
}

export function useSuspendAccount() {
  return useAccountWrite(({ userId, ...input }: SuspendAccountInput & { userId: string }) =>
    api.post<AdminAccount>(`${accountPath(userId)}/suspend`, input),
  );
}

export function useRestoreAccount() {
  return useAccountWrite((userId: string) => api.post<AdminAccount>(`${accountPath(userId)}/restore`));
}

export function useSetAdmin() {
  return useAccountWrite(({ userId, ...input }: SetAdminInput & { userId: string }) => api.put<AdminAccount>(`${accountPath(userId)}/admin`, input));
}

/** Closes a suspended account for good, its address typed again. */
export function useCloseSuspendedAccount() {
  return useAccountWrite(({ userId, ...input }: CloseAccountByAdminInput & { userId: string }) => api.post<void>(`${accountPath(userId)}/close`, input));
}

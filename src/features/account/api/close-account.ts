import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CloseAccountInput } from '@shared/auth/account.schema';
import { api, dropCsrfToken } from '@/lib/api-client';
import { useLeaveDevice } from '@/features/auth/api/logout';
import { signedInAccount } from '@/app/outbox';
import type { SignInState } from '@/app/routes/sign-in';

const CLOSED: SignInState = { notice: 'account-closed' };

/** Closes the account for good; this device is then left as after signing out, and the sign-in page says why. */
export function useCloseAccount() {
  const leave = useLeaveDevice();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: CloseAccountInput) => api.post<void>('/api/auth/me/close', input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    // The closed account's changes go, whoever a refused read has meanwhile left signed in (see useLogout).
    onMutate: signedInAccount(queryClient),
    onSuccess: async (_data, _input, owner) => {
      dropCsrfToken();
      await leave(CLOSED, owner);
    },
  });
}

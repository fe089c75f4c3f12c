import { useMutation } from '@tanstack/react-query';
import type { CloseAccountInput } from '@shared/auth/account.schema';
import { api, dropCsrfToken } from '@/lib/api-client';
import { useLeaveDevice } from '@/features/auth/api/logout';
import type { SignInState } from '@/app/routes/sign-in';

const CLOSED: SignInState = { notice: 'account-closed' };

/** Closes the account for good; this device is then left as after signing out, and the sign-in page says why. */
export function useCloseAccount() {
  const leave = useLeaveDevice();
  return useMutation({
    mutationFn: (input: CloseAccountInput) => api.post<void>('/api/auth/me/close', input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: async () => {
      dropCsrfToken();
      await leave(CLOSED);
    },
  });
}

import { useMutation } from '@tanstack/react-query';
import type { ChangePasswordInput } from '@shared/auth/account.schema';
import { api } from '@/lib/api-client';

/** A new password for the signed-in account; every other device is signed out, this one stays. */
export function changePassword(input: ChangePasswordInput): Promise<unknown> {
  return api.post('/api/auth/me/password', input);
}

export function useChangePassword() {
  return useMutation({ mutationFn: changePassword, networkMode: 'always', meta: { errorsShownInline: true } });
}

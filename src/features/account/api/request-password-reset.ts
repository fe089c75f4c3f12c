import { useMutation } from '@tanstack/react-query';
import type { PasswordResetRequest } from '@shared/collab/invitation.schema';
import { api } from '@/lib/api-client';

/** Asks for a reset link; the server answers the same whether or not an account uses the address. */
export function requestPasswordReset(input: PasswordResetRequest): Promise<unknown> {
  return api.post('/api/auth/password-reset', input);
}

export function useRequestPasswordReset() {
  return useMutation({ mutationFn: requestPasswordReset, networkMode: 'always', meta: { errorsShownInline: true } });
}

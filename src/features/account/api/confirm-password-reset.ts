import { useMutation } from '@tanstack/react-query';
import type { PasswordResetConfirm } from '@shared/collab/invitation.schema';
import { api } from '@/lib/api-client';

/** Sets a new password with the link's token; the token then stops working. */
export function confirmPasswordReset(input: PasswordResetConfirm): Promise<unknown> {
  return api.post('/api/auth/password-reset/confirm', input);
}

export function useConfirmPasswordReset() {
  return useMutation({ mutationFn: confirmPasswordReset, networkMode: 'always', meta: { errorsShownInline: true } });
}

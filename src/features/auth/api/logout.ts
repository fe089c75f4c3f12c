import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { api, dropCsrfToken } from '@/lib/api-client';
import { useOutbox } from '@/lib/outbox-context';
import { clearToasts } from '@/lib/toast-store';
import { signedInAccount } from '@/app/outbox';
import { authKeys } from './auth-keys';

export async function logout(): Promise<void> {
  await api.post<void>('/api/auth/logout');
  dropCsrfToken();
}

/**
 * What signing out leaves on the device: nothing. The outbox is emptied, the query cache (and with it the
 * copy kept on the device, rewritten from it) is cleared, and the sign-in page opens, with `state` for it.
 */
export function useLeaveDevice() {
  const queryClient = useQueryClient();
  const outbox = useOutbox();
  const navigate = useNavigate();
  return async (state?: object, owner?: string) => {
    await outbox.clear(owner);
    queryClient.clear();
    // Marked signed out after the clear, so that the sign-in page does not send us straight back.
    queryClient.setQueryData(authKeys.me(), null);
    clearToasts();
    await navigate(paths.signIn, { replace: true, state });
  };
}

/**
 * Signs out (see useLeaveDevice). Screens warn first when entries are still waiting (see AccountMenu).
 * Whose entries go is read at the tap, while signed in: once the server has ended the session, a read
 * it refuses may mark nobody signed in before the sign-out's own answer arrives.
 */
export function useLogout() {
  const leave = useLeaveDevice();
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logout,
    onMutate: signedInAccount(queryClient),
    onSuccess: (_data, _input, owner) => leave(undefined, owner),
  });
}

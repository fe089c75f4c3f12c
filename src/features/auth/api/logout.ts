import { useMutation, useQueryClient } from '@tanstack/react-query';
import { useNavigate } from 'react-router-dom';
import { paths } from '@/config/paths';
import { api, dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { authKeys } from './auth-keys';

export async function logout(): Promise<void> {
  await api.post<void>('/api/auth/logout');
  dropCsrfToken();
}

/** Signs out, forgets everything cached for the session and opens the sign-in page. */
export function useLogout() {
  const queryClient = useQueryClient();
  const navigate = useNavigate();
  return useMutation({
    mutationFn: logout,
    onSuccess: async () => {
      // Marked signed out first, so that the sign-in page does not send us straight back.
      queryClient.setQueryData(authKeys.me(), null);
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      clearToasts();
      await navigate(paths.signIn, { replace: true });
    },
  });
}

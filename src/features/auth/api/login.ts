import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema, type User } from '@shared/auth/auth.schema';
import type { LoginInput } from '@shared/auth/credentials.schema';
import { api, dropCsrfToken } from '@/lib/api-client';
import { authKeys } from './auth-keys';

export async function login(input: LoginInput): Promise<User> {
  const { user } = await api.post('/api/auth/login', input, { schema: userResponseSchema });
  // Signing in starts a new session on the server; its old CSRF token is void.
  dropCsrfToken();
  return user;
}

export function useLogin() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: login,
    meta: { errorsShownInline: true },
    onSuccess: (user) => {
      // Nothing cached for an earlier session may leak into this one.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}

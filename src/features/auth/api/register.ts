import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema, type User } from '@shared/auth/auth.schema';
import type { RegisterInput } from '@shared/auth/credentials.schema';
import { api, dropCsrfToken } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/** Creates the account; the server signs the new user in at once. */
export async function register(input: RegisterInput): Promise<User> {
  const { user } = await api.post('/api/auth/register', input, { schema: userResponseSchema });
  dropCsrfToken();
  return user;
}

export function useRegister() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: register,
    meta: { errorsShownInline: true },
    onSuccess: (user) => {
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== authKeys.all[0] });
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import { userResponseSchema, type UpdatePreferencesInput, type User } from '@shared/auth/auth.schema';
import { api } from '@/lib/api-client';
import { authKeys } from './auth-keys';

/** Saves some of the user's preferences; what is not sent stays as it was. */
export async function updatePreferences(input: UpdatePreferencesInput): Promise<User> {
  const { user } = await api.patch('/api/auth/me/preferences', input, { schema: userResponseSchema });
  return user;
}

/** An online write (settings are not made at the car); the form shows its own errors. */
export function useUpdatePreferences() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updatePreferences,
    meta: { errorsShownInline: true },
    onSuccess: (user) => {
      queryClient.setQueryData(authKeys.me(), user);
    },
  });
}

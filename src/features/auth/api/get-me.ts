import { queryOptions, useQuery } from '@tanstack/react-query';
import { sessionResponseSchema, type User } from '@shared/auth/auth.schema';
import { api } from '@/lib/api-client';
import { authKeys } from './auth-keys';
import { firstReads } from '@shared/api/first-reads';

/** The signed-in user, or null when nobody is signed in. */
export async function getMe({ signal }: { signal?: AbortSignal } = {}): Promise<User | null> {
  const { user } = await api.get(firstReads.me, { schema: sessionResponseSchema, signal });
  return user;
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: authKeys.me(),
    queryFn: ({ signal }) => getMe({ signal }),
    staleTime: 5 * 60_000,
    // A failure here blocks the page, whose error screen explains it; a null answer means signed out.
    meta: { errorsShownInline: true, nullMeansSignedOut: true },
  });
}

export function useMe() {
  return useQuery(meQueryOptions());
}

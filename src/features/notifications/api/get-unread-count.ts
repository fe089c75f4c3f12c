import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UnreadCount } from '@shared/collab/notification.schema';
import { api } from '@/lib/api-client';
import { notificationKeys } from './notification-keys';

/** How often the bell asks while the app is in view. */
export const UNREAD_POLL_MS = 60_000;

export function getUnreadCount({ signal }: { signal?: AbortSignal } = {}): Promise<UnreadCount> {
  return api.get('/api/notifications/unread-count', { signal });
}

export function unreadCountQueryOptions() {
  return queryOptions({
    queryKey: notificationKeys.unreadCount(),
    queryFn: ({ signal }) => getUnreadCount({ signal }),
    // Every minute while the app is in view (TanStack stops the timer when the page is hidden), and on coming back to it.
    refetchInterval: UNREAD_POLL_MS,
    refetchIntervalInBackground: false,
    refetchOnWindowFocus: 'always',
    // A bell that cannot reach the server stays quiet; no toast every minute at a venue with no signal.
    meta: { errorsShownInline: true },
  });
}

export function useUnreadCount() {
  return useQuery(unreadCountQueryOptions());
}

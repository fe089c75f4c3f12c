import { queryOptions, useQuery } from '@tanstack/react-query';
import type { NotificationList } from '@shared/collab/notification.schema';
import { api } from '@/lib/api-client';
import { notificationKeys } from './notification-keys';

/** The user's notifications, newest first, with how many are unread. */
export function getNotifications({ signal }: { signal?: AbortSignal } = {}): Promise<NotificationList> {
  return api.get('/api/notifications', { signal });
}

export function notificationsQueryOptions() {
  return queryOptions({
    queryKey: notificationKeys.list(),
    queryFn: ({ signal }) => getNotifications({ signal }),
    // The screen says so itself when this cannot be loaded.
    meta: { errorsShownInline: true },
  });
}

export function useNotifications() {
  return useQuery(notificationsQueryOptions());
}

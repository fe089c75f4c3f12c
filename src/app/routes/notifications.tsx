import { NotificationList } from '@/features/notifications/components/notification-list';

/** Everything the user was told about: comments, suggestions, decisions, shop access. */
export function NotificationsPage() {
  return (
    <div className="flex flex-col gap-6">
      <title>Notifications · Scrubline</title>
      <h1 className="text-3xl font-extrabold">Notifications</h1>
      <NotificationList />
    </div>
  );
}

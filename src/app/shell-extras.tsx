import { CommentsHost } from '@/features/comments/components/comments-host';
import { NotificationBell } from '@/features/notifications/components/notification-bell';

/**
 * The parts of the signed-in shell no page waits for: the notification bell (a count the server
 * sends anyway) and the host that opens comment threads over the trackside screen. One small file,
 * loaded just after the page (see signed-in-layout.tsx).
 */
export function ShellExtras() {
  return (
    <>
      <NotificationBell />
      <CommentsHost />
    </>
  );
}

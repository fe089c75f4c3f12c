import type { CommentTarget } from '@shared/collab/comment.schema';
import { AttachmentToggle } from '@/features/attachments/components/attachment-toggle';
import { CommentsHost } from '@/features/comments/components/comments-host';
import { NotificationBell } from '@/features/notifications/components/notification-bell';
import { useNewPageAtTop } from '@/hooks/use-new-page-at-top';
import { useOtherTabs } from '@/features/sync/hooks/use-other-tabs';
import { useSignInForUploads } from '@/features/sync/hooks/use-sign-in-for-uploads';

/** A run's or an event's photos, in the dialog the trackside "Comments" buttons open (the strip loads when unfolded). */
function photosOf(target: CommentTarget) {
  if (target.type !== 'run' && target.type !== 'event') return null;
  return <AttachmentToggle target={{ targetType: target.type, targetId: target.id }} what={target.type === 'run' ? 'this run' : 'this event'} />;
}

/**
 * The parts of the signed-in shell no page waits for: the notification bell (a count the server
 * sends anyway) and the host that opens comment threads over the trackside screen, with the record's
 * photos; each new page opened at its top; what other tabs put in the outbox; and a session that ended
 * found by an upload. One small file, loaded just after the page (see
 * signed-in-layout.tsx), so the first page's script carries none of it.
 */
export function ShellExtras() {
  useNewPageAtTop();
  useOtherTabs();
  useSignInForUploads();
  return (
    <>
      <NotificationBell />
      <CommentsHost renderExtras={photosOf} />
    </>
  );
}

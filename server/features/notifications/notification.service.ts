import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { AppNotification, MarkReadInput, NotificationKind, NotificationList, UnreadCount } from '@shared/collab/notification.schema';

/** How many of the newest notifications the list shows. */
export const NOTIFICATION_PAGE = 50;

interface Row {
  id: string;
  kind: NotificationKind;
  car_id: string | null;
  actor_id: string | null;
  actor_name: string | null;
  summary: string;
  link: string;
  read_at: Date | null;
  created_at: Date;
}

const toNotification = (r: Row): AppNotification => ({
  id: r.id,
  kind: r.kind,
  carId: r.car_id,
  actor: r.actor_id ? { id: r.actor_id, displayName: r.actor_name ?? '' } : null,
  summary: r.summary,
  link: r.link,
  readAt: r.read_at?.toISOString() ?? null,
  createdAt: r.created_at.toISOString(),
});

/** Every query here is scoped to the signed-in user: a notification is its recipient's alone. */
export async function listNotifications(ds: DataSource, user: User): Promise<NotificationList> {
  const rows: Row[] = await ds.query(
    `SELECT n.id, n.kind, n.car_id, n.actor_id, a.display_name AS actor_name, n.summary, n.link, n.read_at, n.created_at
       FROM notifications n LEFT JOIN users a ON a.id = n.actor_id
      WHERE n.user_id = $1 ORDER BY n.created_at DESC, n.id DESC LIMIT ${NOTIFICATION_PAGE}`,
    [user.id],
  );
  const items = rows.map(toNotification);
  return { items, count: items.length, ...(await unreadCount(ds, user)) };
}

export async function unreadCount(ds: DataSource, user: User): Promise<UnreadCount> {
  const rows: { n: number }[] = await ds.query('SELECT count(*)::int AS n FROM notifications WHERE user_id = $1 AND read_at IS NULL', [user.id]);
  return { unread: rows[0]?.n ?? 0 };
}

/** Marks the caller's own notifications read (ids of anyone else's are ignored); answers with what is left unread. */
export async function markRead(ds: DataSource, user: User, input: MarkReadInput): Promise<UnreadCount & { updated: number }> {
  const result: [unknown[], number] = 'all' in input
    ? await ds.query('UPDATE notifications SET read_at = now() WHERE user_id = $1 AND read_at IS NULL', [user.id])
    : await ds.query('UPDATE notifications SET read_at = now() WHERE user_id = $1 AND read_at IS NULL AND id = ANY($2)', [user.id, input.ids]);
  return { updated: result[1], ...(await unreadCount(ds, user)) };
}

import type { EntityManager } from 'typeorm';
import type { NotificationKind } from '@shared/collab/notification.schema';
import { sendInBackground, type MailMessage, type MailSettings } from '../../mail/mailer';
import { renderMail } from '../../mail/templates';
import type { Queryable } from '../../auth/access';

/**
 * The one way notifications are written: one row per recipient, inside the transaction of
 * the thing that caused them, and the e-mails for them sent once that transaction commits.
 */

export interface NotificationRecipient {
  userId: string;
  /** The app path this recipient should open: drivers see the record, shop staff their customer page. */
  link: string;
  /** Why this person gets it, for the e-mail's footer. */
  reason: string;
}

export interface NewNotification {
  kind: NotificationKind;
  actorId: string;
  carId: string;
  commentId?: string;
  suggestionId?: string;
  /** Set for notifications about a service visit. */
  workOrderId?: string;
  /** One line naming who did what, e.g. "Dusty Okonjo (Kettle Lane Chassis Works) commented on Nell Ashdown’s run 3 at …". */
  summary: string;
  /** Shown under the summary in the e-mail: the comment, the suggestion's title, the decision's note. */
  detail?: string;
  /** In order of preference: a person listed twice keeps their first link. */
  recipients: NotificationRecipient[];
}

/** E-mails waiting for the transaction to commit. */
export type Outbox = MailMessage[];

const SUBJECTS: Record<NotificationKind, (car: string) => string> = {
  comment: (car) => `New comment on ${car}`,
  suggestion: (car) => `A setup suggestion for ${car}`,
  suggestion_decided: (car) => `Your setup suggestion for ${car} was answered`,
  shop_grant: (car) => `${car} is now shared with your shop`,
  work_order_closed: (car) => `The shop has finished work on ${car}`,
  invoice_paid: (car) => `An invoice for ${car} was paid`,
  co_driver_added: (car) => `You were added as a co-driver of ${car}`,
};

const ACTIONS: Record<NotificationKind, string> = {
  comment: 'Open the comment',
  suggestion: 'Open the suggestion',
  suggestion_decided: 'Open the suggestion',
  shop_grant: 'Open the car',
  work_order_closed: 'Open the car',
  invoice_paid: 'Open the invoice',
  co_driver_added: 'Open the car',
};

/**
 * Writes one notification per recipient (never the actor) with the manager of the
 * caller's transaction, and returns the e-mails to send after it commits: one for each
 * recipient who has not turned notification e-mails off.
 */
export async function notify(m: EntityManager, mail: MailSettings | undefined, n: NewNotification): Promise<Outbox> {
  const seen = new Set<string>([n.actorId]);
  const recipients = n.recipients.filter((r) => !seen.has(r.userId) && seen.add(r.userId));
  if (recipients.length === 0) return [];
  await m.query(
    `INSERT INTO notifications (user_id, kind, car_id, comment_id, suggestion_id, actor_id, summary, link, work_order_id)
     SELECT r.user_id, $3, $4, $5, $6, $7, $8, r.link, $9 FROM unnest($1::uuid[], $2::text[]) AS r(user_id, link)`,
    [
      recipients.map((r) => r.userId), recipients.map((r) => r.link),
      n.kind, n.carId, n.commentId ?? null, n.suggestionId ?? null, n.actorId, n.summary, n.workOrderId ?? null,
    ],
  );
  if (!mail) return [];
  const rows: { id: string; email: string; email_notifications: boolean; unsubscribe_token: string; car_name: string }[] = await m.query(
    `SELECT u.id, u.email, u.email_notifications, u.unsubscribe_token, (SELECT name FROM cars WHERE id = $2) AS car_name
       FROM users u WHERE u.id = ANY($1)`,
    [recipients.map((r) => r.userId), n.carId],
  );
  const byId = new Map(rows.map((r) => [r.id, r]));
  const outbox: Outbox = [];
  for (const r of recipients) {
    const user = byId.get(r.userId);
    if (!user?.email_notifications) continue;
    const unsubscribeUrl = `${mail.publicUrl}/unsubscribe/${user.unsubscribe_token}`;
    const content = renderMail({
      subject: SUBJECTS[n.kind](user.car_name),
      paragraphs: [n.summary, ...(n.detail ? [n.detail] : [])],
      action: { label: ACTIONS[n.kind], url: `${mail.publicUrl}${r.link}` },
      footer: `${r.reason} You can turn these e-mails off with the link below.`,
      unsubscribeUrl,
    });
    outbox.push({ to: user.email, ...content, unsubscribeUrl });
  }
  return outbox;
}

/** Sends what notify() queued; call after the transaction has committed. */
export function sendOutbox(mail: MailSettings | undefined, outbox: Outbox): void {
  for (const message of outbox) sendInBackground(mail, message);
}

/** Who hears about a car: its drivers (owner first) and the staff of every shop it is granted to. */
export interface CarAudience {
  carId: string;
  carName: string;
  drivers: string[];
  staff: { userId: string; shopId: string; shopName: string }[];
}

export async function carAudience(db: Queryable, carId: string): Promise<CarAudience> {
  const rows: { name: string; drivers: string[]; staff: CarAudience['staff'] }[] = await db.query(
    `SELECT c.name,
            ARRAY[c.owner_id] || COALESCE((SELECT array_agg(d.user_id ORDER BY d.created_at) FROM car_co_drivers d WHERE d.car_id = c.id), '{}') AS drivers,
            COALESCE((SELECT json_agg(json_build_object('userId', m.user_id, 'shopId', s.id, 'shopName', s.name) ORDER BY g.created_at, m.created_at)
                        FROM shop_grants g JOIN shops s ON s.id = g.shop_id JOIN shop_members m ON m.shop_id = g.shop_id
                       WHERE g.car_id = c.id), '[]') AS staff
       FROM cars c WHERE c.id = $1`,
    [carId],
  );
  const row = rows[0];
  return { carId, carName: row?.name ?? '', drivers: row?.drivers ?? [], staff: row?.staff ?? [] };
}

/** The car's drivers, each sent to `link`, or to the page `link` makes for them. */
export function driverRecipients(audience: CarAudience, link: string | ((driverId: string) => string)): NotificationRecipient[] {
  return audience.drivers.map((userId) => ({
    userId,
    link: typeof link === 'string' ? link : link(userId),
    reason: `You get this e-mail because you drive ${audience.carName} in Scrubline.`,
  }));
}

/** Staff of the granted shops (or of one of them), sent to the shop's page for the car unless told otherwise. */
export function staffRecipients(audience: CarAudience, opts: { shopId?: string; link?: string } = {}): NotificationRecipient[] {
  return audience.staff
    .filter((s) => !opts.shopId || s.shopId === opts.shopId)
    .map((s) => ({
      userId: s.userId,
      link: opts.link ?? `/shop/customers/${audience.carId}`,
      reason: `You get this e-mail because ${s.shopName} looks after ${audience.carName} in Scrubline.`,
    }));
}

/**
 * The staff of one shop, whether or not the car is still granted to it: the shop of a service visit keeps the
 * visit's thread after a grant is withdrawn.
 */
export async function shopStaffRecipients(db: Queryable, audience: CarAudience, shopId: string, link?: string): Promise<NotificationRecipient[]> {
  const rows: { user_id: string; shop_name: string }[] = await db.query(
    'SELECT m.user_id, s.name AS shop_name FROM shop_members m JOIN shops s ON s.id = m.shop_id WHERE m.shop_id = $1 ORDER BY m.created_at',
    [shopId],
  );
  return rows.map((r) => ({
    userId: r.user_id,
    link: link ?? `/shop/customers/${audience.carId}`,
    reason: `You get this e-mail because ${r.shop_name} worked on ${audience.carName} in Scrubline.`,
  }));
}

/** "Dusty Okonjo (Kettle Lane Chassis Works)" for shop staff, the bare name for drivers. */
export function actorLabel(displayName: string, shopName: string | null | undefined): string {
  return shopName ? `${displayName} (${shopName})` : displayName;
}

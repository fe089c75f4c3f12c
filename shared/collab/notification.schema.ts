import * as z from '../zod';

export const NOTIFICATION_KINDS = ['comment', 'suggestion', 'suggestion_decided', 'shop_grant', 'work_order_closed', 'invoice_paid', 'co_driver_added'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

export interface AppNotification {
  id: string;
  kind: NotificationKind;
  carId: string | null;
  actor: { id: string; displayName: string } | null;
  /** One line, e.g. "Dusty Okonjo (Kettle Lane Chassis Works) commented on Nell Ashdown’s run 3 at …". */
  summary: string;
  /** The app path to open, e.g. /cars/…/review or /suggestions/…. */
  link: string;
  readAt: string | null;
  createdAt: string;
}

export interface NotificationList {
  items: AppNotification[];
  count: number;
  unread: number;
}

/** GET /api/notifications/unread-count: what the bell in the top bar shows. */
export interface UnreadCount {
  unread: number;
}

export const markReadInputSchema = z.union([
  z.strictObject({ ids: z.array(z.uuid()).check(z.minLength(1), z.maxLength(200)) }),
  z.strictObject({ all: z.literal(true) }),
]);
export type MarkReadInput = z.infer<typeof markReadInputSchema>;

/**
 * The development mailbox: e-mails caught by the local mail server that `npm start` and the
 * browser tests run instead of a real provider. Never present in production.
 */

/** One caught message, as GET /api/dev/mailbox lists it (newest first). */
export interface MailboxMessage {
  id: string;
  /** When the local mail server received it (ISO 8601). */
  date: string;
  from: string;
  /** Recipient addresses, lower-cased. */
  to: string[];
  subject: string;
  text: string;
  /** Empty when the message had no HTML part. */
  html: string;
  /** The List-Unsubscribe header of notification e-mails, or null. */
  listUnsubscribe: string | null;
}

/** One file of the mailbox folder: the message and all its header lines (lower-cased names). */
export interface MailboxFile extends MailboxMessage {
  headers: Record<string, string>;
}

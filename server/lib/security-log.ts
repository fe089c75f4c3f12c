import { createHash } from 'node:crypto';
import type { Request } from 'express';

/*
 * Security events, one log line each (OWASP ASVS 4.0 V7.1.3, V7.2.1, V7.2.2): every sign-in and its refusal,
 * every change to how an account signs in, every admin decision about an account. Each line carries
 * `security: <event>`, the request's id (pino-http), the acting account's id and the client's address, and
 * never a password, token or cookie. An e-mail address is logged only as a digest (`accountKey`), so the logs
 * can tell repeated tries at one address apart without holding the address (V7.1.2).
 * Refused requests (403, 429) are logged at `warn` by pino-http itself (server/app.ts); a 404 for a record that
 * exists but is not the user's to see (a car, what hangs off it, an event, a work order, a shop, a team: `HiddenRecord`) is a
 * `record-hidden` event at `warn` (server/lib/error-handler.ts).
 */

export type SecurityEvent =
  | 'registered'
  | 'signed-in'
  | 'sign-in-refused'
  | 'signed-out'
  | 'password-check-failed'
  | 'password-changed'
  | 'password-reset-asked'
  | 'password-reset'
  | 'email-change-asked'
  | 'email-changed'
  | 'devices-signed-out'
  | 'account-closed'
  | 'account-suspended'
  | 'account-restored'
  | 'admin-role-changed'
  | 'account-closed-by-admin'
  | 'record-hidden';

/** The first 16 hex digits of the SHA-256 of an address as typed, trimmed and in lower case. */
export const accountKey = (email: string) => createHash('sha256').update(email.trim().toLowerCase()).digest('hex').slice(0, 16);

export function securityEvent(req: Request, event: SecurityEvent, details: Record<string, unknown> = {}, level: 'info' | 'warn' = 'info'): void {
  req.log[level]({ security: event, userId: req.user?.id ?? null, ip: req.ip, ...details }, `security event: ${event}`);
}

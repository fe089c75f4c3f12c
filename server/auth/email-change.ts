import type { DataSource } from 'typeorm';
import { EMAIL_CHANGE_TTL_MS, EMAIL_LINK_PARAM, type PendingEmailChange } from '@shared/auth/account.schema';
import type { User } from '@shared/auth/auth.schema';
import { AppError } from '../lib/app-error';
import { hashSecretToken, newSecretToken } from '../lib/secret-token';
import { sendInBackground, type MailSettings } from '../mail/mailer';
import { renderMail } from '../mail/templates';
import { WRONG_PASSWORD, assertOwnPassword } from './password';

export { WRONG_PASSWORD };

/*
 * Changing the sign-in address (OWASP ASVS 4.0 V3.7.1): the password is typed again, a link goes to the new
 * address and a warning to the old one, and the address changes only when the link is opened by the same
 * account, signed in. Until then the account signs in with its old address.
 */

const UNIQUE_VIOLATION = '23505';
export const SAME_ADDRESS = 'That is already your address';
export const ADDRESS_TAKEN = 'An account with this e-mail already exists';
export const LINK_UNUSABLE = 'This link has expired, was already used, or was sent for another account. Ask for a new one here.';

export const confirmEmailUrl = (publicUrl: string, token: string) =>
  `${publicUrl}/settings?${new URLSearchParams({ [EMAIL_LINK_PARAM]: token }).toString()}`;

export function confirmEmailMail(o: { oldEmail: string; newEmail: string; url: string }) {
  return renderMail({
    subject: 'Confirm your new Scrubline address',
    paragraphs: [
      `The Scrubline account ${o.oldEmail} asked to sign in with ${o.newEmail} from now on. If it was you, open the link below while signed in.`,
      'The link works once, within a day. Until then, the account signs in with its old address.',
    ],
    action: { label: 'Use this address', url: o.url },
    footer: 'If you did not ask for this, ignore this e-mail: nothing changes.',
  });
}

export function emailChangeWarningMail(o: { oldEmail: string; newEmail: string; url: string }) {
  return renderMail({
    subject: 'Your Scrubline address is about to change',
    paragraphs: [
      `Someone signed in to the Scrubline account ${o.oldEmail} asked to change its address to ${o.newEmail}. The change happens only when the link sent to that address is opened.`,
      'If it was not you, someone knows your password: change it now in Settings, which also signs every other device out and voids the link.',
    ],
    action: { label: 'Open Settings', url: o.url },
  });
}

/**
 * Refuses the account's own address. Checked before the password and outside its sign-in limit, so that
 * only a wrong password counts as a failed sign-in.
 */
export function assertNewAddress(user: User, newEmail: string): void {
  if (newEmail === user.email) throw new AppError('validation_failed', `${SAME_ADDRESS}.`, { newEmail: [SAME_ADDRESS] });
}

const taken = () => new AppError('conflict', `${ADDRESS_TAKEN}.`, { newEmail: [ADDRESS_TAKEN] });

/**
 * Asks for a new address (one `assertNewAddress` let through): checks the password and that no account uses
 * the address, voids any earlier request, stores the new one (only the hash of its secret) and sends the two
 * e-mails.
 */
export async function requestEmailChange(
  ds: DataSource,
  mail: MailSettings | undefined,
  user: User,
  input: { newEmail: string; password: string },
): Promise<PendingEmailChange> {
  await assertOwnPassword(ds, user.id, input.password, { field: 'password', message: WRONG_PASSWORD });
  const { token, hash } = newSecretToken();
  const expiresAt = new Date(Date.now() + EMAIL_CHANGE_TTL_MS);
  await ds.transaction(async (m) => {
    const used: unknown[] = await m.query('SELECT 1 FROM users WHERE email = $1', [input.newEmail]);
    if (used.length) throw taken();
    await m.query('UPDATE email_changes SET used_at = now() WHERE user_id = $1 AND used_at IS NULL', [user.id]);
    await m.query('INSERT INTO email_changes (token_hash, user_id, new_email, expires_at) VALUES ($1, $2, $3, $4)', [hash, user.id, input.newEmail, expiresAt]);
  });
  if (mail) {
    const o = { oldEmail: user.email, newEmail: input.newEmail };
    sendInBackground(mail, { to: input.newEmail, ...confirmEmailMail({ ...o, url: confirmEmailUrl(mail.publicUrl, token) }) });
    sendInBackground(mail, { to: user.email, ...emailChangeWarningMail({ ...o, url: `${mail.publicUrl}/settings` }) });
  }
  return { pending: { email: input.newEmail, expiresAt: expiresAt.toISOString() } };
}

/** The account's change of address still waiting for its link, if any. */
export async function pendingEmailChange(ds: DataSource, userId: string): Promise<PendingEmailChange> {
  const rows: { new_email: string; expires_at: Date }[] = await ds.query(
    `SELECT new_email, expires_at FROM email_changes
      WHERE user_id = $1 AND used_at IS NULL AND expires_at > now()
      ORDER BY created_at DESC LIMIT 1`,
    [userId],
  );
  const row = rows[0];
  return { pending: row ? { email: row.new_email, expiresAt: row.expires_at.toISOString() } : null };
}

/**
 * Opens the link: in one transaction, the account's address becomes the new one and the request is used.
 * Only the account that asked can use it, and only once, within a day.
 */
export async function confirmEmailChange(ds: DataSource, userId: string, token: string): Promise<void> {
  try {
    await ds.transaction(async (m) => {
      const rows: { new_email: string }[] = await m.query(
        `SELECT new_email FROM email_changes
          WHERE token_hash = $1 AND user_id = $2 AND used_at IS NULL AND expires_at > now()
          FOR UPDATE`,
        [hashSecretToken(token), userId],
      );
      const row = rows[0];
      if (!row) throw new AppError('validation_failed', LINK_UNUSABLE, { token: [LINK_UNUSABLE] });
      await m.query('UPDATE users SET email = $2, updated_at = now() WHERE id = $1', [userId, row.new_email]);
      await m.query('UPDATE email_changes SET used_at = now() WHERE user_id = $1 AND used_at IS NULL', [userId]);
    });
  } catch (err) {
    // Someone registered the address after the link was sent.
    if ((err as { code?: string }).code === UNIQUE_VIOLATION) throw taken();
    throw err;
  }
}

import type { DataSource } from 'typeorm';
import { PASSWORD_RESET_TTL_MS } from '@shared/collab/invitation.schema';
import { AppError } from '../lib/app-error';
import { hashSecretToken, newSecretToken } from '../lib/secret-token';
import { sendInBackground, type MailSettings } from '../mail/mailer';
import { renderMail } from '../mail/templates';
import { hashPassword, storeNewPassword } from './password';

export const resetPasswordUrl = (publicUrl: string, token: string) => `${publicUrl}/reset-password?token=${encodeURIComponent(token)}`;

export function passwordResetMail(o: { email: string; url: string }) {
  return renderMail({
    subject: 'Choose a new Scrubline password',
    paragraphs: [
      `Someone asked to choose a new password for the Scrubline account ${o.email}. If it was you, open the link below.`,
      'The link works once, within one hour. Saving a new password signs the account out on every device.',
    ],
    action: { label: 'Choose a new password', url: o.url },
    footer: 'If you did not ask for this, ignore this e-mail: your password stays as it is.',
  });
}

/**
 * A reset request. The caller answers the same whatever happens here, and the same
 * work (token, hash, account lookup) is done whether or not the address has an
 * account; the e-mail goes out in the background so its delivery time does not show.
 */
export async function requestPasswordReset(ds: DataSource, mail: MailSettings | undefined, email: string): Promise<void> {
  const { token, hash } = newSecretToken();
  // One statement either way: it inserts a row only when an account uses the address.
  const rows: { email: string }[] = await ds.query(
    `INSERT INTO password_resets (token_hash, user_id, expires_at)
     SELECT $1, u.id, $3 FROM users u WHERE u.email = $2 AND u.closed_at IS NULL
     RETURNING (SELECT email FROM users WHERE id = user_id) AS email`,
    [hash, email.trim().toLowerCase(), new Date(Date.now() + PASSWORD_RESET_TTL_MS)],
  );
  const to = rows[0]?.email;
  if (to && mail) sendInBackground(mail, { to, ...passwordResetMail({ email: to, url: resetPasswordUrl(mail.publicUrl, token) }) });
}

const LINK_UNUSABLE = 'This reset link has expired or was already used. Ask for a new one.';

/**
 * Sets the new password from a reset link, in one transaction: the new argon2id hash,
 * this and every other open link of the account marked used, and every session of
 * the account ended (express-session rows whose passport user is this account).
 * Returns the account's e-mail.
 */
export async function confirmPasswordReset(ds: DataSource, token: string, password: string): Promise<{ userId: string; email: string }> {
  return ds.transaction(async (m) => {
    const rows: { user_id: string; email: string }[] = await m.query(
      `SELECT r.user_id, u.email FROM password_resets r JOIN users u ON u.id = r.user_id
       WHERE r.token_hash = $1 AND r.used_at IS NULL AND r.expires_at > now()
       FOR UPDATE OF r`,
      [hashSecretToken(token)],
    );
    const row = rows[0];
    if (!row) throw new AppError('validation_failed', LINK_UNUSABLE, { token: [LINK_UNUSABLE] });
    await storeNewPassword(m, row.user_id, await hashPassword(password), null);
    return { userId: row.user_id, email: row.email };
  });
}

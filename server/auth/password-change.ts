import type { DataSource } from 'typeorm';
import { assertOwnPassword, hashPassword, storeNewPassword } from './password';

export const WRONG_CURRENT_PASSWORD = 'That is not your current password';

/**
 * A signed-in person's new password, in one transaction: the current one checked against the stored
 * argon2id hash, the new hash stored, any open reset link voided, and every other session of the
 * account ended (OWASP ASVS 4.0 V3.3.3); the session that asked stays signed in. Throws a field
 * error on `currentPassword` when it does not match.
 */
export async function changePassword(ds: DataSource, userId: string, sessionId: string, input: { currentPassword: string; newPassword: string }): Promise<void> {
  const newHash = await hashPassword(input.newPassword);
  await ds.transaction(async (m) => {
    await assertOwnPassword(m, userId, input.currentPassword, { field: 'currentPassword', message: WRONG_CURRENT_PASSWORD, forUpdate: true });
    await storeNewPassword(m, userId, newHash, sessionId);
  });
}

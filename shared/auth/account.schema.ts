import * as z from '../zod';
import { emailSchema } from './auth.schema';
import { newPasswordSchema, PASSWORD_MAX } from './credentials.schema';

/*
 * What a signed-in person does to their own account: change the password, see and sign out the devices
 * signed in to it. Kept apart from sign-in and registration, which every first page loads.
 */

/** The password a signed-in person types to prove it is them: no rules beyond a length cap, as at sign-in. */
const currentPasswordSchema = z
  .string({ error: 'Enter your current password' })
  .check(z.minLength(1, 'Enter your current password'), z.maxLength(PASSWORD_MAX * 4));

/** A signed-in person changing their password (OWASP ASVS 4.0 V2.1.5, V3.7.1: the current one is asked again). */
export const changePasswordInputSchema = z
  .strictObject({ currentPassword: currentPasswordSchema, newPassword: newPasswordSchema })
  .check(z.refine((v) => v.currentPassword !== v.newPassword, { message: 'Choose a password other than your current one', path: ['newPassword'] }));
export type ChangePasswordInput = z.infer<typeof changePasswordInputSchema>;

/** The password typed again before something that cannot be undone from another device. */
const passwordAgainSchema = z
  .string({ error: 'Enter your password' })
  .check(z.minLength(1, 'Enter your password'), z.maxLength(PASSWORD_MAX * 4));

/** One device signed in to the account (a session), named by a digest of its id, never the id itself. */
export interface SignedInDevice {
  id: string;
  /** "Chrome on Android", or null when the browser did not say. */
  device: string | null;
  signedInAt: string | null;
  /** When it last used the app, to within a few minutes. */
  lastActiveAt: string;
  /** The device asking. */
  current: boolean;
}

/** Signs out one other device, or every other one (no sessionId), with the password typed again (OWASP ASVS 4.0 V3.3.4). */
export const endSessionsInputSchema = z.strictObject({
  password: passwordAgainSchema,
  sessionId: z.optional(z.string({ error: 'Choose a device from the list' }).check(z.regex(/^[0-9a-f]{32}$/, 'Choose a device from the list'))),
});
export type EndSessionsInput = z.infer<typeof endSessionsInputSchema>;

/** A link to confirm a new address works for a day, once; asking again voids the one before. */
export const EMAIL_CHANGE_TTL_MS = 24 * 60 * 60 * 1000;

/** A new sign-in address, with the password typed again (OWASP ASVS 4.0 V3.7.1). */
export const changeEmailInputSchema = z.strictObject({
  newEmail: emailSchema,
  password: passwordAgainSchema,
});
export type ChangeEmailInput = z.infer<typeof changeEmailInputSchema>;

/** The secret from the link sent to the new address. */
export const confirmEmailChangeSchema = z.strictObject({
  token: z.string({ error: 'The link is incomplete' }).check(z.minLength(20, 'The link is incomplete'), z.maxLength(200)),
});
export type ConfirmEmailChange = z.infer<typeof confirmEmailChangeSchema>;

/** A change of address waiting for its link to be opened, or none. */
export interface PendingEmailChange {
  pending: { email: string; expiresAt: string } | null;
}

/** The query parameter the link sets on the settings page: /settings?email-link=… */
export const EMAIL_LINK_PARAM = 'email-link';

/** Closing one's own account, with the password typed again (OWASP ASVS 4.0 V8.3.2: data removed on demand). */
export const closeAccountInputSchema = z.strictObject({ password: passwordAgainSchema });
export type CloseAccountInput = z.infer<typeof closeAccountInputSchema>;

export { CLOSED_ACCOUNT_NAME } from './person-name';

import * as z from '../zod';
import { isCommonPassword } from './common-passwords';
import { emailSchema } from './auth.schema';

/** OWASP ASVS 4.0 V2.1.1 (at least 12 characters) and V2.1.2 (128 allowed, no more). */
export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 128;

/** What a new password must be, as the forms say it (registration, reset, change). */
export const NEW_PASSWORD_HINT = `${PASSWORD_MIN} to ${PASSWORD_MAX} characters. A few unrelated words make a strong one.`;

export const newPasswordSchema = z
  .string({ error: 'Choose a password' })
  .check(
    z.minLength(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`),
    z.maxLength(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`),
    z.refine((p) => !isCommonPassword(p), 'This password appears in lists of breached passwords; choose another'),
  );

export const registerInputSchema = z.strictObject({
  email: emailSchema,
  password: newPasswordSchema,
  displayName: z
    .string({ error: 'Enter the name others will see' })
    .check(z.trim(), z.minLength(1, 'Enter the name others will see'), z.maxLength(80, 'Use at most 80 characters')),
});
export type RegisterInput = z.infer<typeof registerInputSchema>;

export const loginInputSchema = z.strictObject({
  email: emailSchema,
  // Only a length cap here: sign-in must not reveal the password rules of old accounts.
  password: z.string({ error: 'Enter your password' }).check(z.minLength(1, 'Enter your password'), z.maxLength(PASSWORD_MAX * 4)),
});
export type LoginInput = z.infer<typeof loginInputSchema>;

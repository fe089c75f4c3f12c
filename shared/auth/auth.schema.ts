import { z } from 'zod';
import { isCommonPassword } from './common-passwords';
import { QUANTITIES, QUANTITY_UNITS, unitPreferencesSchema, type UnitPreferences } from '../calc/units.calc';

export const ROLES = ['driver', 'shop_staff', 'team_captain', 'admin'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

/** OWASP ASVS 4.0 V2.1.1 (at least 12 characters) and V2.1.2 (128 allowed, no more). */
export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 128;

export const emailSchema = z
  .string({ error: 'Enter your e-mail address' })
  .trim()
  .toLowerCase()
  .max(254, 'An e-mail address has at most 254 characters')
  .pipe(z.email({ error: 'Enter a valid e-mail address' }));

export const newPasswordSchema = z
  .string({ error: 'Choose a password' })
  .min(PASSWORD_MIN, `Use at least ${PASSWORD_MIN} characters`)
  .max(PASSWORD_MAX, `Use at most ${PASSWORD_MAX} characters`)
  .refine((p) => !isCommonPassword(p), 'This password appears in lists of breached passwords; choose another');

export const registerInputSchema = z.strictObject({
  email: emailSchema,
  password: newPasswordSchema,
  displayName: z
    .string({ error: 'Enter the name others will see' })
    .trim()
    .min(1, 'Enter the name others will see')
    .max(80, 'Use at most 80 characters'),
});
export type RegisterInput = z.infer<typeof registerInputSchema>;

export const loginInputSchema = z.strictObject({
  email: emailSchema,
  // Only a length cap here: sign-in must not reveal the password rules of old accounts.
  password: z.string({ error: 'Enter your password' }).min(1, 'Enter your password').max(PASSWORD_MAX * 4),
});
export type LoginInput = z.infer<typeof loginInputSchema>;

/** What each user sets for themselves; stored as given, read through this schema so defaults fill gaps. */
export const preferencesSchema = z.object({
  units: unitPreferencesSchema.default(unitPreferencesSchema.parse({})),
});
export type Preferences = z.infer<typeof preferencesSchema>;

/** A change of some preferences; what is not sent stays as it was (so no defaults here). */
const unitChoicesSchema = z.strictObject(
  Object.fromEntries(
    QUANTITIES.map((q) => [q, z.enum(QUANTITY_UNITS[q] as readonly [string, ...string[]], { error: `Pick one of ${QUANTITY_UNITS[q].join(', ')}` }).optional()]),
  ),
) as unknown as z.ZodType<Partial<UnitPreferences>>;

export const updatePreferencesInputSchema = z.strictObject({ units: unitChoicesSchema.optional() });
export type UpdatePreferencesInput = z.infer<typeof updatePreferencesInputSchema>;

export const userSchema = z.object({
  id: z.string(),
  email: z.string(),
  displayName: z.string(),
  roles: z.array(roleSchema),
  preferences: preferencesSchema,
});
export type User = z.infer<typeof userSchema>;

export const userResponseSchema = z.object({ user: userSchema });
export const csrfResponseSchema = z.object({ token: z.string() });

import * as z from '../zod';
import { isCommonPassword } from './common-passwords';
import { QUANTITIES, QUANTITY_UNITS, unitPreferencesSchema, type UnitPreferences } from '../calc/units.calc';

export const ROLES = ['driver', 'shop_staff', 'team_captain', 'admin'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

/** OWASP ASVS 4.0 V2.1.1 (at least 12 characters) and V2.1.2 (128 allowed, no more). */
export const PASSWORD_MIN = 12;
export const PASSWORD_MAX = 128;

export const emailSchema = z.pipe(
  z
    .string({ error: 'Enter your e-mail address' })
    .check(z.trim(), z.toLowerCase(), z.maxLength(254, 'An e-mail address has at most 254 characters')),
  z.email({ error: 'Enter a valid e-mail address' }),
);

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

/** What each user sets for themselves; stored as given, read through this schema so defaults fill gaps. */
export const preferencesSchema = z.object({
  units: z._default(unitPreferencesSchema, unitPreferencesSchema.parse({})),
});
export type Preferences = z.infer<typeof preferencesSchema>;

/** A change of some preferences; what is not sent stays as it was (so no defaults here). */
const unitChoicesSchema = z.strictObject(
  Object.fromEntries(
    QUANTITIES.map((q) => [q, z.optional(z.enum(QUANTITY_UNITS[q] as readonly [string, ...string[]], { error: `Pick one of ${QUANTITY_UNITS[q].join(', ')}` }))]),
  ),
) as unknown as z.ZodMiniType<Partial<UnitPreferences>>;

export const updatePreferencesInputSchema = z.strictObject({ units: z.optional(unitChoicesSchema) });
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

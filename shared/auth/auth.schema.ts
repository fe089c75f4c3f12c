/**
 * The signed-in user, roles and preferences: what every page reads. The sign-in and register
 * inputs (and the breached-password list they need) are in credentials.schema.ts, so only those
 * two pages download them.
 */
import * as z from '../zod';
import { QUANTITIES, QUANTITY_UNITS, unitPreferencesSchema, type UnitPreferences } from '../calc/units.calc';

export const ROLES = ['driver', 'shop_staff', 'team_captain', 'admin'] as const;
export const roleSchema = z.enum(ROLES);
export type Role = z.infer<typeof roleSchema>;

export const emailSchema = z.pipe(
  z
    .string({ error: 'Enter your e-mail address' })
    .check(z.trim(), z.toLowerCase(), z.maxLength(254, 'An e-mail address has at most 254 characters')),
  z.email({ error: 'Enter a valid e-mail address' }),
);

/** What each user sets for themselves; stored as given, read through this schema so defaults fill gaps. */
export const preferencesSchema = z.object({
  units: z._default(unitPreferencesSchema, unitPreferencesSchema.parse({})),
  /** E-mails about comments, suggestions and shop grants; the in-app notifications stay either way. */
  emailNotifications: z._default(z.boolean(), true),
});
export type Preferences = z.infer<typeof preferencesSchema>;

/** A change of some preferences; what is not sent stays as it was (so no defaults here). */
const unitChoicesSchema = z.strictObject(
  Object.fromEntries(
    QUANTITIES.map((q) => [q, z.optional(z.enum(QUANTITY_UNITS[q] as readonly [string, ...string[]], { error: `Pick one of ${QUANTITY_UNITS[q].join(', ')}` }))]),
  ),
) as unknown as z.ZodMiniType<Partial<UnitPreferences>>;

export const updatePreferencesInputSchema = z.strictObject({
  units: z.optional(unitChoicesSchema),
  emailNotifications: z.optional(z.boolean({ error: 'Choose on or off' })),
});
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
/** `GET /api/auth/session`: the signed-in user, or null. */
export const sessionResponseSchema = z.object({ user: z.nullable(userSchema) });
export const csrfResponseSchema = z.object({ token: z.string() });

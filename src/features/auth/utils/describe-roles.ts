import type { Role } from '@shared/auth/auth.schema';

const ROLE_WORDS: Record<Role, string> = {
  driver: 'driver',
  shop_staff: 'shop staff',
  team_captain: 'team captain',
  admin: 'administrator',
};

/** "driver and team captain" — the account's roles as a phrase, in the app's language. */
export function describeRoles(roles: readonly Role[], locale = 'en'): string | null {
  if (roles.length === 0) return null;
  return new Intl.ListFormat(locale, { style: 'long', type: 'conjunction' }).format(roles.map((r) => ROLE_WORDS[r]));
}

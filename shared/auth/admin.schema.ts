import * as z from '../zod';
import type { Role } from './auth.schema';

/*
 * What the `admin` role does: look through the accounts, suspend or restore one's sign-in, and give or take
 * the role itself. An admin sees no cars, shops or teams through this (docs/api.md, the access table).
 */

/** At most this many accounts come back at once; the search narrows the rest down. */
export const ACCOUNT_LIST_LIMIT = 100;
export const SUSPENSION_NOTE_MAX = 500;

export const accountListQuerySchema = z.strictObject({
  q: z.optional(z.string().check(z.trim(), z.maxLength(80, 'Use at most 80 characters'))),
});
export type AccountListQuery = z.infer<typeof accountListQuerySchema>;

/** One account as an admin sees it. */
export interface AdminAccount {
  id: string;
  email: string;
  displayName: string;
  roles: Role[];
  createdAt: string;
  /** Set while the account may not sign in. */
  suspendedAt: string | null;
  /** Why, as the admin who suspended it wrote it. */
  suspensionNote: string | null;
  /** Sessions signed in now (none while suspended). */
  signedInDevices: number;
}

export interface AdminAccountList {
  items: AdminAccount[];
  count: number;
  /** Every account the search matches; more than `count` when the list was cut at ACCOUNT_LIST_LIMIT. */
  total: number;
}

export const suspendAccountInputSchema = z.strictObject({
  note: z
    .string({ error: 'Say why, for the next admin who reads this' })
    .check(
      z.trim(),
      z.minLength(1, 'Say why, for the next admin who reads this'),
      z.maxLength(SUSPENSION_NOTE_MAX, `Use at most ${SUSPENSION_NOTE_MAX} characters`),
    ),
});
export type SuspendAccountInput = z.infer<typeof suspendAccountInputSchema>;

/** Gives or takes the `admin` role. */
export const setAdminInputSchema = z.strictObject({
  isAdmin: z.boolean({ error: 'Choose yes or no' }),
});
export type SetAdminInput = z.infer<typeof setAdminInputSchema>;

/** An admin closing a suspended account types its address again, as the confirmation. */
export const closeAccountByAdminInputSchema = z.strictObject({
  email: z
    .string({ error: 'Type the account’s e-mail address' })
    .check(z.trim(), z.toLowerCase(), z.minLength(1, 'Type the account’s e-mail address'), z.maxLength(254, 'An e-mail address has at most 254 characters')),
});
export type CloseAccountByAdminInput = z.infer<typeof closeAccountByAdminInputSchema>;

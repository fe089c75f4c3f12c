import * as z from '../zod';
import { emailSchema } from '../auth/auth.schema';

const name = z.string({ error: 'Enter a name' }).check(z.trim(), z.minLength(1, 'Enter a name'), z.maxLength(80, 'Use at most 80 characters'));

export const createShopInputSchema = z.strictObject({ name });
export type CreateShopInput = z.infer<typeof createShopInputSchema>;

/** The owner lets a shop see the car's season, comment and suggest. */
export const grantShopInputSchema = z.strictObject({ shopId: z.uuid({ error: 'Pick a shop' }) });
export type GrantShopInput = z.infer<typeof grantShopInputSchema>;

export const inviteInputSchema = z.strictObject({
  email: emailSchema,
  /** Shop: may invite and remove staff. Team: captain. */
  asAdmin: z._default(z.boolean(), false),
});
export type InviteInput = z.infer<typeof inviteInputSchema>;

export const INVOICE_DETAILS_MAX = 500;
export const INVOICE_DETAILS_MAX_LINES = 8;

/** The ISO 4217 currencies the platform can write amounts in (ECMA-402 `Intl.supportedValuesOf`), in lower case. */
const CURRENCIES = new Set(Intl.supportedValuesOf('currency').map((c) => c.toLowerCase()));

/** What a shop sets for its own bench: invoice tax and currency, and the build sheet's compressed-length tolerance. */
export const updateShopSettingsInputSchema = z.strictObject({
  taxRatePct: z.optional(
    z.number({ error: 'Enter the tax rate as a number' }).check(
      z.gte(0, 'The tax rate must be between 0 and 50 %'),
      z.lte(50, 'The tax rate must be between 0 and 50 %'),
      z.refine((v) => Math.abs(v * 1000 - Math.round(v * 1000)) < 1e-6, 'Use at most three decimals, e.g. 8.875'),
    ),
  ),
  currency: z.optional(
    z
      .string({ error: 'Enter a currency code such as USD' })
      .check(
        z.trim(),
        z.toLowerCase(),
        z.regex(/^[a-z]{3}$/, 'Use a three-letter currency code such as USD or EUR'),
        z.refine((code) => !/^[a-z]{3}$/.test(code) || CURRENCIES.has(code), 'That is not a currency code (ISO 4217) this app knows; use one such as USD or EUR'),
      ),
  ),
  compressedLengthToleranceMm: z.optional(
    z.number({ error: 'Enter the tolerance in mm' }).check(
      z.gte(0, 'The tolerance must be between 0 and 100 mm'),
      z.lte(100, 'The tolerance must be between 0 and 100 mm'),
    ),
  ),
  /** The lines printed under the shop's name on its invoices: address, telephone, tax number. */
  invoiceDetails: z.optional(
    z.string({ error: 'Enter the lines as text' }).check(
      z.trim(),
      z.maxLength(INVOICE_DETAILS_MAX, `Use at most ${INVOICE_DETAILS_MAX} characters`),
      z.refine((v) => v.split('\n').length <= INVOICE_DETAILS_MAX_LINES, `Use at most ${INVOICE_DETAILS_MAX_LINES} lines`),
    ),
  ),
});
export type UpdateShopSettingsInput = z.infer<typeof updateShopSettingsInputSchema>;

export interface ShopSettings {
  /** Percent added to invoices, e.g. 8.875. */
  taxRatePct: number;
  /** ISO 4217 code, lower case as the payment service uses it, e.g. 'usd'. */
  currency: string;
  /** How much shorter than the reference a damper's compressed length may be before the build sheet warns, mm. */
  compressedLengthToleranceMm: number;
  /** Printed under the shop's name on invoices made from now on; '' for none. */
  invoiceDetails: string;
}

export interface ShopSummary {
  id: string;
  name: string;
}

export interface StaffMember {
  id: string;
  displayName: string;
  email: string;
  isShopAdmin: boolean;
}

/** A shop as its staff see it. */
export interface Shop extends ShopSummary {
  staff: StaffMember[];
  /** The signed-in user's standing. */
  isShopAdmin: boolean;
  pendingInvitations: { email: string; asAdmin: boolean; expiresAt: string }[];
  settings: ShopSettings;
}

/** A shop one of the user's shops: for the shop switcher. */
export interface MyShop extends ShopSummary {
  isShopAdmin: boolean;
  customerCount: number;
}

export interface ShopGrant {
  shop: ShopSummary;
  grantedBy: { id: string; displayName: string };
  createdAt: string;
}

/** A car granted to the shop, with what happened last. */
export interface Customer {
  car: { id: string; name: string; classCode: string; carNumber: string | null };
  owner: { id: string; displayName: string };
  grantedAt: string;
  /** The latest of: a run, a setup snapshot, a tread reading, a comment. */
  latestActivity: { at: string; kind: 'run' | 'setup' | 'tread_reading' | 'comment'; summary: string } | null;
  openSuggestions: number;
}

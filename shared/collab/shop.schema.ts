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

import type { DataSource, EntityManager } from 'typeorm';
import type { MailSettings } from '../../mail/mailer';

export interface NewInvitation {
  shopId?: string;
  teamId?: string;
  email: string;
  /** Shop: shop admin. Team: captain. */
  asAdmin: boolean;
  invitedBy: { id: string; displayName: string };
}

/**
 * Records an invitation (token stored only as a hash, valid 7 days, once) and e-mails
 * the link. Access to the shop or team is checked by the caller.
 * Placeholder until the invitation feature lands.
 */
export async function createInvitation(
  _db: DataSource | EntityManager,
  _mail: MailSettings | undefined,
  _invite: NewInvitation,
): Promise<{ email: string; asAdmin: boolean; expiresAt: string }> {
  throw new Error('not implemented yet');
}

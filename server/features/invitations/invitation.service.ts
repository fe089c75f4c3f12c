import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import { INVITATION_TTL_MS, type AcceptedInvitation, type InvitationPreview } from '@shared/collab/invitation.schema';
import { AppError, notFound } from '../../lib/app-error';
import { hashSecretToken, newSecretToken } from '../../lib/secret-token';
import { sendInBackground, type MailSettings } from '../../mail/mailer';
import { renderMail } from '../../mail/templates';

export interface NewInvitation {
  shopId?: string;
  teamId?: string;
  email: string;
  /** Shop: shop admin. Team: captain. */
  asAdmin: boolean;
  invitedBy: { id: string; displayName: string };
}

type Kind = 'shop' | 'team';

const TARGETS = {
  shop: { table: 'shops', column: 'shop_id', members: 'shop_members', adminColumn: 'is_shop_admin', adminLabel: 'a shop admin' },
  team: { table: 'teams', column: 'team_id', members: 'team_members', adminColumn: 'is_captain', adminLabel: 'team captain' },
} as const;

/** The link in the e-mail, on the client page that previews and accepts it. */
export const invitationUrl = (publicUrl: string, token: string) => `${publicUrl}/invitations/${encodeURIComponent(token)}`;

export function invitationMail(o: { inviter: string; kind: Kind; name: string; email: string; asAdmin: boolean; url: string }) {
  const what = o.kind === 'shop' ? `the shop ${o.name}` : `the team ${o.name}`;
  const role = o.asAdmin ? ` as ${TARGETS[o.kind].adminLabel}` : '';
  return renderMail({
    subject: `${o.inviter} invites you to join ${o.name} on Scrubline`,
    paragraphs: [
      `${o.inviter} invites you to join ${what}${role} on Scrubline, the season notebook for runs, setups and tyres.`,
      `To accept, open the link and sign in (or create an account) with this address: ${o.email}. The link works once, within 7 days.`,
    ],
    action: { label: 'Open the invitation', url: o.url },
    footer: 'You got this e-mail because someone entered your address in Scrubline. If you did not expect it, ignore it: nothing changes unless you accept.',
  });
}

/**
 * Records an invitation (token stored only as a hash, valid 7 days, once) and e-mails
 * the link. Inviting the same address to the same shop or team again replaces the
 * older unused invitation. Access to the shop or team is checked by the caller.
 */
export async function createInvitation(
  db: DataSource | EntityManager,
  mail: MailSettings | undefined,
  invite: NewInvitation,
): Promise<{ email: string; asAdmin: boolean; expiresAt: string }> {
  const kind: Kind = invite.shopId ? 'shop' : 'team';
  const targetId = invite.shopId ?? invite.teamId;
  if (!targetId || (invite.shopId && invite.teamId)) throw new Error('createInvitation needs exactly one of shopId and teamId');
  const target = TARGETS[kind];
  const email = invite.email.trim().toLowerCase();
  const { token, hash } = newSecretToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);

  const name = await db.transaction(async (m) => {
    const found = await lockTarget(m, kind, targetId);
    if (!found) throw notFound(kind === 'shop' ? 'That shop' : 'That team');
    await m.query(`DELETE FROM invitations WHERE ${target.column} = $1 AND email = $2 AND used_at IS NULL`, [targetId, email]);
    await m.query(
      `INSERT INTO invitations (token_hash, ${target.column}, email, as_admin, invited_by, expires_at) VALUES ($1, $2, $3, $4, $5, $6)`,
      [hash, targetId, email, invite.asAdmin, invite.invitedBy.id, expiresAt],
    );
    return found.name;
  });

  if (mail) {
    const content = invitationMail({
      inviter: invite.invitedBy.displayName,
      kind,
      name,
      email,
      asAdmin: invite.asAdmin,
      url: invitationUrl(mail.publicUrl, token),
    });
    sendInBackground(mail, { to: email, ...content });
  }
  return { email, asAdmin: invite.asAdmin, expiresAt: expiresAt.toISOString() };
}

/**
 * Locks a shop's or team's row for a change of its people: adding someone (an invitation, an acceptance), removing or
 * demoting someone. Every such change takes this lock first and the invitations' rows after it, so two of them never
 * wait on each other in opposite orders.
 */
export async function lockTarget(m: EntityManager, kind: Kind, targetId: string): Promise<{ name: string } | undefined> {
  const rows: { name: string }[] = await m.query(`SELECT name FROM ${TARGETS[kind].table} WHERE id = $1 FOR UPDATE`, [targetId]);
  return rows[0];
}

/**
 * Withdraws the open invitations someone sent to a shop or team they no longer manage (removed, or no longer its
 * admin or captain): the standing they handed on was theirs to give only while they held it. Run in the
 * transaction that takes it from them.
 */
export async function withdrawInvitationsBy(m: EntityManager, kind: Kind, targetId: string, senderId: string): Promise<void> {
  await m.query(`DELETE FROM invitations WHERE ${TARGETS[kind].column} = $1 AND invited_by = $2 AND used_at IS NULL`, [targetId, senderId]);
}

interface InvitationRow {
  id: string;
  shop_id: string | null;
  team_id: string | null;
  email: string;
  as_admin: boolean;
  expires_at: Date;
  used_at: Date | null;
  name: string;
  invited_by: string;
  invited_by_name: string;
  expired: boolean;
}

const SELECT_INVITATION = `
  SELECT i.id, i.shop_id, i.team_id, i.email, i.as_admin, i.expires_at, i.used_at, i.invited_by,
         COALESCE(s.name, t.name) AS name, u.display_name AS invited_by_name, i.expires_at <= now() AS expired
  FROM invitations i
  LEFT JOIN shops s ON s.id = i.shop_id
  LEFT JOIN teams t ON t.id = i.team_id
  JOIN users u ON u.id = i.invited_by
  WHERE i.token_hash = $1`;

const kindOf = (row: InvitationRow): Kind => (row.shop_id ? 'shop' : 'team');

/** What the link shows before it is accepted; anyone with the link may see it. */
export async function previewInvitation(ds: DataSource, token: string): Promise<InvitationPreview> {
  const rows: InvitationRow[] = await ds.query(SELECT_INVITATION, [hashSecretToken(token)]);
  const row = rows[0];
  if (!row) throw notFound('That invitation');
  return {
    kind: kindOf(row),
    name: row.name,
    email: row.email,
    asAdmin: row.as_admin,
    invitedBy: row.invited_by_name,
    expiresAt: new Date(row.expires_at).toISOString(),
    state: row.used_at ? 'used' : row.expired ? 'expired' : 'open',
  };
}

/**
 * Joins the signed-in user to the shop or team, as staff/member or as admin/captain.
 * Works once, before it expires, and only for the account with the invited address.
 * Membership and "used" are written in one transaction; an existing member keeps
 * the higher standing. Only an invitation whose sender still manages the shop or team
 * stands: one sent by someone since removed or demoted is refused.
 */
export async function acceptInvitation(ds: DataSource, user: User, token: string): Promise<AcceptedInvitation> {
  const hash = hashSecretToken(token);
  return ds.transaction(async (m) => {
    // Locks in the order every change of a shop's or team's people takes them (see lockTarget): the shop or team
    // first, then the invitation, read again under its lock. The other order can deadlock with taking the sender off.
    const found: Pick<InvitationRow, 'shop_id' | 'team_id'>[] = await m.query('SELECT shop_id, team_id FROM invitations WHERE token_hash = $1', [hash]);
    if (!found[0]) throw notFound('That invitation');
    const targetKind = kindOf(found[0] as InvitationRow);
    await lockTarget(m, targetKind, (found[0].shop_id ?? found[0].team_id)!);
    const rows: InvitationRow[] = await m.query(`${SELECT_INVITATION} FOR UPDATE OF i`, [hash]);
    const row = rows[0];
    if (!row) throw notFound('That invitation');
    if (row.used_at) throw new AppError('conflict', 'This invitation has already been used. Ask for a new one if you still need to join.');
    if (row.expired) throw new AppError('gone', 'This invitation has expired. Ask for a new one.');
    if (row.email !== user.email.toLowerCase()) {
      throw new AppError('forbidden', `This invitation is for ${row.email}. Sign in with that address to accept it.`);
    }
    const kind = kindOf(row);
    const target = TARGETS[kind];
    const targetId = (row.shop_id ?? row.team_id)!;
    // The sender's standing, as it is with the shop or team locked.
    const sender: unknown[] = await m.query(
      `SELECT 1 FROM ${target.members} WHERE ${target.column} = $1 AND user_id = $2 AND ${target.adminColumn}`,
      [targetId, row.invited_by],
    );
    if (sender.length === 0) {
      throw new AppError(
        'gone',
        `This invitation no longer stands: ${row.invited_by_name} is no longer ${kind === 'shop' ? 'an admin of' : 'a captain of'} ${row.name}. Ask one of its ${kind === 'shop' ? 'admins' : 'captains'} for a new one.`,
      );
    }
    await m.query(
      `INSERT INTO ${target.members} (${target.column}, user_id, ${target.adminColumn}) VALUES ($1, $2, $3)
       ON CONFLICT (${target.column}, user_id) DO UPDATE SET ${target.adminColumn} = ${target.members}.${target.adminColumn} OR EXCLUDED.${target.adminColumn}`,
      [targetId, user.id, row.as_admin],
    );
    await m.query(`UPDATE invitations SET used_at = now(), used_by = $2 WHERE id = $1`, [row.id, user.id]);
    return { kind, id: targetId, name: row.name };
  });
}

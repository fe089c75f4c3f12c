import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type {
  CreateShopInput, Customer, InviteInput, MyShop, Shop, ShopGrant, ShopSummary, UpdateShopSettingsInput,
} from '@shared/collab/shop.schema';
import { AppError } from '../../lib/app-error';
import { assertCarAccess, assertShopAccess, type Queryable } from '../../auth/access';
import type { MailSettings } from '../../mail/mailer';
import { createInvitation, lockTarget, withdrawInvitationsBy } from '../invitations/invitation.service';
import { actorLabel, carAudience, notify, sendOutbox, staffRecipients } from '../notifications/notify';

/** How many shops the picker lists at most; the name filter narrows it. */
const SHOP_LIST_LIMIT = 50;

/** Shop names and ids, for a driver picking a shop to grant. Anyone signed in may list them. */
export async function listShops(ds: DataSource, q: string | undefined): Promise<ShopSummary[]> {
  const filter = q?.trim();
  const like = filter ? `%${filter.replace(/[\\%_]/g, (c) => `\\${c}`)}%` : null;
  return ds.query(
    `SELECT id, name FROM shops WHERE $1::text IS NULL OR name ILIKE $1 ORDER BY lower(name), id LIMIT ${SHOP_LIST_LIMIT}`,
    [like],
  );
}

/** Opens a shop; its creator is its first shop admin. */
export async function createShop(ds: DataSource, user: User, input: CreateShopInput): Promise<Shop> {
  const shopId = await ds.transaction(async (m) => {
    const rows: { id: string }[] = await m.query('INSERT INTO shops (name) VALUES ($1) RETURNING id', [input.name]);
    await m.query('INSERT INTO shop_members (shop_id, user_id, is_shop_admin) VALUES ($1, $2, true)', [rows[0]!.id, user.id]);
    return rows[0]!.id;
  });
  return loadShop(ds, user, shopId);
}

/** The shops the user works at, with how many cars each looks after. */
export async function myShops(ds: DataSource, user: User): Promise<MyShop[]> {
  const rows: { id: string; name: string; is_shop_admin: boolean; customer_count: number }[] = await ds.query(
    `SELECT s.id, s.name, m.is_shop_admin,
            (SELECT count(*)::int FROM shop_grants g WHERE g.shop_id = s.id) AS customer_count
       FROM shop_members m JOIN shops s ON s.id = m.shop_id
      WHERE m.user_id = $1 ORDER BY lower(s.name), s.id`,
    [user.id],
  );
  return rows.map((r) => ({ id: r.id, name: r.name, isShopAdmin: r.is_shop_admin, customerCount: r.customer_count }));
}

export async function getShop(ds: DataSource, user: User, shopId: string): Promise<Shop> {
  await assertShopAccess(ds, user, shopId, 'read');
  return loadShop(ds, user, shopId);
}

/**
 * A shop admin sets the shop's tax rate, currency, build-sheet tolerance and the lines its invoices print under its
 * name; fields left out stay as they are. Invoices already made keep what they were made with.
 */
export async function updateShopSettings(ds: DataSource, user: User, shopId: string, input: UpdateShopSettingsInput): Promise<Shop> {
  await assertShopAccess(ds, user, shopId, 'manage');
  // Prices are kept in the currency's smallest unit, so a visit priced in dollars and not yet invoiced would read
  // as yen (a hundred times over) or as euros after the change: the currency changes only when no such visit has a
  // price. Checked in the same statement as the write (wrapped in a SELECT: TypeORM answers a bare UPDATE … RETURNING
  // with [rows, count]).
  const updated: { currency: string }[] = await ds.query(
    `WITH done AS (
       UPDATE shops SET tax_rate_pct = COALESCE($2, tax_rate_pct), currency = COALESCE($3, currency),
              compressed_length_tolerance_mm = COALESCE($4, compressed_length_tolerance_mm),
              invoice_details = COALESCE($5, invoice_details)
        WHERE id = $1
          AND ($3::text IS NULL OR $3 = currency OR NOT EXISTS (
                SELECT 1 FROM work_orders w JOIN work_order_lines l ON l.work_order_id = w.id
                 WHERE w.shop_id = $1 AND l.unit_price_cents > 0 AND NOT EXISTS (SELECT 1 FROM invoices i WHERE i.work_order_id = w.id)))
        RETURNING currency
     ) SELECT currency FROM done`,
    [shopId, input.taxRatePct ?? null, input.currency ?? null, input.compressedLengthToleranceMm ?? null, input.invoiceDetails ?? null],
  );
  if (updated.length === 0) {
    const [shop] = (await ds.query('SELECT currency FROM shops WHERE id = $1', [shopId])) as { currency: string }[];
    if (!shop) throw new AppError('not_found', 'That shop was not found.');
    const was = shop.currency.toUpperCase();
    throw new AppError('validation_failed', 'Nothing was saved.', {
      currency: [`Visits not yet invoiced have prices in ${was}. Invoice them, or clear their prices, before changing the currency`],
    });
  }
  return loadShop(ds, user, shopId);
}

async function loadShop(db: Queryable, user: User, shopId: string): Promise<Shop> {
  const shops: {
    id: string;
    name: string;
    tax_rate_pct: number;
    currency: string;
    compressed_length_tolerance_mm: number;
    invoice_details: string;
  }[] = await db.query(
    'SELECT id, name, tax_rate_pct, currency, compressed_length_tolerance_mm, invoice_details FROM shops WHERE id = $1',
    [shopId],
  );
  const shop = shops[0];
  if (!shop) throw new AppError('not_found', 'That shop was not found.');
  const staff: { id: string; display_name: string; email: string; is_shop_admin: boolean }[] = await db.query(
    `SELECT u.id, u.display_name, u.email, m.is_shop_admin
       FROM shop_members m JOIN users u ON u.id = m.user_id
      WHERE m.shop_id = $1 ORDER BY m.is_shop_admin DESC, lower(u.display_name), u.id`,
    [shopId],
  );
  const invitations: { email: string; as_admin: boolean; expires_at: Date }[] = await db.query(
    `SELECT email, as_admin, expires_at FROM invitations
      WHERE shop_id = $1 AND used_at IS NULL AND expires_at > now() ORDER BY created_at`,
    [shopId],
  );
  return {
    id: shop.id,
    name: shop.name,
    staff: staff.map((s) => ({ id: s.id, displayName: s.display_name, email: s.email, isShopAdmin: s.is_shop_admin })),
    isShopAdmin: staff.some((s) => s.id === user.id && s.is_shop_admin),
    pendingInvitations: invitations.map((i) => ({ email: i.email, asAdmin: i.as_admin, expiresAt: i.expires_at.toISOString() })),
    settings: {
      taxRatePct: shop.tax_rate_pct,
      currency: shop.currency,
      compressedLengthToleranceMm: shop.compressed_length_tolerance_mm,
      invoiceDetails: shop.invoice_details,
    },
  };
}

interface CustomerRow {
  car_id: string;
  car_name: string;
  class_code: string;
  car_number: string | null;
  owner_id: string;
  owner_name: string;
  granted_at: Date;
  activity_at: Date | null;
  activity_kind: NonNullable<Customer['latestActivity']>['kind'] | null;
  activity_summary: string | null;
  open_suggestions: number;
}

/**
 * Every car granted to the shop, in one statement: the owner, when the grant was made,
 * the newest of the car's runs, setup snapshots, tread readings and comments (runs,
 * snapshots and readings by when they happened, never later than when they were
 * recorded), and how many of the shop's suggestions are still open.
 */
export async function listCustomers(ds: DataSource, user: User, shopId: string): Promise<Customer[]> {
  await assertShopAccess(ds, user, shopId, 'read');
  const rows: CustomerRow[] = await ds.query(
    `SELECT c.id AS car_id, c.name AS car_name, c.class_code, c.car_number,
            o.id AS owner_id, o.display_name AS owner_name, g.created_at AS granted_at,
            la.at AS activity_at, la.kind AS activity_kind, la.summary AS activity_summary,
            (SELECT count(*)::int FROM setup_suggestions s WHERE s.car_id = c.id AND s.shop_id = g.shop_id AND s.status = 'open') AS open_suggestions
       FROM shop_grants g
       JOIN cars c ON c.id = g.car_id
       JOIN users o ON o.id = c.owner_id
       LEFT JOIN LATERAL (
         SELECT x.at, x.kind, x.summary FROM (
           (SELECT LEAST(r.recorded_at, r.created_at) AS at, 'run' AS kind,
                   d.display_name || '’s run ' || r.run_number || ' at ' || e.name AS summary
              FROM runs r JOIN events e ON e.id = r.event_id JOIN users d ON d.id = r.driver_id
             WHERE r.car_id = c.id ORDER BY 1 DESC LIMIT 1)
           UNION ALL
           (SELECT LEAST(s.effective_from, s.created_at), 'setup', 'New setup “' || s.label || '”'
              FROM setup_snapshots s WHERE s.car_id = c.id ORDER BY 1 DESC LIMIT 1)
           UNION ALL
           (SELECT LEAST(t.taken_at, t.created_at), 'tread_reading', 'Tread reading on ' || ts.label
              FROM tread_readings t JOIN tyre_sets ts ON ts.id = t.tyre_set_id
             WHERE ts.car_id = c.id ORDER BY 1 DESC LIMIT 1)
           UNION ALL
           (SELECT k.created_at, 'comment',
                   a.display_name || ' commented: “' || CASE WHEN length(k.body) > 80 THEN left(k.body, 79) || '…' ELSE k.body END || '”'
              FROM comments k JOIN users a ON a.id = k.author_id
             -- Another shop's service visit is not this shop's to read, nor its thread.
             WHERE k.car_id = c.id
               AND (k.work_order_id IS NULL OR EXISTS (SELECT 1 FROM work_orders w WHERE w.id = k.work_order_id AND w.shop_id = g.shop_id))
             ORDER BY k.created_at DESC LIMIT 1)
         ) x ORDER BY x.at DESC LIMIT 1
       ) la ON true
      WHERE g.shop_id = $1
      ORDER BY la.at DESC NULLS LAST, lower(c.name), c.id`,
    [shopId],
  );
  return rows.map((r) => ({
    car: { id: r.car_id, name: r.car_name, classCode: r.class_code, carNumber: r.car_number },
    owner: { id: r.owner_id, displayName: r.owner_name },
    grantedAt: r.granted_at.toISOString(),
    latestActivity: r.activity_at && r.activity_kind
      ? { at: r.activity_at.toISOString(), kind: r.activity_kind, summary: r.activity_summary ?? '' }
      : null,
    openSuggestions: r.open_suggestions,
  }));
}

/** A shop admin invites someone by e-mail, as staff or as another admin. */
export async function inviteStaff(ds: DataSource, mail: MailSettings | undefined, user: User, shopId: string, input: InviteInput) {
  await assertShopAccess(ds, user, shopId, 'manage');
  const already = await ds.query(
    'SELECT 1 FROM shop_members m JOIN users u ON u.id = m.user_id WHERE m.shop_id = $1 AND u.email = $2',
    [shopId, input.email],
  );
  if (already.length > 0) {
    throw new AppError('validation_failed', 'They already work here.', {
      email: ['They are already on the staff list'],
    });
  }
  return createInvitation(ds, mail, { shopId, email: input.email, asAdmin: input.asAdmin, invitedBy: { id: user.id, displayName: user.displayName } });
}

/**
 * A shop admin removes a member of staff; anyone may leave a shop themself. The last
 * shop admin cannot go, or nobody could manage the shop.
 */
export async function removeStaff(ds: DataSource, user: User, shopId: string, staffId: string): Promise<void> {
  await assertShopAccess(ds, user, shopId, staffId === user.id ? 'read' : 'manage');
  await ds.transaction(async (m) => {
    // The shop first, as every change of its people locks it (lockTarget), then its staff, so two admins removing
    // each other cannot leave it with none.
    await lockTarget(m, 'shop', shopId);
    const members: { user_id: string; is_shop_admin: boolean }[] = await m.query(
      'SELECT user_id, is_shop_admin FROM shop_members WHERE shop_id = $1 FOR UPDATE',
      [shopId],
    );
    const target = members.find((r) => r.user_id === staffId);
    if (!target) throw new AppError('not_found', 'That person is not on this shop\'s staff.');
    if (target.is_shop_admin && members.filter((r) => r.is_shop_admin).length === 1) {
      throw new AppError(
        'conflict',
        staffId === user.id
          ? 'You are this shop\'s only admin. Invite another admin before you leave, so someone can still manage the shop.'
          : 'This is the shop\'s only admin. Invite another admin first, so someone can still manage the shop.',
      );
    }
    await m.query('DELETE FROM shop_members WHERE shop_id = $1 AND user_id = $2', [shopId, staffId]);
    await withdrawInvitationsBy(m, 'shop', shopId, staffId);
  });
}

/* ---------- Grants: a car's owner lets a shop see the season ---------- */

const SELECT_GRANTS = `
  SELECT s.id AS shop_id, s.name AS shop_name, u.id AS granted_by, u.display_name AS granted_by_name, g.created_at
    FROM shop_grants g JOIN shops s ON s.id = g.shop_id JOIN users u ON u.id = g.granted_by
   WHERE g.car_id = $1`;

interface GrantRow {
  shop_id: string;
  shop_name: string;
  granted_by: string;
  granted_by_name: string;
  created_at: Date;
}

const toGrant = (r: GrantRow): ShopGrant => ({
  shop: { id: r.shop_id, name: r.shop_name },
  grantedBy: { id: r.granted_by, displayName: r.granted_by_name },
  createdAt: r.created_at.toISOString(),
});

export async function listGrants(ds: DataSource, user: User, carId: string): Promise<ShopGrant[]> {
  await assertCarAccess(ds, user, carId, 'read');
  const rows: GrantRow[] = await ds.query(`${SELECT_GRANTS} ORDER BY g.created_at, s.id`, [carId]);
  return rows.map(toGrant);
}

/**
 * The owner grants a shop: its staff may then read the season, comment and suggest.
 * Granting again changes nothing. The shop's staff hear about it.
 */
export async function grantShop(
  ds: DataSource,
  mail: MailSettings | undefined,
  user: User,
  carId: string,
  shopId: string,
): Promise<{ grant: ShopGrant; created: boolean }> {
  await assertCarAccess(ds, user, carId, 'manage');
  const shops: { name: string }[] = await ds.query('SELECT name FROM shops WHERE id = $1', [shopId]);
  if (!shops[0]) throw new AppError('validation_failed', 'Some fields need attention.', { shopId: ['No shop has that id; pick one from the list'] });
  const shopName = shops[0].name;
  const { created, outbox } = await ds.transaction(async (m) => {
    const inserted: unknown[] = await m.query(
      `INSERT INTO shop_grants (car_id, shop_id, granted_by) VALUES ($1, $2, $3) ON CONFLICT DO NOTHING RETURNING car_id`,
      [carId, shopId, user.id],
    );
    if (inserted.length === 0) return { created: false, outbox: [] };
    const audience = await carAudience(m, carId);
    const outbox = await notify(m, mail, {
      kind: 'shop_grant',
      actorId: user.id,
      carId,
      summary: `${actorLabel(user.displayName, null)} gave ${shopName} access to ${audience.carName}`,
      detail: 'Your shop can now see this car\'s season, comment on it and suggest setup changes.',
      recipients: staffRecipients(audience, { shopId }),
    });
    return { created: true, outbox };
  });
  sendOutbox(mail, outbox);
  const rows: GrantRow[] = await ds.query(`${SELECT_GRANTS} AND g.shop_id = $2`, [carId, shopId]);
  return { grant: toGrant(rows[0]!), created };
}

/** The owner takes a shop's access away; it ends at once. */
export async function revokeShop(ds: DataSource, user: User, carId: string, shopId: string): Promise<void> {
  await assertCarAccess(ds, user, carId, 'manage');
  const [, affected]: [unknown, number] = await ds.query('DELETE FROM shop_grants WHERE car_id = $1 AND shop_id = $2', [carId, shopId]);
  if (!affected) throw new AppError('not_found', 'That shop has no access to this car.');
}

import type { DataSource, EntityManager } from 'typeorm';
import { hashPassword } from '../auth/password';
import { UserEntity } from '../features/users/user.entity';
import { ShopEntity, ShopMemberEntity } from '../features/shops/shop.entity';
import { TeamEntity, TeamMemberEntity } from '../features/teams/team.entity';
import {
  DEMO_ACCOUNTS,
  DEMO_CLASS_FACTORS,
  DEMO_PASSWORD,
  DEMO_SEASON_YEAR,
  DEMO_SHOP,
  DEMO_SHOP_INVOICE_DETAILS,
  DEMO_SHOP_TAX_RATE_PCT,
  DEMO_TEAM,
} from './demo-accounts';
import { invoiceLineCents, invoiceTotals, roundedTaxRate } from '../../shared/calc/invoice.calc';
import { DEMO_CAMBER_ARMS_DATE, seedDemoSeason } from './demo-season';
import { findUserById } from '../features/users/user.service';
import { createComment } from '../features/comments/comment.service';
import { createSuggestion } from '../features/suggestions/suggestion.service';

/** Fills an empty database with the demo scenario; does nothing when any account exists. */
export async function seedDemoIfEmpty(ds: DataSource): Promise<boolean> {
  const rows = (await ds.query('SELECT count(*)::int AS count FROM users')) as { count: number }[];
  if ((rows[0]?.count ?? 0) > 0) return false;
  await seedDemo(ds);
  return true;
}

export async function seedDemo(ds: DataSource): Promise<void> {
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const ids = await ds.transaction(async (m) => {
    const users = m.getRepository(UserEntity);
    const ids = {} as Record<keyof typeof DEMO_ACCOUNTS, string>;
    for (const [key, account] of Object.entries(DEMO_ACCOUNTS) as [keyof typeof DEMO_ACCOUNTS, (typeof DEMO_ACCOUNTS)[keyof typeof DEMO_ACCOUNTS]][]) {
      const saved = await users.save(
        users.create({ email: account.email, displayName: account.displayName, passwordHash, isAdmin: key === 'admin' }),
      );
      ids[key] = saved.id;
    }
    const shop = await m.getRepository(ShopEntity).save({ name: DEMO_SHOP });
    // The demo shop charges an invented sales tax, so its invoices show how tax is added, and prints its address on them.
    await m.query('UPDATE shops SET tax_rate_pct = $2, invoice_details = $3 WHERE id = $1', [shop.id, DEMO_SHOP_TAX_RATE_PCT, DEMO_SHOP_INVOICE_DETAILS]);
    await m.getRepository(ShopMemberEntity).save({ shopId: shop.id, userId: ids.shopStaff, isShopAdmin: true });

    const team = await m.getRepository(TeamEntity).save({ name: DEMO_TEAM });
    await m.getRepository(TeamMemberEntity).save([
      { teamId: team.id, userId: ids.captain, isCaptain: true },
      { teamId: team.id, userId: ids.driver, isCaptain: false },
      { teamId: team.id, userId: ids.secondDriver, isCaptain: false },
      { teamId: team.id, userId: ids.classRival, isCaptain: false },
    ]);
    await seedDemoSeason(m, {
      driver: ids.driver,
      coDriver: ids.coDriver,
      secondDriver: ids.secondDriver,
      classRival: ids.classRival,
      shopStaff: ids.shopStaff,
      teamId: team.id,
    });
    await seedDemoCollaboration(m, ids, shop.id, team.id);
    await seedDemoServiceVisits(m, ids, shop.id);
    return ids;
  });
  await seedDemoReview(ds, ids);
}

/**
 * Who shares what in the demo: Maren lets the shop see Pebble; the three demo cars are entered
 * in the team, Pebble with its setup shared, the others with their results only. The captain
 * has entered this season's class factors for the team's own reckoning (invented numbers, as
 * the app ships none).
 */
async function seedDemoCollaboration(
  m: EntityManager,
  ids: Record<keyof typeof DEMO_ACCOUNTS, string>,
  shopId: string,
  teamId: string,
): Promise<void> {
  const cars: { id: string; owner_id: string; class_code: string }[] = await m.query(
    'SELECT id, owner_id, class_code FROM cars WHERE owner_id = ANY($1) ORDER BY created_at',
    [[ids.driver, ids.secondDriver, ids.classRival]],
  );
  const pebble = cars.find((c) => c.owner_id === ids.driver)!;
  await m.query('INSERT INTO shop_grants (car_id, shop_id, granted_by) VALUES ($1, $2, $3)', [pebble.id, shopId, ids.driver]);
  for (const car of cars) {
    await m.query(
      'INSERT INTO team_entries (team_id, car_id, class_code, sharing, entered_by) VALUES ($1, $2, $3, $4, $5)',
      [teamId, car.id, car.class_code, car.owner_id === ids.driver ? 'results_and_setup' : 'results', car.owner_id],
    );
  }
  for (const [classCode, factor] of DEMO_CLASS_FACTORS) {
    await m.query(
      'INSERT INTO team_class_factors (team_id, season, class_code, factor, updated_by) VALUES ($1, $2, $3, $4, $5)',
      [teamId, DEMO_SEASON_YEAR, classCode, factor, ids.captain],
    );
  }
}

/**
 * The shop's visits to Pebble: the mid-season camber-arm change, closed, handed over (linked to the setup snapshot
 * and change-log entries the season already holds), invoiced as the shop's number 1 and paid in cash; and a
 * coilover fit still open with its build sheet part-filled. Invented numbers.
 */
async function seedDemoServiceVisits(m: EntityManager, ids: Record<keyof typeof DEMO_ACCOUNTS, string>, shopId: string): Promise<void> {
  const [pebble]: { id: string }[] = await m.query('SELECT id FROM cars WHERE owner_id = $1 ORDER BY created_at LIMIT 1', [ids.driver]);
  const [arms]: { id: string; effective_from: Date }[] = await m.query(
    'SELECT id, effective_from FROM setup_snapshots WHERE car_id = $1 AND effective_from::date = $2 AND created_by = $3',
    [pebble!.id, DEMO_CAMBER_ARMS_DATE, ids.shopStaff],
  );
  const [closed]: { id: string }[] = await m.query(
    `INSERT INTO work_orders (id, shop_id, car_id, opened_by, visit_date, requested_work, notes, status, handover_at, closed_by, setup_id)
     VALUES (gen_random_uuid(), $1, $2, $3, $4, $5, $6, 'closed', $7, $3, $8) RETURNING id`,
    [
      shopId, pebble!.id, ids.shopStaff, DEMO_CAMBER_ARMS_DATE,
      'Fit adjustable front camber arms, align to −2.4° front camber, corner-balance with the driver in',
      'Stock arms were at the end of their adjustment. Driver in the seat (74 kg), half a tank.',
      arms!.effective_from, arms!.id,
    ],
  );
  await m.query('UPDATE setup_snapshots SET work_order_id = $1 WHERE id = $2', [closed!.id, arms!.id]);
  await m.query('UPDATE change_log SET work_order_id = $1 WHERE car_id = $2 AND setup_id = $3', [closed!.id, pebble!.id, arms!.id]);
  const armLines = [
    { kind: 'part', description: 'Adjustable front camber arm', quantity: 2, unitPriceCents: 18950 },
    { kind: 'labour', description: 'Fit arms, four-wheel alignment and corner balance', quantity: 2.5, unitPriceCents: 9500 },
  ];
  for (const [position, line] of armLines.entries()) {
    await m.query(
      'INSERT INTO work_order_lines (work_order_id, kind, description, quantity, unit_price_cents, position) VALUES ($1, $2, $3, $4, $5, $6)',
      [closed!.id, line.kind, line.description, line.quantity, line.unitPriceCents, position],
    );
  }
  const day = (time: string) => `${DEMO_CAMBER_ARMS_DATE}T${time}:00Z`;
  // Invoiced at handover and paid over the counter a few minutes later: the shop's first invoice.
  const taxRatePct = roundedTaxRate(DEMO_SHOP_TAX_RATE_PCT);
  const totals = invoiceTotals(armLines, taxRatePct);
  const [invoice]: { id: string }[] = await m.query(
    `INSERT INTO invoices (work_order_id, shop_id, car_id, currency, subtotal_cents, tax_rate_pct, tax_cents, total_cents, status, paid_at,
                           paid_method, created_at, number, issuer_name, issuer_details, bill_to, car_name, car_number, car_class_code,
                           visit_date, requested_work)
     SELECT w.id, s.id, c.id, s.currency, $2, $3, $4, $5, 'paid', $6, 'cash', $7, 1, s.name, s.invoice_details, u.display_name, c.name,
            c.car_number, c.class_code, w.visit_date, w.requested_work
       FROM work_orders w JOIN shops s ON s.id = w.shop_id JOIN cars c ON c.id = w.car_id JOIN users u ON u.id = c.owner_id WHERE w.id = $1
     RETURNING id`,
    [closed!.id, totals.subtotalCents, taxRatePct, totals.taxCents, totals.totalCents, day('15:20'), day('15:05')],
  );
  for (const [position, line] of armLines.entries()) {
    await m.query(
      `INSERT INTO invoice_lines (invoice_id, position, kind, description, quantity, unit_price_cents, used_up, amount_cents)
       VALUES ($1, $2, $3, $4, $5, $6, false, $7)`,
      [invoice!.id, position, line.kind, line.description, line.quantity, line.unitPriceCents, invoiceLineCents(line)],
    );
  }
  await m.query(
    `INSERT INTO work_order_stages (work_order_id, stage, measured_at, driver_in_car, driver_weight_kg, fuel_level_pct) VALUES
       ($1, 'before', $2, true, 74, 50), ($1, 'after', $3, true, 74, 50)`,
    [closed!.id, day('09:10'), day('14:40')],
  );
  // [stage, corner, camber °, toe mm, caster °, ride height mm, corner weight kg]
  const readings: [string, string, number, number, number | null, number, number][] = [
    ['before', 'lf', -1.1, -0.8, 5.5, 122, 258], ['before', 'rf', -1.2, -0.7, 5.6, 121, 249],
    ['before', 'lr', -1.6, 1.0, null, 127, 266], ['before', 'rr', -1.5, 1.0, null, 128, 271],
    ['after', 'lf', -2.4, 0, 5.6, 122, 256], ['after', 'rf', -2.4, 0, 5.6, 122, 251],
    ['after', 'lr', -1.6, 1.0, null, 127, 268], ['after', 'rr', -1.6, 1.0, null, 127, 269],
  ];
  for (const [stage, corner, camber, toe, caster, ride, weight] of readings) {
    await m.query(
      `INSERT INTO work_order_measurements (work_order_id, stage, corner, camber_deg, toe_mm, caster_deg, ride_height_mm, corner_weight_kg)
       VALUES ($1, $2, $3, $4, $5, $6, $7, $8)`,
      [closed!.id, stage, corner, camber, toe, caster, ride, weight],
    );
  }

  // Still on the bench: coilovers going on, the fronts built, the rears half-way.
  const [open]: { id: string }[] = await m.query(
    `INSERT INTO work_orders (id, shop_id, car_id, opened_by, visit_date, requested_work, notes)
     VALUES (gen_random_uuid(), $1, $2, $3, '2026-09-03', $4, $5) RETURNING id`,
    [
      shopId, pebble!.id, ids.shopStaff,
      'Fit adjustable-body coilovers, set ride height, align and corner-balance',
      'Customer supplied the dampers; springs from our stock. Keep the stock bump stops.',
    ],
  );
  await m.query(
    `INSERT INTO work_order_lines (work_order_id, kind, description, quantity, unit_price_cents, position) VALUES
       ($1, 'part', 'Main spring 70 N/mm, 178 mm free', 2, 8900, 0),
       ($1, 'part', 'Helper spring 10 N/mm', 2, 2400, 1),
       ($1, 'labour', 'Coilover fit and build', 4, 9500, 2)`,
    [open!.id],
  );
  await m.query(
    `INSERT INTO build_sheet_corners (work_order_id, corner, damper_free_length_mm, damper_compressed_length_mm, reference_compressed_length_mm,
            stroke_mm, body_length_setting, main_spring_rate_n_per_mm, main_spring_free_length_mm, helper_spring_rate_n_per_mm,
            helper_spring_free_length_mm, perch_position_mm, preload_mm, bump_clicks, rebound_clicks, wheel_load_kg, wheel_droop_mm, bump_stop_mm)
     VALUES ($1, 'lf', 480, 345, 352, 118, '38 mm of thread below the lock ring', 70, 178, 10, 60, 95, 2, 8, 10, 256, 75, 25),
            ($1, 'rf', 480, 345, 352, 118, '38 mm of thread below the lock ring', 70, 178, 10, 60, 96, 2, 8, 10, 251, 75, 25),
            ($1, 'lr', 470, 330, 350, 110, NULL, 50, NULL, NULL, NULL, NULL, NULL, NULL, NULL, 268, NULL, NULL)`,
    [open!.id],
  );
}

/**
 * The shop's read of the finished season, written through the same services as the app, so
 * each leaves the notifications it would (no e-mail is sent while seeding): a comment on
 * Maren's quickest run at the last round with her answer, and one open suggestion for next
 * spring against the setup in force now. Invented words.
 */
async function seedDemoReview(ds: DataSource, ids: Record<keyof typeof DEMO_ACCOUNTS, string>): Promise<void> {
  const [dusty, maren] = await Promise.all([findUserById(ds, ids.shopStaff), findUserById(ds, ids.driver)]);
  const [best]: { id: string; car_id: string }[] = await ds.query(
    `SELECT r.id, r.car_id FROM runs r JOIN events e ON e.id = r.event_id
      WHERE r.driver_id = $1 AND r.status = 'finished' ORDER BY e.date DESC, r.raw_time_sec + r.cones * e.cone_penalty_sec LIMIT 1`,
    [ids.driver],
  );
  const target = { type: 'run' as const, id: best!.id };
  await createComment(ds, undefined, dusty!, {
    target,
    body: 'Tidiest run of your day. The fronts’ inner edges have worn far less since the camber arms went on, so leave the camber where it is over the winter.',
  });
  await createComment(ds, undefined, maren!, {
    target,
    body: 'Thanks. It turned in much better through the slalom after the arms, too.',
  });
  const [current]: { id: string }[] = await ds.query(
    'SELECT id FROM setup_snapshots WHERE car_id = $1 ORDER BY effective_from DESC LIMIT 1',
    [best!.car_id],
  );
  await createSuggestion(ds, undefined, dusty!, best!.car_id, {
    baseSetupId: current!.id,
    title: 'One more rear click for the first spring round',
    rationale:
      'The rear took every click you gave it this season without stepping out, and the rear tread is wearing evenly. ' +
      'One more click at the rear should help the car rotate in the slaloms. Try it on your first two runs and keep it only if the times say so.',
    changes: [{ field: 'damperClicks', corners: ['lr', 'rr'], delta: 1 }],
  });
}

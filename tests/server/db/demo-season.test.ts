import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DataSource } from 'typeorm';
import { seededDatabaseUrl } from '../support-seeded';
import { createDataSource } from '../../../server/db/data-source';
import { seedDemoIfEmpty } from '../../../server/db/seed';
import { DEMO_CAMBER_ARMS_DATE } from '../../../server/db/demo-season';
import { DEMO_ACCOUNTS, DEMO_PASSWORD, DEMO_SHOP, DEMO_SHOP_INVOICE_DETAILS } from '../../../server/db/demo-accounts';
import { verifyPassword } from '../../../server/auth/password';

/** A fresh database on the test cluster holding the demo season, and a connection to it. */
async function seededDatabase() {
  const db = await seededDatabaseUrl();
  const ds = createDataSource(db.url, { poolSize: 2 });
  await ds.initialize();
  return {
    ds,
    async drop() {
      await ds.destroy();
      await db.drop();
    },
  };
}

let a: Awaited<ReturnType<typeof seededDatabase>>;
let b: Awaited<ReturnType<typeof seededDatabase>>;
beforeAll(async () => {
  [a, b] = await Promise.all([seededDatabase(), seededDatabase()]);
}, 120_000);
afterAll(async () => {
  await Promise.all([a?.drop(), b?.drop()]);
});

const q = async <T>(ds: DataSource, sql: string, params: unknown[] = []) => (await ds.query(sql, params)) as T[];

/** Everything the season holds, without the database-made ids and timestamps. */
async function contentOf(ds: DataSource) {
  return {
    runs: await q(ds, `SELECT c.name, e.date::text, u.email, r.run_number, r.raw_time_sec, r.cones, r.status, r.recorded_at
                         FROM runs r JOIN cars c ON c.id = r.car_id JOIN events e ON e.id = r.event_id JOIN users u ON u.id = r.driver_id
                        ORDER BY r.recorded_at, c.name, r.run_number`),
    tread: await q(ds, `SELECT t.taken_at, c.corner, c.inner_mm, c.middle_mm, c.outer_mm FROM tread_readings t
                          JOIN tread_reading_corners c ON c.reading_id = t.id ORDER BY t.taken_at, t.tyre_set_id, c.corner`),
    setups: await q(ds, `SELECT s.label, s.effective_from, c.corner, c.camber_deg, c.damper_clicks, c.cold_pressure_kpa
                           FROM setup_snapshots s JOIN setup_corners c ON c.setup_id = s.id ORDER BY s.effective_from, c.corner`),
    pressures: await q(ds, `SELECT kind, taken_at, lf_kpa, rf_kpa, lr_kpa, rr_kpa FROM pressure_readings ORDER BY taken_at, kind, lf_kpa`),
  };
}

describe('the demo season', () => {
  it('when seeded twice, then both seasons are identical (seeded generator)', async () => {
    expect(await q(a.ds, 'SELECT 1 FROM users')).toHaveLength(Object.keys(DEMO_ACCOUNTS).length);
    const [ca, cb] = await Promise.all([contentOf(a.ds), contentOf(b.ds)]);
    expect(ca.runs.length).toBeGreaterThan(0);
    expect(cb).toEqual(ca);
  });

  it('when the database already has accounts, then seeding does nothing', async () => {
    const before = await q<{ n: number }>(a.ds, 'SELECT count(*)::int AS n FROM runs');
    expect(await seedDemoIfEmpty(a.ds)).toBe(false);
    expect(await q<{ n: number }>(a.ds, 'SELECT count(*)::int AS n FROM runs')).toEqual(before);
  });

  it('when seeded, then every demo account exists with the documented password and roles', async () => {
    const users = await q<{ email: string; password_hash: string; is_admin: boolean }>(a.ds, 'SELECT email, password_hash, is_admin FROM users');
    expect(users.map((u) => u.email).sort()).toEqual(Object.values(DEMO_ACCOUNTS).map((x) => x.email).sort());
    const maren = users.find((u) => u.email === DEMO_ACCOUNTS.driver.email)!;
    expect(await verifyPassword(maren.password_hash, DEMO_PASSWORD)).toBe(true);
    expect(users.find((u) => u.email === DEMO_ACCOUNTS.admin.email)!.is_admin).toBe(true);
    const staff = await q(a.ds, 'SELECT 1 FROM shop_members m JOIN users u ON u.id = m.user_id WHERE u.email = $1', [DEMO_ACCOUNTS.shopStaff.email]);
    expect(staff).toHaveLength(1);
    const captain = await q(a.ds, 'SELECT 1 FROM team_members m JOIN users u ON u.id = m.user_id WHERE u.email = $1 AND m.is_captain', [DEMO_ACCOUNTS.captain.email]);
    expect(captain).toHaveLength(1);
    const coDriver = await q(a.ds, 'SELECT 1 FROM car_co_drivers d JOIN users u ON u.id = d.user_id WHERE u.email = $1', [DEMO_ACCOUNTS.coDriver.email]);
    expect(coDriver).toHaveLength(1);
    const members = await q<{ email: string }>(a.ds, 'SELECT u.email FROM team_members m JOIN users u ON u.id = m.user_id WHERE NOT m.is_captain');
    expect(members.map((m) => m.email).sort()).toEqual(
      [DEMO_ACCOUNTS.driver.email, DEMO_ACCOUNTS.secondDriver.email, DEMO_ACCOUNTS.classRival.email].sort(),
    );
  });

  it('when counted, then 3 cars and 8 events with 6 to 8 runs per car, including cones, a DNF and an off-course', async () => {
    expect(await q(a.ds, 'SELECT id FROM cars')).toHaveLength(3);
    expect(await q(a.ds, 'SELECT id FROM events')).toHaveLength(8);
    const perCar = await q<{ n: number }>(a.ds, 'SELECT count(*)::int AS n FROM runs GROUP BY event_id, car_id');
    expect(perCar).toHaveLength(24);
    for (const { n } of perCar) {
      expect(n).toBeGreaterThanOrEqual(6);
      expect(n).toBeLessThanOrEqual(8);
    }
    const statuses = await q<{ status: string; n: number }>(a.ds, 'SELECT status, count(*)::int AS n FROM runs GROUP BY status');
    expect(statuses.find((s) => s.status === 'dnf')?.n).toBeGreaterThanOrEqual(1);
    expect(statuses.find((s) => s.status === 'off_course')?.n).toBeGreaterThanOrEqual(1);
    expect((await q(a.ds, 'SELECT 1 FROM runs WHERE cones > 0')).length).toBeGreaterThan(0);
  });

  it('when events are compared, then courses differ: each event has its own typical time', async () => {
    const medians = await q<{ m: number }>(a.ds, `SELECT percentile_cont(0.5) WITHIN GROUP (ORDER BY raw_time_sec) AS m
                                                    FROM runs r JOIN cars c ON c.id = r.car_id WHERE c.name = 'Pebble' GROUP BY event_id`);
    const distinct = new Set(medians.map((x) => Math.round(x.m)));
    expect(distinct.size).toBeGreaterThanOrEqual(5);
  });

  it('when setups are listed, then they change during events, and camber arms allow more negative front camber from mid-season', async () => {
    const pebble = await q<{ label: string; effective_from: Date; camber: number }>(a.ds, `
      SELECT s.label, s.effective_from, c.camber_deg AS camber FROM setup_snapshots s
        JOIN cars car ON car.id = s.car_id JOIN setup_corners c ON c.setup_id = s.id AND c.corner = 'lf'
       WHERE car.name = 'Pebble' ORDER BY s.effective_from`);
    expect(pebble.filter((s) => s.label.startsWith('Quick change')).length).toBeGreaterThanOrEqual(6);
    const before = pebble.filter((s) => s.effective_from < new Date(DEMO_CAMBER_ARMS_DATE)).map((s) => s.camber);
    const after = pebble.filter((s) => s.effective_from > new Date(DEMO_CAMBER_ARMS_DATE)).map((s) => s.camber);
    expect(Math.min(...before)).toBeGreaterThan(-1.5);
    expect(Math.max(...after)).toBeLessThan(-2);
    const changes = await q(a.ds, `SELECT 1 FROM change_log WHERE changed_on = $1 AND what ILIKE '%camber arms%'`, [DEMO_CAMBER_ARMS_DATE]);
    expect(changes).toHaveLength(1);
  });

  it('when the corner balance is read, then the cross weight its notes give is the one its corner weights make', async () => {
    const [balance] = await q<{ notes: string; setup_id: string }>(a.ds, `SELECT notes, setup_id FROM change_log WHERE what = 'Corner balance with driver in'`);
    const kg = Object.fromEntries(
      (await q<{ corner: string; kg: number }>(a.ds, 'SELECT corner, corner_weight_kg AS kg FROM setup_corners WHERE setup_id = $1', [balance!.setup_id])).map((c) => [c.corner, c.kg]),
    );
    // Cross weight = (LF + RR) / total × 100 (common practice), to the one decimal the notes give.
    const cross = ((kg.lf! + kg.rr!) / (kg.lf! + kg.rf! + kg.lr! + kg.rr!)) * 100;
    expect(balance!.notes).toBe(`Cross weight ${cross.toFixed(1)} %.`);
    const [snapshot] = await q<{ notes: string }>(a.ds, 'SELECT notes FROM setup_snapshots WHERE id = $1', [balance!.setup_id]);
    expect(snapshot!.notes).toContain(`cross ${cross.toFixed(1)} %`);
  });

  it('when the two SR cars are compared, then Gooseberry is the quicker in the spring and Pebble once its camber arms are on', async () => {
    // Best adjusted time per car and event: raw + 2 s a cone (the demo events' penalty; "time plus penalties",
    // common practice in club autocross).
    const bests = await q<{ date: string; name: string; best: number }>(a.ds, `
      SELECT e.date::text AS date, c.name, min(r.raw_time_sec + r.cones * e.cone_penalty_sec) AS best
        FROM runs r JOIN cars c ON c.id = r.car_id JOIN events e ON e.id = r.event_id
       WHERE c.class_code = 'SR' AND r.status = 'finished' GROUP BY e.date, c.name ORDER BY e.date`);
    const dates = [...new Set(bests.map((b) => b.date))];
    expect(dates).toHaveLength(8);
    const quicker = dates.map((d) => {
      const [x, y] = bests.filter((b) => b.date === d);
      return { before: d < DEMO_CAMBER_ARMS_DATE, name: x!.best < y!.best ? x!.name : y!.name };
    });
    expect(quicker.filter((q) => q.before).map((q) => q.name)).toEqual(Array(4).fill('Gooseberry'));
    expect(quicker.filter((q) => !q.before).map((q) => q.name)).toEqual(Array(4).fill('Pebble'));
  });

  it('when front tread is read after each event, then inner-edge wear per run drops after the camber arms', async () => {
    const rows = await q<{ taken_at: Date; inner: number; outer: number; runs: number }>(a.ds, `
      SELECT t.taken_at, avg(c.inner_mm) AS inner, avg(c.outer_mm) AS outer,
             (SELECT count(*)::int FROM runs r WHERE r.car_id = ts.car_id AND r.recorded_at < t.taken_at) AS runs
        FROM tread_readings t JOIN tyre_sets ts ON ts.id = t.tyre_set_id JOIN cars car ON car.id = ts.car_id
        JOIN tread_reading_corners c ON c.reading_id = t.id AND c.corner IN ('lf', 'rf')
       WHERE car.name = 'Pebble' GROUP BY t.id, t.taken_at, ts.car_id ORDER BY t.taken_at`);
    expect(rows).toHaveLength(9); // at the start, then after each of 8 events
    const rate = (from: number, to: number) => (rows[from]!.inner - rows[to]!.inner) / (rows[to]!.runs - rows[from]!.runs);
    const armsIndex = rows.findIndex((r) => r.taken_at > new Date(DEMO_CAMBER_ARMS_DATE));
    const beforeRate = rate(0, armsIndex - 1);
    const afterRate = rate(armsIndex - 1, rows.length - 1);
    expect(afterRate).toBeLessThan(beforeRate * 0.7);
  });

  it('when seeded, then the shop has reviewed the season: a run comment with the driver\'s answer, an open suggestion on the setup in force, and their notifications', async () => {
    const thread = await q<{ email: string; shop: string | null; event: string; run_id: string }>(a.ds, `
      SELECT u.email, s.name AS shop, e.name AS event, c.run_id FROM comments c JOIN users u ON u.id = c.author_id
        LEFT JOIN shops s ON s.id = c.shop_id JOIN runs r ON r.id = c.run_id JOIN events e ON e.id = r.event_id
       ORDER BY c.created_at, c.id`);
    expect(thread.map((c) => c.email)).toEqual([DEMO_ACCOUNTS.shopStaff.email, DEMO_ACCOUNTS.driver.email]);
    // Staff who do not drive the car sign with the shop; both comments are on one run of the season's last round.
    expect(thread[0]!.shop).not.toBeNull();
    expect(thread[1]!.shop).toBeNull();
    expect(thread[1]!.run_id).toBe(thread[0]!.run_id);
    const [last] = await q<{ name: string }>(a.ds, 'SELECT name FROM events ORDER BY date DESC LIMIT 1');
    expect(thread[0]!.event).toBe(last!.name);

    const suggestions = await q<{ status: string; base: string; current: string; changes: unknown }>(a.ds, `
      SELECT g.status, g.base_setup_id AS base, g.changes,
             (SELECT id FROM setup_snapshots WHERE car_id = g.car_id ORDER BY effective_from DESC LIMIT 1) AS current
        FROM setup_suggestions g`);
    expect(suggestions).toHaveLength(1);
    expect(suggestions[0]!.status).toBe('open');
    expect(suggestions[0]!.base).toBe(suggestions[0]!.current);

    // Each hears of what the others wrote, never of their own: the co-driver of all three, the driver of the
    // shop's two, the shop of the driver's answer.
    const unread = await q<{ email: string; n: number }>(a.ds, `
      SELECT u.email, count(*)::int AS n FROM notifications n JOIN users u ON u.id = n.user_id WHERE n.read_at IS NULL GROUP BY u.email`);
    expect(Object.fromEntries(unread.map((r) => [r.email, r.n]))).toEqual({
      [DEMO_ACCOUNTS.coDriver.email]: 3,
      [DEMO_ACCOUNTS.driver.email]: 2,
      [DEMO_ACCOUNTS.shopStaff.email]: 1,
    });
  });

  it('when seeded, then the closed camber-arm visit has the shop\'s invoice number 1, paid in cash after the handover, with its totals worked out', async () => {
    const invoices = await q<{
      number: number; status: string; paid_method: string; subtotal_cents: number; tax_rate_pct: number; tax_cents: number; total_cents: number;
      issuer_name: string; issuer_details: string; bill_to: string; car_name: string; after_handover: boolean; paid_after: boolean;
    }>(a.ds, `
      SELECT i.number, i.status, i.paid_method, i.subtotal_cents, i.tax_rate_pct, i.tax_cents, i.total_cents, i.issuer_name, i.issuer_details,
             i.bill_to, i.car_name, i.created_at >= w.handover_at AS after_handover, i.paid_at > i.created_at AS paid_after
        FROM invoices i JOIN work_orders w ON w.id = i.work_order_id WHERE w.status = 'closed'`);
    expect(invoices).toHaveLength(1);
    // By hand: 2 × 189.50 + 2.5 × 95.00 = 379.00 + 237.50 = 616.50; tax 8.25 % of it = 50.86125 → 50.86; total 667.36.
    expect(invoices[0]).toEqual({
      number: 1, status: 'paid', paid_method: 'cash', subtotal_cents: 61650, tax_rate_pct: 8.25, tax_cents: 5086, total_cents: 66736,
      issuer_name: DEMO_SHOP, issuer_details: DEMO_SHOP_INVOICE_DETAILS, bill_to: DEMO_ACCOUNTS.driver.displayName, car_name: 'Pebble',
      after_handover: true, paid_after: true,
    });
  });

  it('when pressures are read, then each event has cold readings and many runs have hot ones above the cold', async () => {
    const cold = await q<{ n: number }>(a.ds, `SELECT count(*)::int AS n FROM pressure_readings WHERE kind = 'cold'`);
    expect(cold[0]!.n).toBe(16);
    const hot = await q<{ lf: number; cold: number }>(a.ds, `
      SELECT p.lf_kpa AS lf, c.cold_pressure_kpa AS cold FROM pressure_readings p
        JOIN runs_with_setup r ON r.id = p.run_id JOIN setup_corners c ON c.setup_id = r.setup_id AND c.corner = 'lf'
       WHERE p.kind = 'hot'`);
    expect(hot.length).toBeGreaterThan(40);
    for (const h of hot) expect(h.lf).toBeGreaterThan(h.cold);
  });
});

import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { AccountExport } from '@shared/export/account-export';
import { buildSeasonExport } from './export.service';

/*
 * Everything an account holds, in one file (OWASP ASVS 4.0 V8.3.2: users can export their data on demand;
 * GDPR Art. 20 asks for it "in a structured, commonly used and machine-readable format"). Each car of its own is
 * the same season file its car page downloads, so it can be cut out and imported again. What other people
 * hold is named, not copied: the car a run was driven on, the shop or team one belongs to.
 */

export async function exportAccount(ds: DataSource, user: User, now = new Date()): Promise<AccountExport> {
  const [profile]: { created_at: Date }[] = await ds.query('SELECT created_at FROM users WHERE id = $1', [user.id]);
  const ownCars: { id: string }[] = await ds.query('SELECT id FROM cars WHERE owner_id = $1 ORDER BY created_at, id', [user.id]);
  const cars = [];
  for (const car of ownCars) cars.push(await buildSeasonExport(ds, car.id, now));

  const runs: {
    car: string; owner: string; event: string; event_date: string; venue: string | null; run_number: number; raw_time_sec: number | null;
    cones: number; status: string; recorded_at: Date; notes: string | null;
  }[] = await ds.query(
    `SELECT c.name AS car, o.display_name AS owner, e.name AS event, e.date::text AS event_date, e.venue, r.run_number,
            r.raw_time_sec, r.cones, r.status, r.recorded_at, r.notes
       FROM runs r JOIN cars c ON c.id = r.car_id JOIN users o ON o.id = c.owner_id JOIN events e ON e.id = r.event_id
      WHERE r.driver_id = $1 AND c.owner_id <> $1
      ORDER BY e.date, r.recorded_at, r.run_number`,
    [user.id],
  );
  const comments: { car: string; on: AccountExport['comments'][number]['on']; body: string; created_at: Date }[] = await ds.query(
    `SELECT c.name AS car,
            CASE WHEN m.run_id IS NOT NULL THEN 'run' WHEN m.event_id IS NOT NULL THEN 'event'
                 WHEN m.setup_id IS NOT NULL THEN 'setup' WHEN m.tread_reading_id IS NOT NULL THEN 'tread reading' ELSE 'car' END AS on,
            m.body, m.created_at
       FROM comments m JOIN cars c ON c.id = m.car_id
      WHERE m.author_id = $1 ORDER BY m.created_at, m.id`,
    [user.id],
  );
  const shops: { name: string; admin: boolean }[] = await ds.query(
    'SELECT s.name, m.is_shop_admin AS admin FROM shop_members m JOIN shops s ON s.id = m.shop_id WHERE m.user_id = $1 ORDER BY s.name',
    [user.id],
  );
  const teams: { name: string; captain: boolean }[] = await ds.query(
    'SELECT t.name, m.is_captain AS captain FROM team_members m JOIN teams t ON t.id = m.team_id WHERE m.user_id = $1 ORDER BY t.name',
    [user.id],
  );
  const coDriving: { car: string; owner: string }[] = await ds.query(
    `SELECT c.name AS car, o.display_name AS owner FROM car_co_drivers d JOIN cars c ON c.id = d.car_id JOIN users o ON o.id = c.owner_id
      WHERE d.user_id = $1 ORDER BY c.name`,
    [user.id],
  );

  return {
    format: 'scrubline-account',
    version: 1,
    exportedAt: now.toISOString(),
    account: {
      email: user.email,
      displayName: user.displayName,
      createdAt: profile!.created_at.toISOString(),
      roles: user.roles,
      preferences: user.preferences,
    },
    memberships: { shops, teams, coDriverOf: coDriving },
    cars,
    runsOnOtherCars: runs.map((r) => ({
      car: r.car,
      owner: r.owner,
      event: { name: r.event, date: r.event_date, venue: r.venue },
      runNumber: r.run_number,
      rawTimeSec: r.raw_time_sec,
      cones: r.cones,
      status: r.status,
      recordedAt: r.recorded_at.toISOString(),
      notes: r.notes,
    })),
    comments: comments.map((c) => ({ car: c.car, on: c.on, body: c.body, createdAt: c.created_at.toISOString() })),
  };
}

/** `scrubline-account-2026-12-03.json`. */
export const accountFileName = (now = new Date()) => `scrubline-account-${now.toISOString().slice(0, 10)}.json`;

import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type {
  ClassFactor, CreateTeamInput, EnterCarInput, InviteMemberInput, SetFactorInput, Team, TeamEntry, TeamSharing, TeamSummary,
  UpdateEntryInput,
} from '@shared/collab/team.schema';
import { AppError } from '../../lib/app-error';
import { assertCarAccess, assertTeamAccess, type TeamAction } from '../../auth/access';
import { createInvitation, lockTarget, withdrawInvitationsBy } from '../invitations/invitation.service';
import type { MailSettings } from '../../mail/mailer';
import { TeamEntity, TeamMemberEntity } from './team.entity';

type Db = DataSource | EntityManager;

/*
 * Teams: members and captains, the cars members enter (with what they share), and the
 * class index factors captains enter per season. Who may do what is decided by
 * assertTeamAccess and assertCarAccess; this file only asks them.
 */

const ONE_CAPTAIN = 'A team needs at least one captain. Make another member captain first.';

/** The user's standing as a TeamSummary field. */
const captainOf = (relation: 'team_member' | 'team_captain') => relation === 'team_captain';

async function teamName(db: Db, teamId: string): Promise<string> {
  const rows: { name: string }[] = await db.query('SELECT name FROM teams WHERE id = $1', [teamId]);
  if (!rows[0]) throw new AppError('not_found', 'That team was not found.');
  return rows[0].name;
}

export async function teamSummary(db: Db, user: User, teamId: string, action: TeamAction = 'read'): Promise<TeamSummary> {
  const relation = await assertTeamAccess(db, user, teamId, action);
  return { id: teamId, name: await teamName(db, teamId), isCaptain: captainOf(relation) };
}

export async function createTeam(ds: DataSource, user: User, input: CreateTeamInput): Promise<TeamSummary> {
  return ds.transaction(async (m) => {
    const team = await m.getRepository(TeamEntity).save({ name: input.name });
    await m.getRepository(TeamMemberEntity).insert({ teamId: team.id, userId: user.id, isCaptain: true });
    return { id: team.id, name: team.name, isCaptain: true };
  });
}

export async function listMyTeams(ds: DataSource, user: User): Promise<TeamSummary[]> {
  const rows: { id: string; name: string; is_captain: boolean }[] = await ds.query(
    `SELECT t.id, t.name, m.is_captain FROM team_members m JOIN teams t ON t.id = m.team_id
      WHERE m.user_id = $1 ORDER BY lower(t.name), t.created_at`,
    [user.id],
  );
  return rows.map((r) => ({ id: r.id, name: r.name, isCaptain: r.is_captain }));
}

interface EntryRow {
  car_id: string;
  car_name: string;
  car_number: string | null;
  owner_id: string;
  owner_name: string;
  class_code: string;
  sharing: TeamSharing;
}

const ENTRY_SELECT = `
  SELECT te.car_id, c.name AS car_name, c.car_number, c.owner_id, u.display_name AS owner_name, te.class_code, te.sharing
    FROM team_entries te JOIN cars c ON c.id = te.car_id JOIN users u ON u.id = c.owner_id`;

/** The team's entries, each with its car and owner (one query). */
export async function entriesOf(db: Db, teamId: string): Promise<EntryRow[]> {
  return db.query(`${ENTRY_SELECT} WHERE te.team_id = $1 ORDER BY te.class_code, lower(c.name), c.id`, [teamId]);
}

const toEntry = (r: EntryRow, user: User): TeamEntry => ({
  car: { id: r.car_id, name: r.car_name, carNumber: r.car_number },
  owner: { id: r.owner_id, displayName: r.owner_name },
  classCode: r.class_code,
  sharing: r.sharing,
  mine: r.owner_id === user.id,
});

/**
 * The team as a member sees it. Invitations still open are listed to captains only:
 * the addresses invited are the captains' business.
 */
export async function getTeam(ds: DataSource, user: User, teamId: string): Promise<Team> {
  const summary = await teamSummary(ds, user, teamId);
  const [members, entries, invitations] = await Promise.all([
    ds.query(
      `SELECT u.id, u.display_name, m.is_captain FROM team_members m JOIN users u ON u.id = m.user_id
        WHERE m.team_id = $1 ORDER BY m.is_captain DESC, lower(u.display_name), u.id`,
      [teamId],
    ) as Promise<{ id: string; display_name: string; is_captain: boolean }[]>,
    entriesOf(ds, teamId),
    summary.isCaptain
      ? (ds.query(
          `SELECT email, as_admin, expires_at FROM invitations
            WHERE team_id = $1 AND used_at IS NULL AND expires_at > now() ORDER BY created_at`,
          [teamId],
        ) as Promise<{ email: string; as_admin: boolean; expires_at: Date }[]>)
      : Promise.resolve([]),
  ]);
  return {
    ...summary,
    members: members.map((m) => ({ id: m.id, displayName: m.display_name, isCaptain: m.is_captain })),
    entries: entries.map((e) => toEntry(e, user)),
    pendingInvitations: invitations.map((i) => ({ email: i.email, asAdmin: i.as_admin, expiresAt: i.expires_at.toISOString() })),
  };
}

/* ---------- Members ---------- */

export async function inviteMember(
  ds: DataSource,
  mail: MailSettings | undefined,
  user: User,
  teamId: string,
  input: InviteMemberInput,
): Promise<{ email: string; asAdmin: boolean; expiresAt: string }> {
  await assertTeamAccess(ds, user, teamId, 'manage');
  const already: { display_name: string; is_captain: boolean }[] = await ds.query(
    'SELECT u.display_name, m.is_captain FROM team_members m JOIN users u ON u.id = m.user_id WHERE m.team_id = $1 AND u.email = $2',
    [teamId, input.email],
  );
  if (already[0]) {
    const message = alreadyOnTeam(already[0].display_name, already[0].is_captain, input.asAdmin);
    throw new AppError('validation_failed', message, { email: [message] });
  }
  return createInvitation(ds, mail, {
    teamId,
    email: input.email,
    asAdmin: input.asAdmin,
    invitedBy: { id: user.id, displayName: user.displayName },
  });
}

/**
 * Why someone on the team is not invited again, for the role they hold and the one they were invited to:
 * the same role needs nothing; another one is changed in the member list.
 */
function alreadyOnTeam(name: string, isCaptain: boolean, asCaptain: boolean): string {
  const role = isCaptain ? 'a captain' : 'a member';
  if (isCaptain === asCaptain) return `${name} is already on the team as ${role}.`;
  return isCaptain
    ? `${name} is already on the team as a captain. To make them a member, use Make member in the member list.`
    : `${name} is already on the team as a member. To make them a captain, use Make captain in the member list.`;
}

/** Locks the team (so two changes to its captains cannot both pass the check) and reads its members. */
async function lockedMembers(m: EntityManager, teamId: string) {
  await lockTarget(m, 'team', teamId);
  const rows: { user_id: string; is_captain: boolean }[] = await m.query(
    'SELECT user_id, is_captain FROM team_members WHERE team_id = $1',
    [teamId],
  );
  return rows;
}

export async function updateMember(ds: DataSource, user: User, teamId: string, memberId: string, isCaptain: boolean): Promise<Team> {
  await assertTeamAccess(ds, user, teamId, 'manage');
  await ds.transaction(async (m) => {
    const members = await lockedMembers(m, teamId);
    const target = members.find((r) => r.user_id === memberId);
    if (!target) throw new AppError('not_found', 'That member was not found on this team.');
    if (target.is_captain && !isCaptain && members.filter((r) => r.is_captain).length === 1) {
      throw new AppError('conflict', ONE_CAPTAIN);
    }
    await m.query('UPDATE team_members SET is_captain = $3 WHERE team_id = $1 AND user_id = $2', [teamId, memberId, isCaptain]);
    if (!isCaptain) await withdrawInvitationsBy(m, 'team', teamId, memberId);
  });
  return getTeam(ds, user, teamId);
}

/**
 * Captains remove anyone; a member may remove themself. The last captain cannot leave.
 * A member who goes takes their cars' entries with them.
 */
export async function removeMember(ds: DataSource, user: User, teamId: string, memberId: string): Promise<void> {
  await assertTeamAccess(ds, user, teamId, memberId === user.id ? 'read' : 'manage');
  await ds.transaction(async (m) => {
    const members = await lockedMembers(m, teamId);
    const target = members.find((r) => r.user_id === memberId);
    if (!target) throw new AppError('not_found', 'That member was not found on this team.');
    if (target.is_captain && members.filter((r) => r.is_captain).length === 1) {
      throw new AppError('conflict', `${ONE_CAPTAIN} Then you can leave.`);
    }
    await m.query(
      'DELETE FROM team_entries WHERE team_id = $1 AND car_id IN (SELECT id FROM cars WHERE owner_id = $2)',
      [teamId, memberId],
    );
    await m.query('DELETE FROM team_members WHERE team_id = $1 AND user_id = $2', [teamId, memberId]);
    await withdrawInvitationsBy(m, 'team', teamId, memberId);
  });
}

/* ---------- Entries ---------- */

async function loadEntry(db: Db, user: User, teamId: string, carId: string): Promise<TeamEntry> {
  const rows: EntryRow[] = await db.query(`${ENTRY_SELECT} WHERE te.team_id = $1 AND te.car_id = $2`, [teamId, carId]);
  if (!rows[0]) throw new AppError('not_found', 'That car is not entered in this team.');
  return toEntry(rows[0], user);
}

/** The car's owner may change or withdraw its entry. A car others can see on the board is no secret, so 403, not 404. */
async function assertEntryOwner(ds: DataSource, user: User, carId: string): Promise<void> {
  try {
    await assertCarAccess(ds, user, carId, 'manage');
  } catch (err) {
    if (err instanceof AppError && (err.code === 'not_found' || err.code === 'forbidden')) {
      throw new AppError('forbidden', 'Only the car\'s owner can change its entry.');
    }
    throw err;
  }
}

/** Enters one of the member's own cars; entering it again changes its class and sharing. */
export async function enterCar(ds: DataSource, user: User, teamId: string, input: EnterCarInput): Promise<{ entry: TeamEntry; created: boolean }> {
  await assertTeamAccess(ds, user, teamId, 'enter');
  try {
    await assertCarAccess(ds, user, input.carId, 'manage');
  } catch (err) {
    // Never say whether a car someone cannot see exists.
    if (err instanceof AppError && err.code === 'not_found') {
      throw new AppError('validation_failed', 'Pick one of your own cars.', { carId: ['Pick one of your own cars'] });
    }
    if (err instanceof AppError && err.code === 'forbidden') throw new AppError('forbidden', 'Only the car\'s owner can enter it in a team.');
    throw err;
  }
  const rows: { inserted: boolean }[] = await ds.query(
    `INSERT INTO team_entries (team_id, car_id, class_code, sharing, entered_by) VALUES ($1, $2, $3, $4, $5)
     ON CONFLICT (team_id, car_id) DO UPDATE SET class_code = EXCLUDED.class_code, sharing = EXCLUDED.sharing, updated_at = now()
     RETURNING (xmax = 0) AS inserted`,
    [teamId, input.carId, input.classCode, input.sharing, user.id],
  );
  return { entry: await loadEntry(ds, user, teamId, input.carId), created: !!rows[0]?.inserted };
}

export async function updateEntry(ds: DataSource, user: User, teamId: string, carId: string, input: UpdateEntryInput): Promise<TeamEntry> {
  await assertTeamAccess(ds, user, teamId, 'enter');
  await loadEntry(ds, user, teamId, carId);
  await assertEntryOwner(ds, user, carId);
  await ds.query(
    `UPDATE team_entries SET class_code = COALESCE($3, class_code), sharing = COALESCE($4, sharing), updated_at = now()
      WHERE team_id = $1 AND car_id = $2`,
    [teamId, carId, input.classCode ?? null, input.sharing ?? null],
  );
  return loadEntry(ds, user, teamId, carId);
}

/** The car's owner withdraws it; a captain may withdraw any entry. */
export async function withdrawEntry(ds: DataSource, user: User, teamId: string, carId: string): Promise<void> {
  const relation = await assertTeamAccess(ds, user, teamId, 'enter');
  await loadEntry(ds, user, teamId, carId);
  if (!captainOf(relation)) await assertEntryOwner(ds, user, carId);
  await ds.query('DELETE FROM team_entries WHERE team_id = $1 AND car_id = $2', [teamId, carId]);
}

/* ---------- Class index factors ---------- */

/** Factors by (season, class); one query. */
export async function factorsOf(db: Db, teamId: string, season?: number): Promise<ClassFactor[]> {
  const rows: { season: number; class_code: string; factor: number }[] = await db.query(
    `SELECT season, class_code, factor FROM team_class_factors
      WHERE team_id = $1 AND ($2::int IS NULL OR season = $2) ORDER BY season DESC, class_code`,
    [teamId, season ?? null],
  );
  return rows.map((r) => ({ season: r.season, classCode: r.class_code, factor: r.factor }));
}

export async function listFactors(ds: DataSource, user: User, teamId: string, season?: number): Promise<ClassFactor[]> {
  await assertTeamAccess(ds, user, teamId, 'read');
  return factorsOf(ds, teamId, season);
}

/** Sets (or, with null, removes) one class's factor for a season; answers with that season's factors. */
export async function setFactor(ds: DataSource, user: User, teamId: string, input: SetFactorInput): Promise<ClassFactor[]> {
  await assertTeamAccess(ds, user, teamId, 'manage');
  if (input.factor === null) {
    await ds.query('DELETE FROM team_class_factors WHERE team_id = $1 AND season = $2 AND class_code = $3', [teamId, input.season, input.classCode]);
  } else {
    await ds.query(
      `INSERT INTO team_class_factors (team_id, season, class_code, factor, updated_by) VALUES ($1, $2, $3, $4, $5)
       ON CONFLICT (team_id, season, class_code) DO UPDATE SET factor = EXCLUDED.factor, updated_by = EXCLUDED.updated_by, updated_at = now()`,
      [teamId, input.season, input.classCode, input.factor, user.id],
    );
  }
  return factorsOf(ds, teamId, input.season);
}

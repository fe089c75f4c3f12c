import { randomUUID } from 'node:crypto';
import type { DataSource, EntityManager } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type {
  AcceptSuggestionInput, CreateSuggestionInput, DeclineSuggestionInput, Suggestion, SuggestionChange, SuggestionPreviewCell,
  SuggestionSetupRef, SuggestionStatus, WaitingSuggestion,
} from '@shared/collab/suggestion.schema';
import type { FieldErrors } from '@shared/api/api-error.schema';
import { CORNERS, type Corner } from '@shared/season/corners';
import { cornersWithAdjuster, isClickField } from '@shared/season/damper-clicks';
import type { Car } from '@shared/season/car.schema';
import type { Setup } from '@shared/season/setup.schema';
import { AppError } from '../../lib/app-error';
import { insertUnlessPresent } from '../../lib/insert';
import { accessibleCarIdsSql, assertCarAccess, assertCarChildAccess, grantedShopOf } from '../../auth/access';
import { carAdjusters } from '../cars/car.service';
import type { MailSettings } from '../../mail/mailer';
import {
  activeSetupAt, applyCornerChanges, checkChangedClicks, insertSnapshot, loadSetup, setupsOfCar,
} from '../setups/setup.service';
import {
  actorLabel, carAudience, driverRecipients, notify, sendOutbox, staffRecipients, type CarAudience, type NotificationRecipient,
} from '../notifications/notify';
import { SetupSuggestionEntity } from './suggestion.entity';

type Db = DataSource | EntityManager;

interface SuggestionRow {
  id: string;
  car_id: string;
  base_setup_id: string;
  shop_id: string;
  shop_name: string;
  author_id: string;
  author_name: string;
  title: string;
  rationale: string;
  changes: SuggestionChange[];
  status: SuggestionStatus;
  decided_by: string | null;
  decided_by_name: string | null;
  decided_at: Date | null;
  decision_note: string | null;
  accepted_setup_id: string | null;
  created_at: Date;
}

const SELECT_SUGGESTIONS = `
  SELECT g.id, g.car_id, g.base_setup_id, g.shop_id, s.name AS shop_name, g.author_id, a.display_name AS author_name,
         g.title, g.rationale, g.changes, g.status, g.decided_by, d.display_name AS decided_by_name, g.decided_at,
         g.decision_note, g.accepted_setup_id, g.created_at
    FROM setup_suggestions g
    JOIN shops s ON s.id = g.shop_id
    JOIN users a ON a.id = g.author_id
    LEFT JOIN users d ON d.id = g.decided_by`;

const refOf = (s: Setup): SuggestionSetupRef => ({ id: s.id, label: s.label, effectiveFrom: s.effectiveFrom });

/** The setups a suggestion is read against: its base, the one in force now, and the one accepting recorded (and its start). */
interface SuggestionSetups {
  byId: Map<string, Setup>;
  inForceNow: Setup | null;
}

/** Each change as the recorded setup holds it: from the setup it was made from, to the recorded value. */
function recordedPreview(start: Setup, recorded: Setup, changes: SuggestionChange[]): SuggestionPreviewCell[] {
  const steps = applyCornerChanges(start.corners, changes).steps;
  return steps.map((step, i) => {
    const last = !steps.slice(i + 1).some((later) => later.field === step.field && later.corner === step.corner);
    return last ? { ...step, to: recorded.corners[step.corner][step.field] ?? null } : step;
  });
}

/** The changes worked out on the setup in force now, and why it cannot take them, if it cannot. */
function nowOn(setup: Setup, changes: SuggestionChange[]): NonNullable<Suggestion['now']> {
  const { steps, errors } = applyCornerChanges(setup.corners, changes);
  return { setup: refOf(setup), preview: steps, problems: Object.values(errors).flat() };
}

/** The suggestion as the app shows it, with each change worked out against its base snapshot, and against today's setup. */
function toSuggestion(r: SuggestionRow, setups: SuggestionSetups): Suggestion {
  const base = setups.byId.get(r.base_setup_id)!;
  const { inForceNow } = setups;
  const accepted = r.status === 'accepted' && r.accepted_setup_id ? setups.byId.get(r.accepted_setup_id) : undefined;
  const acceptedFrom = accepted ? ((accepted.derivedFromId && setups.byId.get(accepted.derivedFromId)) || base) : undefined;
  return {
    id: r.id,
    carId: r.car_id,
    baseSetup: refOf(base),
    shop: { id: r.shop_id, name: r.shop_name },
    author: { id: r.author_id, displayName: r.author_name },
    title: r.title,
    rationale: r.rationale,
    changes: r.changes,
    preview: applyCornerChanges(base.corners, r.changes).steps,
    now:
      r.status === 'open' && inForceNow && inForceNow.id !== base.id
        ? nowOn(inForceNow, r.changes)
        : null,
    recorded:
      accepted && acceptedFrom
        ? { setup: refOf(accepted), from: refOf(acceptedFrom), preview: recordedPreview(acceptedFrom, accepted, r.changes) }
        : null,
    status: r.status,
    decidedBy: r.decided_by ? { id: r.decided_by, displayName: r.decided_by_name ?? '' } : null,
    decidedAt: r.decided_at?.toISOString() ?? null,
    decisionNote: r.decision_note,
    acceptedSetupId: r.accepted_setup_id,
    createdAt: r.created_at.toISOString(),
  };
}

/** The car's setups by id and the one in force now (the latest to take effect, as accepting now would start from). */
async function suggestionSetups(db: Db, carId: string): Promise<SuggestionSetups> {
  const all = await setupsOfCar(db, carId); // oldest to take effect first
  const now = Date.now();
  const inForceNow = all.findLast((s) => Date.parse(s.effectiveFrom) <= now) ?? null;
  return { byId: new Map(all.map((s) => [s.id, s])), inForceNow };
}

async function loadSuggestion(db: Db, id: string): Promise<Suggestion> {
  const rows: SuggestionRow[] = await db.query(`${SELECT_SUGGESTIONS} WHERE g.id = $1`, [id]);
  const row = rows[0];
  if (!row) throw new AppError('not_found', 'That suggestion was not found.');
  return toSuggestion(row, await suggestionSetups(db, row.car_id));
}

/** "LR" and "RR" as "LR and RR". */
const cornerList = (corners: Corner[]) => corners.map((c) => c.toUpperCase()).join(' and ');

/**
 * Changes of clicks at corners whose dampers lack that adjuster, keyed `changes.<i>.corners`: by the same rule as the
 * shop's form offers them (the car's adjusters, or clicks the base already records).
 */
function cornersWithoutAdjuster(adjusters: Car['damperAdjusters'], base: Setup, changes: SuggestionChange[]): FieldErrors {
  const errors: FieldErrors = {};
  changes.forEach((change, i) => {
    if (!isClickField(change.field)) return;
    const offered = cornersWithAdjuster(adjusters, base.corners, change.field);
    const missing = CORNERS.filter((c) => change.corners.includes(c) && !offered.includes(c));
    if (missing.length === 0) return;
    const what = change.field === 'damperReboundClicks' ? 'rebound adjuster' : 'damper adjuster';
    errors[`changes.${i}.corners`] = [`${cornerList(missing)} ${missing.length === 1 ? 'has' : 'have'} no ${what} on this car`];
  });
  return errors;
}

/**
 * The start's corners with the changes applied, or a 400 listing every change that
 * leaves a value out of range, past the car's adjusters, or has nothing to start from
 * (with any errors already `found`).
 */
function changedCorners(adjusters: Car['damperAdjusters'], start: Setup, changes: SuggestionChange[], message: string, found: FieldErrors = {}) {
  const { corners, errors: applied } = applyCornerChanges(start.corners, changes);
  const errors: FieldErrors = { ...found };
  for (const [key, messages] of Object.entries(applied)) (errors[key] ??= []).push(...messages);
  try {
    checkChangedClicks(adjusters, corners, changes);
  } catch (err) {
    if (!(err instanceof AppError && err.fieldErrors)) throw err;
    for (const [key, messages] of Object.entries(err.fieldErrors)) (errors[key] ??= []).push(...messages);
  }
  if (Object.keys(errors).length) throw new AppError('validation_failed', message, errors);
  return corners;
}

/** A car's suggestions, newest first. */
export async function listSuggestions(ds: DataSource, user: User, carId: string): Promise<Suggestion[]> {
  await assertCarAccess(ds, user, carId, 'read');
  const rows: SuggestionRow[] = await ds.query(`${SELECT_SUGGESTIONS} WHERE g.car_id = $1 ORDER BY g.created_at DESC, g.id DESC`, [carId]);
  if (rows.length === 0) return [];
  const setups = await suggestionSetups(ds, carId);
  return rows.map((r) => toSuggestion(r, setups));
}

/** The open suggestions on the cars the user drives (owns or co-drives), oldest first: what waits for their decision. */
export async function listWaitingSuggestions(ds: DataSource, user: User): Promise<WaitingSuggestion[]> {
  const rows: { id: string; title: string; car_id: string; car_name: string; shop_id: string; shop_name: string; created_at: Date }[] = await ds.query(
    `SELECT g.id, g.title, g.car_id, c.name AS car_name, g.shop_id, s.name AS shop_name, g.created_at
       FROM setup_suggestions g
       JOIN cars c ON c.id = g.car_id
       JOIN shops s ON s.id = g.shop_id
      WHERE g.status = 'open' AND g.car_id IN ${accessibleCarIdsSql('$1')}
      ORDER BY g.created_at, g.id`,
    [user.id],
  );
  return rows.map((r) => ({
    id: r.id,
    title: r.title,
    car: { id: r.car_id, name: r.car_name },
    shop: { id: r.shop_id, name: r.shop_name },
    createdAt: r.created_at.toISOString(),
  }));
}

export async function getSuggestion(ds: DataSource, user: User, id: string): Promise<Suggestion> {
  await assertCarChildAccess(ds, user, 'setup_suggestions', id, 'read', 'That suggestion');
  return loadSuggestion(ds, id);
}

/**
 * Staff of a shop the owner granted propose a change to one of the car's snapshots. The
 * changes must leave the base within the setup limits and the car's adjusters. The car's
 * drivers hear about it. A resent client id answers with the suggestion already saved.
 */
export async function createSuggestion(
  ds: DataSource,
  mail: MailSettings | undefined,
  user: User,
  carId: string,
  input: CreateSuggestionInput,
): Promise<{ suggestion: Suggestion; created: boolean }> {
  await assertCarAccess(ds, user, carId, 'suggest');
  const shop = await grantedShopOf(ds, user.id, carId);
  if (!shop) throw new AppError('forbidden', 'Only staff of a shop the owner has granted can suggest setups.');
  if (input.id) {
    const replay = await replayOf(ds, input.id, carId, user);
    if (replay) return { suggestion: replay, created: false };
  }
  const bases: { car_id: string }[] = await ds.query('SELECT car_id FROM setup_snapshots WHERE id = $1', [input.baseSetupId]);
  if (bases[0]?.car_id !== carId) {
    throw new AppError('validation_failed', 'Some fields need attention.', { baseSetupId: ['Pick a setup of this car'] });
  }
  const base = await loadSetup(ds, input.baseSetupId);
  // The car's adjusters, read once for both checks.
  const adjusters = await carAdjusters(ds, carId);
  changedCorners(adjusters, base, input.changes, 'Some fields need attention.', cornersWithoutAdjuster(adjusters, base, input.changes));

  const { id, created, outbox } = await ds.transaction(async (m) => {
    const { inserted, id: newId } = await insertUnlessPresent(m, SetupSuggestionEntity, {
      id: input.id ?? randomUUID(),
      carId,
      baseSetupId: input.baseSetupId,
      shopId: shop.id,
      authorId: user.id,
      title: input.title,
      rationale: input.rationale,
      changes: input.changes,
    });
    if (!inserted) return { id: input.id!, created: false, outbox: [] };
    const audience = await carAudience(m, carId);
    const outbox = await notify(m, mail, {
      kind: 'suggestion',
      actorId: user.id,
      carId,
      suggestionId: newId!,
      summary: `${actorLabel(user.displayName, shop.name)} suggested “${input.title}” for ${audience.carName}`,
      detail: input.rationale,
      recipients: driverRecipients(audience, `/suggestions/${newId}`),
    });
    return { id: newId!, created: true, outbox };
  });
  sendOutbox(mail, outbox);
  if (!created) {
    const replay = await replayOf(ds, id, carId, user);
    if (!replay) throw new AppError('conflict', 'That suggestion id is already in use.');
    return { suggestion: replay, created: false };
  }
  return { suggestion: await loadSuggestion(ds, id), created: true };
}

/** The suggestion a resent id already made, if it is this author's on this car; a clash with anything else is a 409. */
async function replayOf(ds: DataSource, id: string, carId: string, user: User): Promise<Suggestion | null> {
  const rows: { car_id: string; author_id: string }[] = await ds.query('SELECT car_id, author_id FROM setup_suggestions WHERE id = $1', [id]);
  const row = rows[0];
  if (!row) return null;
  if (row.car_id !== carId || row.author_id !== user.id) throw new AppError('conflict', 'That suggestion id is already in use.');
  return loadSuggestion(ds, id);
}

/** Locks the suggestion for a decision; only an open one can be decided. */
async function lockForDecision(m: EntityManager, id: string) {
  const rows: SuggestionRow[] = await m.query(`${SELECT_SUGGESTIONS} WHERE g.id = $1 FOR UPDATE OF g`, [id]);
  const row = rows[0];
  if (!row) throw new AppError('not_found', 'That suggestion was not found.');
  return row;
}

function alreadyDecided(row: SuggestionRow, current: Suggestion): AppError {
  return new AppError('conflict', `This suggestion is already ${row.status}; it can be decided only once.`, undefined, undefined, current);
}

/** The author (while they can still see the car) and the suggesting shop's staff, sent to the suggestion. */
function decisionRecipients(audience: CarAudience, row: SuggestionRow): NotificationRecipient[] {
  const link = `/suggestions/${row.id}`;
  const staff = staffRecipients(audience, { shopId: row.shop_id, link });
  const authorSees = staff.some((s) => s.userId === row.author_id) || audience.drivers.includes(row.author_id);
  return [
    ...(authorSees ? [{ userId: row.author_id, link, reason: 'You get this e-mail because you made this suggestion in Scrubline.' }] : []),
    ...staff,
  ];
}

const LABEL_MAX = 80;
const clip = (s: string, max: number) => (s.length > max ? `${s.slice(0, max - 1)}…` : s);
const when = (d: Date) => `${d.toISOString().slice(0, 16).replace('T', ' ')} UTC`;

/**
 * A driver accepts: in one transaction, a new snapshot is made from the setup in force
 * at `effectiveFrom` (or the suggestion's base when nothing was in force then) with the
 * changes applied, linked to the suggestion, and the suggestion is marked accepted. A
 * resend with the same setupId answers with the same result.
 */
export async function acceptSuggestion(
  ds: DataSource,
  mail: MailSettings | undefined,
  user: User,
  id: string,
  input: AcceptSuggestionInput,
): Promise<{ suggestion: Suggestion; setup: Setup; created: boolean }> {
  const carId = await assertCarChildAccess(ds, user, 'setup_suggestions', id, 'decide', 'That suggestion');
  const { setupId, created, outbox } = await ds.transaction(async (m) => {
    const row = await lockForDecision(m, id);
    if (row.status !== 'open') {
      if (row.status === 'accepted' && input.setupId && row.accepted_setup_id === input.setupId) {
        return { setupId: input.setupId, created: false, outbox: [] };
      }
      throw alreadyDecided(row, await loadSuggestion(m, id));
    }
    const effectiveFrom = new Date(input.effectiveFrom);
    const start = (await activeSetupAt(m, carId, effectiveFrom)) ?? (await loadSetup(m, row.base_setup_id));
    const corners = changedCorners(await carAdjusters(m, carId), start, row.changes, `The setup in force then ("${start.label}") cannot take these changes.`);
    const label = input.label ?? clip(`From ${row.shop_name}: ${row.title}`, LABEL_MAX);
    const snapshot = await insertSnapshot(
      m,
      user,
      carId,
      {
        ...(input.setupId ? { id: input.setupId } : {}),
        label,
        effectiveFrom: effectiveFrom.toISOString(),
        corners,
        axles: start.axles,
        derivedFromId: start.id,
        notes: null,
      },
      { suggestionId: row.id },
    );
    if (!snapshot.created) throw new AppError('conflict', 'That setup id is already in use.');
    await m.query(
      `UPDATE setup_suggestions
          SET status = 'accepted', decided_by = $2, decided_at = now(), accepted_setup_id = $3, version = version + 1, updated_at = now()
        WHERE id = $1`,
      [id, user.id, snapshot.id],
    );
    const audience = await carAudience(m, carId);
    const outbox = await notify(m, mail, {
      kind: 'suggestion_decided',
      actorId: user.id,
      carId,
      suggestionId: id,
      summary: `${user.displayName} accepted “${row.title}” for ${audience.carName}`,
      detail: `It is on the car as the setup “${label}”, from ${when(effectiveFrom)}.`,
      recipients: decisionRecipients(audience, row),
    });
    return { setupId: snapshot.id, created: true, outbox };
  });
  sendOutbox(mail, outbox);
  return { suggestion: await loadSuggestion(ds, id), setup: await loadSetup(ds, setupId), created };
}

/** A driver declines, saying why. Sending the same decline again changes nothing. */
export async function declineSuggestion(
  ds: DataSource,
  mail: MailSettings | undefined,
  user: User,
  id: string,
  input: DeclineSuggestionInput,
): Promise<Suggestion> {
  const carId = await assertCarChildAccess(ds, user, 'setup_suggestions', id, 'decide', 'That suggestion');
  const outbox = await ds.transaction(async (m) => {
    const row = await lockForDecision(m, id);
    if (row.status !== 'open') {
      if (row.status === 'declined' && row.decided_by === user.id && row.decision_note === input.note) return [];
      throw alreadyDecided(row, await loadSuggestion(m, id));
    }
    await m.query(
      `UPDATE setup_suggestions
          SET status = 'declined', decided_by = $2, decided_at = now(), decision_note = $3, version = version + 1, updated_at = now()
        WHERE id = $1`,
      [id, user.id, input.note],
    );
    const audience = await carAudience(m, carId);
    return notify(m, mail, {
      kind: 'suggestion_decided',
      actorId: user.id,
      carId,
      suggestionId: id,
      summary: `${user.displayName} declined “${row.title}” for ${audience.carName}`,
      detail: `Their note: ${input.note}`,
      recipients: decisionRecipients(audience, row),
    });
  });
  sendOutbox(mail, outbox);
  return loadSuggestion(ds, id);
}

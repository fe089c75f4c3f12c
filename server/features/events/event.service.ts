import type { DataSource } from 'typeorm';
import type { User } from '@shared/auth/auth.schema';
import type { CreateEventInput, SeasonEvent } from '@shared/season/event.schema';
import type { Run } from '@shared/season/run.schema';
import { bestRun } from '@shared/calc/scoring.calc';
import { AppError } from '../../lib/app-error';
import { accessibleCarIdsSql, assertCarAccess, assertEventAccess, eventSharedThroughCarSql } from '../../auth/access';
import { loadRuns } from '../runs/run.service';
import { insertUnlessPresent } from '../../lib/insert';
import { EventEntity } from './event.entity';

function toEvent(e: EventEntity): SeasonEvent {
  return {
    id: e.id,
    name: e.name,
    date: e.date,
    venue: e.venue,
    kind: e.kind,
    conePenaltySec: e.conePenaltySec,
    surface: e.surface,
    airTempC: e.airTempC,
    trackTempC: e.trackTempC,
    notes: e.notes,
    teamId: e.teamId,
    createdBy: e.createdBy,
    createdAt: e.createdAt.toISOString(),
  };
}

export async function createEvent(ds: DataSource, user: User, input: CreateEventInput): Promise<{ event: SeasonEvent; created: boolean }> {
  if (input.teamId) {
    const member = await ds.query('SELECT 1 FROM team_members WHERE team_id = $1 AND user_id = $2', [input.teamId, user.id]);
    if (member.length === 0) {
      throw new AppError('validation_failed', 'Some fields need attention.', { teamId: ['You are not a member of that team'] });
    }
  }
  const { inserted, id } = await insertUnlessPresent(ds.manager, EventEntity, { ...input, createdBy: user.id });
  const saved = await ds.getRepository(EventEntity).findOneBy({ id: id ?? input.id! });
  // A replay answers with the stored event; someone else's id is not revealed.
  if (!saved || (!inserted && saved.createdBy !== user.id)) throw new AppError('conflict', 'That event id is already in use.');
  return { event: toEvent(saved), created: inserted };
}

/** Events the user can see, newest first (see assertEventAccess for who sees what). */
export async function listEvents(ds: DataSource, user: User): Promise<SeasonEvent[]> {
  const ids: { id: string }[] = await ds.query(
    `SELECT e.id FROM events e
      WHERE e.created_by = $1
         OR EXISTS (SELECT 1 FROM runs r WHERE r.event_id = e.id AND r.car_id IN ${accessibleCarIdsSql('$1')})
         OR ${eventSharedThroughCarSql('$1')}`,
    [user.id],
  );
  if (ids.length === 0) return [];
  const events = await ds
    .getRepository(EventEntity)
    .createQueryBuilder('e')
    .where('e.id IN (:...ids)', { ids: ids.map((r) => r.id) })
    .orderBy('e.date', 'DESC')
    .addOrderBy('e.created_at', 'DESC')
    .getMany();
  return events.map(toEvent);
}

export async function getEvent(ds: DataSource, user: User, eventId: string): Promise<SeasonEvent> {
  await assertEventAccess(ds, user, eventId);
  const e = await ds.getRepository(EventEntity).findOneByOrFail({ id: eventId });
  return toEvent(e);
}

export interface EventSummaryEntry {
  carId: string;
  carName: string;
  driver: { id: string; displayName: string };
  bestRawSec: number | null;
  bestAdjustedSec: number | null;
  bestRunId: string | null;
  cones: number;
  dnfs: number;
  offCourses: number;
  runCount: number;
  runs: Run[];
}

export interface EventSummary {
  event: SeasonEvent;
  entries: EventSummaryEntry[];
}

/** Per car and driver at one event: bests, cones, DNFs and the runs in order. */
export async function eventSummary(ds: DataSource, user: User, eventId: string, carId?: string): Promise<EventSummary> {
  const event = await getEvent(ds, user, eventId);
  const params: unknown[] = [eventId, user.id];
  let where = `r.event_id = $1 AND r.car_id IN ${accessibleCarIdsSql('$2')}`;
  if (carId) {
    // One car asked for by someone who may read it (its drivers, or a granted shop's staff).
    await assertCarAccess(ds, user, carId, 'read');
    where = `r.event_id = $1 AND r.car_id = $2`;
    params[1] = carId;
  }
  const runs = await loadRuns(ds, where, params);
  const carNames: { id: string; name: string }[] = runs.length
    ? await ds.query('SELECT id, name FROM cars WHERE id = ANY($1)', [[...new Set(runs.map((r) => r.carId))]])
    : [];
  const nameOf = new Map(carNames.map((c) => [c.id, c.name]));
  const groups = new Map<string, Run[]>();
  for (const run of runs) {
    const key = `${run.carId}|${run.driver.id}`;
    groups.set(key, [...(groups.get(key) ?? []), run]);
  }
  const entries = [...groups.values()].map((group): EventSummaryEntry => {
    const first = group[0]!;
    const best = group.find((r) => r.isBest) ?? null;
    const rawBest = bestRun(group.map((r) => ({ ...r, cones: 0 })), 0);
    return {
      carId: first.carId,
      carName: nameOf.get(first.carId) ?? '',
      driver: first.driver,
      bestRawSec: rawBest?.rawTimeSec ?? null,
      bestAdjustedSec: best?.adjustedTimeSec ?? null,
      bestRunId: best?.id ?? null,
      cones: group.reduce((n, r) => n + r.cones, 0),
      dnfs: group.filter((r) => r.status === 'dnf').length,
      offCourses: group.filter((r) => r.status === 'off_course').length,
      runCount: group.length,
      runs: group,
    };
  });
  entries.sort((a, b) => (a.bestAdjustedSec ?? Infinity) - (b.bestAdjustedSec ?? Infinity));
  return { event, entries };
}

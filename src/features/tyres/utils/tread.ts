import type { Corner } from '@shared/season/corners';
import type { TreadCorner, TreadReading, TyreSet } from '@shared/season/tyre.schema';
import type { OutboxEntry } from '@/lib/outbox';
import type { CreateTreadReadingBody } from '../api/create-tread-reading';

export type TreadPosition = keyof TreadCorner;

export const POSITION_WORDS: Record<TreadPosition, string> = { innerMm: 'inner', middleMm: 'middle', outerMm: 'outer' };
export const POSITION_SHORT: Record<TreadPosition, string> = { innerMm: 'In', middleMm: 'Mid', outerMm: 'Out' };

/**
 * The three positions across a tread as they sit on the car seen from above: on the left side
 * the outer edge is on the left, on the right side it is on the right.
 */
export function positionsAcross(corner: Corner): TreadPosition[] {
  return corner === 'lf' || corner === 'lr' ? ['outerMm', 'middleMm', 'innerMm'] : ['innerMm', 'middleMm', 'outerMm'];
}

/** Wear bars sit at 1.6 mm (2/32 in): common practice and the legal minimum in many places. */
export const WEAR_BAR_MM = 1.6;

export interface ReadingView extends Pick<TreadReading, 'id' | 'takenAt'> {
  corners: Partial<Record<Corner, TreadCorner & { tyreNumber?: number | null }>>;
  pending: null | { state: 'waiting' | 'failed' };
}

/** The latest reading of a set, counting readings still waiting in the outbox. */
export function latestReading(set: TyreSet, entries: readonly OutboxEntry[]): ReadingView | null {
  const readings: ReadingView[] = set.latestReading ? [{ ...set.latestReading, pending: null }] : [];
  for (const entry of entries) {
    if (entry.kind !== 'tread.create' || entry.scope.tyreSetId !== set.id) continue;
    const body = entry.body as CreateTreadReadingBody;
    readings.push({ id: body.id, takenAt: body.takenAt, corners: body.corners, pending: { state: entry.state === 'failed' ? 'failed' : 'waiting' } });
  }
  return readings.sort((a, b) => new Date(b.takenAt).getTime() - new Date(a.takenAt).getTime())[0] ?? null;
}

/** A set's readings but one (the latest, shown on its own), newest first; two taken at the same time, the later saved first. */
export function earlierReadings(readings: readonly TreadReading[], latestId: string): TreadReading[] {
  const time = (at: string) => new Date(at).getTime();
  return readings
    .filter((r) => r.id !== latestId)
    .sort((a, b) => time(b.takenAt) - time(a.takenAt) || time(b.createdAt) - time(a.createdAt));
}

/** "after 12 runs on this set", for a reading the server counted; null for one still on this phone. */
export function runsOnSetText(reading: { runsOnSet?: number }): string | null {
  if (reading.runsOnSet === undefined) return null;
  return `after ${reading.runsOnSet} ${reading.runsOnSet === 1 ? 'run' : 'runs'} on this set`;
}

import type { ChangeLogEntry } from '@shared/season/change-log.schema';

/** What the before/after picker needs of a change-log entry. */
export type ChangeOption = Pick<ChangeLogEntry, 'id' | 'changedOn' | 'what' | 'location'>;

const FRONT_LOCATIONS = new Set(['front', 'lf', 'rf']);

/** Whether an entry is about camber or the front of the car (its words, or where it was made). */
function aboutCamberOrFront(c: ChangeOption): boolean {
  return /camber|front/i.test(c.what) || FRONT_LOCATIONS.has(c.location);
}

/** Oldest first by day; entries of the same day keep the log's order. */
export function byDay(changes: readonly ChangeOption[]): ChangeOption[] {
  return changes
    .map((c, i) => ({ c, i }))
    .sort((a, b) => a.c.changedOn.localeCompare(b.c.changedOn) || a.i - b.i)
    .map(({ c }) => c);
}

/** The entry to compare first: the latest about camber or the front, else the latest of all; null for an empty log. */
export function defaultChangeId(changes: readonly ChangeOption[]): string | null {
  const ordered = byDay(changes);
  for (let i = ordered.length - 1; i >= 0; i--) {
    if (aboutCamberOrFront(ordered[i]!)) return ordered[i]!.id;
  }
  return ordered.at(-1)?.id ?? null;
}

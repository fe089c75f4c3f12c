import type { SeasonEvent } from '@shared/season/event.schema';
import type { OutboxEntry, OutboxError } from '@/lib/outbox';
import type { CreateEventBody } from '../api/create-event';

/** An event as screens show it: saved on the server, or made on this phone and not uploaded yet. */
export interface EventView extends SeasonEvent {
  pending: null | { state: 'waiting' | 'failed'; entryKey: string; error?: OutboxError };
}

export const isEventCreate = (entry: OutboxEntry) => entry.kind === 'event.create';

/** The event an outbox entry will create, from the body the phone stored. */
export function eventFromEntry(entry: OutboxEntry, pending: boolean): EventView {
  const body = entry.body as CreateEventBody;
  return {
    id: body.id,
    name: body.name,
    date: body.date,
    venue: body.venue ?? null,
    kind: body.kind ?? 'autocross',
    conePenaltySec: body.conePenaltySec ?? 2,
    surface: body.surface ?? null,
    airTempC: body.airTempC ?? null,
    trackTempC: body.trackTempC ?? null,
    notes: body.notes ?? null,
    teamId: body.teamId ?? null,
    createdBy: '',
    createdAt: new Date(entry.createdAt).toISOString(),
    pending: pending
      ? { state: entry.state === 'failed' ? 'failed' : 'waiting', entryKey: entry.key, ...(entry.error ? { error: entry.error } : {}) }
      : null,
  };
}

/**
 * Saved events, plus events still on this phone (waiting or refused) and events just uploaded
 * that the list does not show yet — newest date first, new ones first within a day.
 */
export function mergeEvents(
  saved: readonly SeasonEvent[],
  entries: readonly OutboxEntry[],
  justDelivered: readonly OutboxEntry[] = [],
): EventView[] {
  const known = new Set(saved.map((e) => e.id));
  const local: EventView[] = [];
  for (const entry of entries) {
    if (!isEventCreate(entry) || known.has(entry.recordId)) continue;
    known.add(entry.recordId);
    local.push(eventFromEntry(entry, true));
  }
  for (const entry of justDelivered) {
    if (!isEventCreate(entry) || known.has(entry.recordId)) continue;
    known.add(entry.recordId);
    local.push(eventFromEntry(entry, false));
  }
  const all: EventView[] = [...local.reverse(), ...saved.map((e) => ({ ...e, pending: null }))];
  // A stable sort: within one day, the order above (newest made first, then the server's) stays.
  return all.sort((a, b) => b.date.localeCompare(a.date));
}

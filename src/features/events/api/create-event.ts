import type { CreateEventInput } from '@shared/season/event.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

/** An event made on the phone always carries its device-made id, so a replay is the same event. */
export type CreateEventBody = CreateEventInput & { id: string };

export function createEventEntry(body: CreateEventBody) {
  return {
    recordId: body.id,
    kind: 'event.create',
    method: 'POST' as const,
    path: '/api/events',
    body,
    label: `Event · ${body.name}`,
    scope: { eventId: body.id },
  };
}

/**
 * Saves a new event on the device; the outbox uploads it. Runs logged into it afterwards queue
 * behind it (the outbox sends strictly in order), so the server always knows the event first.
 */
export function useCreateEvent() {
  return useOutboxWrite('event.create');
}

import type { CreateChangeInput } from '@shared/season/change-log.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

export type CreateChangeBody = CreateChangeInput & { id: string };

export function createChangeEntry(carId: string, body: CreateChangeBody) {
  return {
    recordId: body.id,
    kind: 'change.create',
    method: 'POST' as const,
    path: `/api/cars/${encodeURIComponent(carId)}/changes`,
    body,
    label: `Change log · ${body.what}`,
    scope: { carId },
  };
}

/** Adds a change-log entry on the device; the outbox uploads it. */
export function useCreateChange() {
  return useOutboxWrite('change.create');
}

import type { CreateTreadReadingInput } from '@shared/season/tyre.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

export type CreateTreadReadingBody = CreateTreadReadingInput & { id: string };

export function createTreadReadingEntry(carId: string, tyreSetId: string, setLabel: string, body: CreateTreadReadingBody) {
  return {
    recordId: body.id,
    kind: 'tread.create',
    method: 'POST' as const,
    path: `/api/tyre-sets/${encodeURIComponent(tyreSetId)}/readings`,
    body,
    label: `Tread · ${setLabel}`,
    scope: { carId, tyreSetId },
  };
}

/** Saves a tread reading on the device; the outbox uploads it. */
export function useCreateTreadReading() {
  return useOutboxWrite('tread.create');
}

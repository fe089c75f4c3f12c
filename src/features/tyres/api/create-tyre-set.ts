import type { CreateTyreSetInput } from '@shared/season/tyre.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

/** A tyre set made on the phone always carries its device-made id, so a replay is the same set. */
export type CreateTyreSetBody = CreateTyreSetInput & { id: string };

export function createTyreSetEntry(carId: string, body: CreateTyreSetBody) {
  return {
    recordId: body.id,
    kind: 'tyreSet.create',
    method: 'POST' as const,
    path: `/api/cars/${encodeURIComponent(carId)}/tyre-sets`,
    body,
    label: `Tyre set · ${body.label}`,
    scope: { carId, tyreSetId: body.id },
  };
}

/** Saves a new tyre set on the device; the outbox uploads it (tyres 1–4 start on LF, RF, LR, RR). */
export function useCreateTyreSet() {
  return useOutboxWrite('tyreSet.create');
}

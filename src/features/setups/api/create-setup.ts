import type { CreateSetupInput } from '@shared/season/setup.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

export type CreateSetupBody = CreateSetupInput & { id: string };

/** The outbox entry that saves a new snapshot; the id is made on the device, so a replay never makes a second one. */
export function createSetupEntry(carId: string, body: CreateSetupBody) {
  return {
    recordId: body.id,
    kind: 'setup.create',
    method: 'POST' as const,
    path: `/api/cars/${encodeURIComponent(carId)}/setups`,
    body,
    label: `Setup · ${body.label}`,
    scope: { carId },
  };
}

/** Saves a snapshot on the device first; the outbox uploads it. */
export function useCreateSetup() {
  return useOutboxWrite('setup.create');
}

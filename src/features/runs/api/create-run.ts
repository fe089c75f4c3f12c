import type { CreateRunInput } from '@shared/season/run.schema';
import { useOutboxWrite } from '@/lib/outbox-context';
import { runLabel } from '../utils/run-words';

/** A run always carries its device-made id and the driver, so a replay is recognised and nothing is guessed. */
export type CreateRunBody = CreateRunInput & { driverId: string };

export function createRunEntry(body: CreateRunBody) {
  return {
    recordId: body.id,
    kind: 'run.create',
    method: 'POST' as const,
    path: '/api/runs',
    body,
    label: runLabel(body),
    scope: { carId: body.carId, eventId: body.eventId },
  };
}

/** Logs a run on the device; the outbox uploads it. */
export function useCreateRun() {
  return useOutboxWrite('run.create');
}

import type { CreateMountingInput } from '@shared/season/tyre.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

/**
 * A rotation: which of the set's tyres sits on which corner from `mountedAt`. It carries an id made
 * here, so a resend after a lost answer is recorded once; the entry's record is the tyre set, so it
 * waits behind the set's own upload (and behind a refusal of it).
 */
export function rotateTyresEntry(carId: string, tyreSetId: string, setLabel: string, input: CreateMountingInput) {
  const body: CreateMountingInput = { id: input.id ?? crypto.randomUUID(), ...input };
  return {
    recordId: tyreSetId,
    kind: 'tyreSet.rotate',
    method: 'POST' as const,
    path: `/api/tyre-sets/${encodeURIComponent(tyreSetId)}/mountings`,
    body,
    label: `Rotation · ${setLabel}`,
    scope: { carId, tyreSetId },
  };
}

/** Records a rotation on the device; the outbox uploads it, so it works at the car with no signal. */
export function useRotateTyres() {
  return useOutboxWrite('tyreSet.rotate');
}

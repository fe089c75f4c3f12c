import type { CreateMountingInput } from '@shared/season/tyre.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

/**
 * A rotation: which of the set's tyres sits on which corner from `mountedAt`. The server takes no
 * client id for it, so the entry's record is the tyre set: it waits behind the set's own upload
 * (and behind a refusal of it). Sent twice by a lost answer, it records the same tyres on the same
 * corners at the same moment, which changes nothing the app reads.
 */
export function rotateTyresEntry(carId: string, tyreSetId: string, setLabel: string, body: CreateMountingInput) {
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

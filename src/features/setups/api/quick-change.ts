import type { QuickChangeInput } from '@shared/season/setup.schema';
import { useOutboxWrite } from '@/lib/outbox-context';

/** Always sent with the snapshot's client id and the device time of the tap, so the runs after it are tied to it. */
export type QuickChangeBody = QuickChangeInput & { id: string; effectiveFrom: string; label: string };

export function quickChangeEntry(carId: string, body: QuickChangeBody) {
  return {
    recordId: body.id,
    kind: 'setup.quickChange',
    method: 'POST' as const,
    path: `/api/cars/${encodeURIComponent(carId)}/setups/quick-change`,
    body,
    label: body.label,
    scope: { carId },
  };
}

export function useQuickChange() {
  return useOutboxWrite('setup.quickChange');
}

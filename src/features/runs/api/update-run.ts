import type { UpdateRunInput } from '@shared/season/run.schema';
import { useOutboxWrite } from '@/lib/outbox-context';
import { runLabel } from '../utils/run-words';

export function updateRunEntry(
  run: { id: string; carId: string; eventId: string },
  body: UpdateRunInput,
  after: Parameters<typeof runLabel>[0],
) {
  return {
    recordId: run.id,
    kind: 'run.update',
    method: 'PATCH' as const,
    path: `/api/runs/${encodeURIComponent(run.id)}`,
    body,
    label: `Edit ${runLabel(after)}`,
    scope: { carId: run.carId, eventId: run.eventId },
  };
}

/** Edits a run on the device; an edit of a run not yet uploaded is folded into its upload. */
export function useUpdateRun() {
  return useOutboxWrite('run.update');
}

import { useOutboxWrite } from '@/lib/outbox-context';

export function deleteRunEntry(run: { id: string; carId: string; eventId: string; runNumber: number }) {
  return {
    recordId: run.id,
    kind: 'run.delete',
    method: 'DELETE' as const,
    path: `/api/runs/${encodeURIComponent(run.id)}`,
    label: `Delete run ${run.runNumber}`,
    scope: { carId: run.carId, eventId: run.eventId },
  };
}

/** Deletes a run; a run not yet uploaded is simply taken out of the outbox. */
export function useDeleteRun() {
  return useOutboxWrite('run.delete');
}

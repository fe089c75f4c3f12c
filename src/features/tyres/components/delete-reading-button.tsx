import { ConfirmButton, refusalText } from '@/components/dialogs/confirm-button';
import { formatDateTime } from '@/lib/dates';
import { useDeleteTreadReading } from '../api/delete-tread-reading';

/** Deletes one saved reading (a typo: 5.4 for 4.5), after asking, so it stops counting in the set's wear. */
export function DeleteReadingButton({ tyreSetId, readingId, setLabel, takenAt }: { tyreSetId: string; readingId: string; setLabel: string; takenAt: string }) {
  const remove = useDeleteTreadReading(tyreSetId);
  return (
    <ConfirmButton
      title={`Delete the ${setLabel} reading of ${formatDateTime(takenAt)}?`}
      destructive
      description="Its depths stop counting in the set's wear and the season review, and its comments and photos go with it. It cannot be undone; type the reading again if you need it back."
      confirmLabel="Delete reading"
      pendingLabel="Deleting…"
      keepLabel="Keep"
      isPending={remove.isPending}
      onConfirm={(handlers) => remove.mutate(readingId, handlers)}
      failureText={refusalText}
    >
      Delete this reading<span className="sr-only"> of {setLabel}</span>
    </ConfirmButton>
  );
}

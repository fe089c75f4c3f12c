import { useMemo } from 'react';
import { notYetFetched, useDeliveredEntries } from '@/lib/delivered-entries';
import { useOutboxEntriesFor } from '@/lib/outbox-context';
import { useTyreSets } from '../api/get-tyre-sets';
import { mergeTyreSets } from '../utils/tyre-set-views';

/** A car's tyre sets with what this phone has made and not uploaded yet (new sets, rotations). */
export function useTyreSetViews(carId: string) {
  const query = useTyreSets(carId);
  const entries = useOutboxEntriesFor({ carId });
  const delivered = useDeliveredEntries();
  const sets = useMemo(() => {
    const landed = notYetFetched(
      delivered.filter((d) => d.entry.scope.carId === carId),
      query.dataUpdatedAt,
    );
    return mergeTyreSets(query.data?.items ?? [], entries, landed);
  }, [query.data, query.dataUpdatedAt, entries, delivered, carId]);
  const local = sets.length > (query.data?.items.length ?? 0);
  return {
    sets,
    /** The outbox entries of this car (tread readings still on the phone, among others). */
    entries,
    isPending: query.isPending && !local && !query.isError,
    isError: query.isError && !local,
  };
}

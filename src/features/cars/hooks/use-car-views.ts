import { useMemo } from 'react';
import type { Person } from '@shared/season/car.schema';
import { notYetFetched, useDeliveredEntries } from '@/lib/delivered-entries';
import { useOutboxEntries } from '@/lib/outbox-context';
import { useCars } from '../api/get-cars';
import { mergeCars } from '../utils/pending-cars';

/** The user's cars, with the ones made on this phone that the server does not have yet. */
export function useCarViews(owner: Person) {
  const query = useCars();
  const entries = useOutboxEntries();
  const delivered = useDeliveredEntries();
  const { id, displayName } = owner;
  const cars = useMemo(
    () => mergeCars(query.data?.items ?? [], entries, { id, displayName }, notYetFetched(delivered, query.dataUpdatedAt)),
    [query.data, query.dataUpdatedAt, entries, delivered, id, displayName],
  );
  const local = cars.length > (query.data?.items.length ?? 0);
  return {
    cars,
    isPending: query.isPending && !local && !query.isError,
    isError: query.isError && !local,
  };
}

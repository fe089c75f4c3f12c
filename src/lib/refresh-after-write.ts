import type { InvalidateQueryFilters, QueryClient } from '@tanstack/react-query';

/**
 * Reads again what a write changed, once the write is done. TanStack Query restarts a read in flight only when
 * the query already holds data; a first read in flight is joined instead (`Query.fetch`, `cancelRefetch`), and
 * its answer may have left the server before the write, as with a list searched just before a suspension.
 * Such a query is read once more after that answer lands. Nothing is cancelled, so a page's loader waiting on
 * the same read still gets its answer.
 */
export async function refreshAfterWrite(queryClient: QueryClient, filters: InvalidateQueryFilters): Promise<void> {
  const firstReads = queryClient
    .getQueryCache()
    .findAll(filters)
    .filter((query) => query.state.fetchStatus === 'fetching' && query.state.data === undefined);
  await queryClient.invalidateQueries(filters);
  await Promise.all(firstReads.map(({ queryKey }) => queryClient.invalidateQueries({ queryKey, exact: true })));
}

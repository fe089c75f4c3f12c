import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Run } from '@shared/season/run.schema';
import { api } from '@/lib/api-client';
import { runKeys } from './run-keys';
import { firstReads } from '@shared/api/first-reads';

/** One car's runs at one event, every driver, scored by the server. */
export function getRuns(filter: { carId: string; eventId: string }, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: Run[]; count: number }> {
  return api.get(firstReads.runs(filter), { signal });
}

export function runsQueryOptions(filter: { carId: string; eventId: string }) {
  return queryOptions({ queryKey: runKeys.list(filter), queryFn: ({ signal }) => getRuns(filter, { signal }) });
}

export function useRuns(filter: { carId: string; eventId: string }) {
  return useQuery(runsQueryOptions(filter));
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TreadReading } from '@shared/season/tyre.schema';
import { api } from '@/lib/api-client';
import { tyreKeys } from './tyre-keys';

/** Every saved tread reading of one tyre set (the server sends them oldest first). */
export function getTreadReadings(tyreSetId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: TreadReading[]; count: number }> {
  return api.get(`/api/tyre-sets/${encodeURIComponent(tyreSetId)}/readings`, { signal });
}

export function treadReadingsQueryOptions(tyreSetId: string) {
  return queryOptions({ queryKey: tyreKeys.readings(tyreSetId), queryFn: ({ signal }) => getTreadReadings(tyreSetId, { signal }) });
}

/** A set's readings, asked for only once `enabled` (the history is opened). */
export function useTreadReadings(tyreSetId: string, { enabled }: { enabled: boolean }) {
  return useQuery({ ...treadReadingsQueryOptions(tyreSetId), enabled });
}

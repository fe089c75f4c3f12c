import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CompareResult } from '@shared/analysis/analysis.schema';
import { api } from '@/lib/api-client';
import { analysisKeys } from './analysis-keys';

/** Wear and time before and after a change-log entry (Welch's t-test per measurement, with a verdict sentence). */
export function getCompare(carId: string, changeId: string, { signal }: { signal?: AbortSignal } = {}): Promise<CompareResult> {
  const query = new URLSearchParams({ changeId });
  return api.get(`/api/cars/${encodeURIComponent(carId)}/analysis/compare?${query.toString()}`, { signal });
}

export function compareQueryOptions(carId: string, changeId: string) {
  return queryOptions({
    queryKey: analysisKeys.compare(carId, changeId),
    queryFn: ({ signal }) => getCompare(carId, changeId, { signal }),
    meta: { errorsShownInline: true },
  });
}

/** Waits (no request) until a change is picked. */
export function useCompare(carId: string, changeId: string | null) {
  return useQuery({ ...compareQueryOptions(carId, changeId ?? ''), enabled: changeId !== null });
}

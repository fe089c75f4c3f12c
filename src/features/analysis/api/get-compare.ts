import { queryOptions, useQuery } from '@tanstack/react-query';
import type { CompareResult } from '@shared/analysis/analysis.schema';
import { api } from '@/lib/api-client';
import { analysisKeys } from './analysis-keys';

/** Where the season is split: at a change-log entry, or at a moment (a new setup's start). */
export type CompareSplit = { changeId: string } | { at: string };

const splitKey = (split: CompareSplit) => ('changeId' in split ? split.changeId : `at:${split.at}`);

/** Wear and time before and after a split (Welch's t-test per measurement, with a verdict sentence). */
export function getCompare(carId: string, split: CompareSplit, { signal }: { signal?: AbortSignal } = {}): Promise<CompareResult> {
  const query = new URLSearchParams(split);
  return api.get(`/api/cars/${encodeURIComponent(carId)}/analysis/compare?${query.toString()}`, { signal });
}

export function compareQueryOptions(carId: string, split: CompareSplit) {
  return queryOptions({
    queryKey: analysisKeys.compare(carId, splitKey(split)),
    queryFn: ({ signal }) => getCompare(carId, split, { signal }),
    meta: { errorsShownInline: true },
  });
}

export function useCompare(carId: string, split: CompareSplit) {
  return useQuery(compareQueryOptions(carId, split));
}

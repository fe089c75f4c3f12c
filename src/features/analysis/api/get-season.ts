import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { SeasonResult } from '@shared/analysis/analysis.schema';
import { api } from '@/lib/api-client';
import { analysisKeys } from './analysis-keys';

/** 1.6 mm: where wear indicators sit (2/32 in is 1.5875 mm). */
export const DEFAULT_MIN_DEPTH_MM = 1.6;

/** The season at a glance: best times per event, setup changes, the change log and tyre life to `minDepthMm`. */
export function getSeason(carId: string, minDepthMm: number, { signal }: { signal?: AbortSignal } = {}): Promise<SeasonResult> {
  const query = new URLSearchParams({ minDepthMm: String(minDepthMm) });
  return api.get(`/api/cars/${encodeURIComponent(carId)}/season?${query.toString()}`, { signal });
}

export function seasonQueryOptions(carId: string, minDepthMm: number) {
  return queryOptions({
    queryKey: analysisKeys.season(carId, minDepthMm),
    queryFn: ({ signal }) => getSeason(carId, minDepthMm, { signal }),
    meta: { errorsShownInline: true },
  });
}

/** Keeps the last answer on screen while a new minimum depth is fetched. */
export function useSeason(carId: string, minDepthMm: number) {
  return useQuery({ ...seasonQueryOptions(carId, minDepthMm), placeholderData: keepPreviousData });
}

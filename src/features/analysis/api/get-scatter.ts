import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ScatterResult } from '@shared/analysis/analysis.schema';
import { api } from '@/lib/api-client';
import { analysisKeys, type ScatterRequest } from './analysis-keys';

/** A setup value against time or wear over the car's season, with a least-squares line when there is enough data. */
export function getScatter(carId: string, request: ScatterRequest, { signal }: { signal?: AbortSignal } = {}): Promise<ScatterResult> {
  const query = new URLSearchParams({ x: request.x, y: request.y, corner: request.corner });
  return api.get(`/api/cars/${encodeURIComponent(carId)}/analysis/scatter?${query.toString()}`, { signal });
}

export function scatterQueryOptions(carId: string, request: ScatterRequest) {
  return queryOptions({
    queryKey: analysisKeys.scatter(carId, request),
    queryFn: ({ signal }) => getScatter(carId, request, { signal }),
    meta: { errorsShownInline: true },
  });
}

/** Keeps the last plot on screen while a new choice loads; `enabled: false` waits without asking. */
export function useScatter(carId: string, request: ScatterRequest, { enabled = true }: { enabled?: boolean } = {}) {
  return useQuery({ ...scatterQueryOptions(carId, request), placeholderData: keepPreviousData, enabled });
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TyreSet } from '@shared/season/tyre.schema';
import { api } from '@/lib/api-client';
import { tyreKeys } from './tyre-keys';

/** A car's tyre sets, each with its mountings and its latest tread reading. */
export function getTyreSets(carId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: TyreSet[]; count: number }> {
  return api.get(`/api/cars/${encodeURIComponent(carId)}/tyre-sets`, { signal });
}

export function tyreSetsQueryOptions(carId: string) {
  return queryOptions({ queryKey: tyreKeys.setsOfCar(carId), queryFn: ({ signal }) => getTyreSets(carId, { signal }) });
}

export function useTyreSets(carId: string) {
  return useQuery(tyreSetsQueryOptions(carId));
}

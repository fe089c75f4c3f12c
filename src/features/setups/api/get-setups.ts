import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Setup } from '@shared/season/setup.schema';
import { api } from '@/lib/api-client';
import { setupKeys } from './setup-keys';
import { firstReads } from '@shared/api/first-reads';

/** A car's setup snapshots, newest effectiveFrom first. */
export function getSetups(carId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: Setup[]; count: number }> {
  return api.get(firstReads.setups(carId), { signal });
}

export function setupsQueryOptions(carId: string) {
  return queryOptions({ queryKey: setupKeys.ofCar(carId), queryFn: ({ signal }) => getSetups(carId, { signal }) });
}

export function useSetups(carId: string) {
  return useQuery(setupsQueryOptions(carId));
}

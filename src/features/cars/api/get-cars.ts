import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Car } from '@shared/season/car.schema';
import { api } from '@/lib/api-client';
import { carKeys } from './car-keys';
import { firstReads } from '@shared/api/first-reads';

export function getCars({ signal }: { signal?: AbortSignal } = {}): Promise<{ items: Car[]; count: number }> {
  return api.get(firstReads.cars, { signal });
}

export function carsQueryOptions() {
  return queryOptions({ queryKey: carKeys.list(), queryFn: ({ signal }) => getCars({ signal }) });
}

export function useCars() {
  return useQuery(carsQueryOptions());
}

import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Car } from '@shared/season/car.schema';
import { api } from '@/lib/api-client';
import { carKeys } from './car-keys';

export function getCar(carId: string, { signal }: { signal?: AbortSignal } = {}): Promise<Car> {
  return api.get(`/api/cars/${encodeURIComponent(carId)}`, { signal });
}

export function carQueryOptions(carId: string) {
  return queryOptions({ queryKey: carKeys.detail(carId), queryFn: ({ signal }) => getCar(carId, { signal }) });
}

export function useCar(carId: string) {
  return useQuery(carQueryOptions(carId));
}

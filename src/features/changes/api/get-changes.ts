import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ChangeLogEntry } from '@shared/season/change-log.schema';
import { api } from '@/lib/api-client';
import { changeKeys } from './change-keys';

/** A car's change log, oldest first. */
export function getChanges(carId: string, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: ChangeLogEntry[]; count: number }> {
  return api.get(`/api/cars/${encodeURIComponent(carId)}/changes`, { signal });
}

export function changesQueryOptions(carId: string) {
  return queryOptions({ queryKey: changeKeys.ofCar(carId), queryFn: ({ signal }) => getChanges(carId, { signal }) });
}

export function useChanges(carId: string) {
  return useQuery(changesQueryOptions(carId));
}

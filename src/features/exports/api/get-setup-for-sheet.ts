import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Setup } from '@shared/season/setup.schema';
import { api } from '@/lib/api-client';
import { exportKeys } from './export-keys';

/** One setup snapshot, as the printable sheet shows it. */
export function getSetupForSheet(setupId: string, { signal }: { signal?: AbortSignal } = {}): Promise<Setup> {
  return api.get(`/api/setups/${encodeURIComponent(setupId)}`, { signal });
}

export function setupForSheetQueryOptions(setupId: string) {
  return queryOptions({ queryKey: exportKeys.setup(setupId), queryFn: ({ signal }) => getSetupForSheet(setupId, { signal }) });
}

export function useSetupForSheet(setupId: string) {
  return useQuery(setupForSheetQueryOptions(setupId));
}

import { useMutation } from '@tanstack/react-query';
import type { SeasonImportResult } from '@shared/export/season-file';
import { api } from '@/lib/api-client';

/** The two downloads of a car's season; plain links, so the browser saves them with the session cookie. */
export const seasonFileUrl = (carId: string, kind: 'csv' | 'json') => `/api/cars/${encodeURIComponent(carId)}/export.${kind}`;

/** Sends a season file (already read from JSON) to become a new car of the signed-in user's. */
export function importSeason(file: unknown): Promise<SeasonImportResult> {
  return api.post('/api/cars/import', file);
}

/**
 * An online write: the file is checked by the server, so it is sent at once (never paused for
 * later) and its refusal is shown beside the file picker. The caller refreshes the car lists.
 */
export function useImportSeason({ onSuccess }: { onSuccess?: (result: SeasonImportResult) => unknown } = {}) {
  return useMutation({
    mutationFn: importSeason,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess,
  });
}

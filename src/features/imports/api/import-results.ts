import { useMutation } from '@tanstack/react-query';
import type { ImportResult, ImportResultsInput } from '@shared/import/import.schema';
import { api } from '@/lib/api-client';

/** Sends the chosen runs of a timing sheet; the server answers what it created, found already there, or refused. */
export function importResults(eventId: string, input: ImportResultsInput): Promise<ImportResult> {
  return api.post(`/api/events/${encodeURIComponent(eventId)}/imports`, input);
}

/**
 * An online write (made at home with the file at hand): tried at once, its errors shown on the page.
 * `afterImport` refreshes what shows runs (the page passes the runs' key; features do not import each other).
 */
export function useImportResults(eventId: string, afterImport: () => Promise<unknown>) {
  return useMutation({
    mutationFn: (input: ImportResultsInput) => importResults(eventId, input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => afterImport(),
  });
}

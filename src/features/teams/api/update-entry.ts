import type { UpdateEntryInput } from '@shared/collab/team.schema';
import { api } from '@/lib/api-client';
import { teamPath, useTeamWrite } from './use-team-write';

export function updateEntry(teamId: string, carId: string, input: UpdateEntryInput): Promise<unknown> {
  return api.patch(`${teamPath(teamId)}/entries/${encodeURIComponent(carId)}`, input);
}

/** Changes the class or the sharing of one of the user's entries. */
export function useUpdateEntry(teamId: string) {
  return useTeamWrite(teamId, ({ carId, ...input }: UpdateEntryInput & { carId: string }) => updateEntry(teamId, carId, input));
}

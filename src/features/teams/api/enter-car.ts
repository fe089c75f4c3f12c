import type { EnterCarInput } from '@shared/collab/team.schema';
import { api } from '@/lib/api-client';
import { teamPath, useTeamWrite } from './use-team-write';

export function enterCar(teamId: string, input: EnterCarInput): Promise<unknown> {
  return api.post(`${teamPath(teamId)}/entries`, input);
}

/** Enters one of the user's own cars in a class, with what the team may see of it. */
export function useEnterCar(teamId: string) {
  return useTeamWrite(teamId, (input: EnterCarInput) => enterCar(teamId, input));
}

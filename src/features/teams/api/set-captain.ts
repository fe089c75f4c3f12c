import { api } from '@/lib/api-client';
import { teamPath, useTeamWrite } from './use-team-write';

export interface SetCaptainInput {
  userId: string;
  isCaptain: boolean;
}

export function setCaptain(teamId: string, { userId, isCaptain }: SetCaptainInput): Promise<unknown> {
  return api.patch(`${teamPath(teamId)}/members/${encodeURIComponent(userId)}`, { isCaptain });
}

/** Captains make a member a captain, or a captain a member again. */
export function useSetCaptain(teamId: string) {
  return useTeamWrite(teamId, (input: SetCaptainInput) => setCaptain(teamId, input));
}

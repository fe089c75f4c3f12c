import { api } from '@/lib/api-client';
import { teamPath, useTeamWrite } from './use-team-write';

export function removeMember(teamId: string, userId: string): Promise<void> {
  return api.delete(`${teamPath(teamId)}/members/${encodeURIComponent(userId)}`);
}

/** A captain removes another member (leaving is useLeaveTeam). */
export function useRemoveMember(teamId: string) {
  return useTeamWrite(teamId, (userId: string) => removeMember(teamId, userId));
}

import type { InviteMemberInput } from '@shared/collab/team.schema';
import { api } from '@/lib/api-client';
import { teamPath, useTeamWrite } from './use-team-write';

/** E-mails an invitation to join as a member, or as a captain (`asAdmin`). */
export function inviteToTeam(teamId: string, input: InviteMemberInput): Promise<unknown> {
  return api.post(`${teamPath(teamId)}/invitations`, input);
}

/** Captains only. */
export function useInviteToTeam(teamId: string) {
  return useTeamWrite(teamId, (input: InviteMemberInput) => inviteToTeam(teamId, input));
}

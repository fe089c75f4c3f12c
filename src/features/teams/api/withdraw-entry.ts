import { api } from '@/lib/api-client';
import { teamPath, useTeamWrite } from './use-team-write';

export function withdrawEntry(teamId: string, carId: string): Promise<void> {
  return api.delete(`${teamPath(teamId)}/entries/${encodeURIComponent(carId)}`);
}

/** Takes a car off the team: the owner their own, a captain any (its runs and setups stay with the car). */
export function useWithdrawEntry(teamId: string) {
  return useTeamWrite(teamId, (carId: string) => withdrawEntry(teamId, carId));
}

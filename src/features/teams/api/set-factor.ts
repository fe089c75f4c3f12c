import type { SetFactorInput } from '@shared/collab/team.schema';
import { api, isApiError } from '@/lib/api-client';
import { teamPath, useTeamWrite } from './use-team-write';

/** Sets one class's factor for a season; `factor: null` removes it. */
export function setFactor(teamId: string, input: SetFactorInput): Promise<unknown> {
  return api.put(`${teamPath(teamId)}/factors`, input);
}

/** Saving one class's factor failed: which class, and the request's own error as the cause. */
export class FactorSaveError extends Error {
  readonly classCode: string;

  constructor(classCode: string, cause: unknown) {
    super(cause instanceof Error ? cause.message : 'The factor was not saved', { cause });
    this.name = 'FactorSaveError';
    this.classCode = classCode;
  }
}

/** Captains only: saves the changed rows of the factors table, one request per class, in order. */
export function useSetFactors(teamId: string) {
  return useTeamWrite(
    teamId,
    async (rows: SetFactorInput[]) => {
      for (const row of rows) {
        try {
          await setFactor(teamId, row);
        } catch (error) {
          // An ended session stays an ApiError, so the app sends the user to sign in as for any other request.
          if (isApiError(error) && error.status === 401) throw error;
          throw new FactorSaveError(row.classCode, error);
        }
      }
    },
    { refreshOnError: true },
  );
}

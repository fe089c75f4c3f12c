import type { TeamSharing } from '@shared/collab/team.schema';

/** What a member lets the team see of an entered car. */
export const SHARING_LABELS: Record<TeamSharing, string> = {
  results: 'Results only',
  results_and_setup: 'Results and setup',
};

export const SHARING_OPTIONS = [
  { value: 'results', label: SHARING_LABELS.results },
  { value: 'results_and_setup', label: SHARING_LABELS.results_and_setup },
] as const satisfies readonly { value: TeamSharing; label: string }[];

/** The one sentence beside every sharing choice. */
export const SETUP_SHARING_NOTE =
  'Sharing the setup shows the team this car’s camber, springs, clicks and pressures; results only shows its times.';

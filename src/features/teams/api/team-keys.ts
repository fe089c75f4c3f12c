/** Every team query key; each holds every variable its request uses, and a team's keys share one prefix. */
export const teamKeys = {
  all: ['teams'] as const,
  mine: () => [...teamKeys.all, 'mine'] as const,
  /** Everything about one team: invalidate this after any write to it. */
  ofTeam: (teamId: string) => [...teamKeys.all, 'team', teamId] as const,
  detail: (teamId: string) => [...teamKeys.ofTeam(teamId), 'detail'] as const,
  factors: (teamId: string, season: number) => [...teamKeys.ofTeam(teamId), 'factors', season] as const,
  /** `season` null: the server's default season. */
  board: (teamId: string, season: number | null) => [...teamKeys.ofTeam(teamId), 'board', season] as const,
};

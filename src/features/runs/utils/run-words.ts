import type { RunStatus } from '@shared/season/run.schema';
import { formatRunTime } from '@shared/season/run-time';

export const STATUS_WORDS: Record<RunStatus, string> = { finished: 'Finished', dnf: 'DNF', off_course: 'Off course' };

/** "Run 3 · 45.678", "Run 4 · DNF": one line for the outbox and the sync list. */
export function runLabel(run: { runNumber: number; rawTimeSec: number | null; status: RunStatus; cones: number }): string {
  const time = run.status === 'finished' && run.rawTimeSec !== null ? formatRunTime(run.rawTimeSec) : STATUS_WORDS[run.status];
  return `Run ${run.runNumber} · ${time}${run.cones ? ` +${run.cones}` : ''}`;
}

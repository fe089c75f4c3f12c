import type { RunStatus } from '@shared/season/run.schema';
import { formatRunTime } from '@shared/season/run-time';

export const STATUS_WORDS: Record<RunStatus, string> = { finished: 'Finished', dnf: 'DNF', off_course: 'Off course' };

export const coneWords = (n: number) => `${n} ${n === 1 ? 'cone' : 'cones'}`;

/** "45.678", "46.120 +1 cone", "DNF": a run's result in one short phrase. */
export function runResult(run: { rawTimeSec: number | null; status: RunStatus; cones: number }): string {
  const time = run.status === 'finished' && run.rawTimeSec !== null ? formatRunTime(run.rawTimeSec) : STATUS_WORDS[run.status];
  return `${time}${run.cones ? ` +${coneWords(run.cones)}` : ''}`;
}

/** "Run 3 · 45.678", "Run 5 · 46.120 +1 cone", "Run 4 · DNF": one line for the outbox and the sync list. */
export function runLabel(run: { runNumber: number; rawTimeSec: number | null; status: RunStatus; cones: number }): string {
  return `Run ${run.runNumber} · ${runResult(run)}`;
}

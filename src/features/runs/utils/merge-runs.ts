import { adjustedTimeSec, pctOffBest, scoreRuns } from '@shared/calc/scoring.calc';
import type { Person } from '@shared/season/car.schema';
import type { PerCorner } from '@shared/season/corners';
import type { Run, RunStatus, UpdateRunInput } from '@shared/season/run.schema';
import type { OutboxEntry, OutboxError } from '@/lib/outbox';
import type { CreateRunBody } from '../api/create-run';

export interface PendingState {
  state: 'waiting' | 'failed';
  entryKey: string;
  action: 'create' | 'update' | 'delete';
  error?: OutboxError;
}

/** A run as the event-day screen shows it: saved, or waiting in the outbox, scored either way. */
export interface RunRow {
  id: string;
  carId: string;
  eventId: string;
  driver: Person;
  runNumber: number;
  rawTimeSec: number | null;
  cones: number;
  status: RunStatus;
  recordedAt: string;
  notes: string | null;
  hotPressuresKpa: PerCorner<number> | null;
  /** The server's tie to a setup; runs not uploaded yet are tied on the device. */
  setupId: string | null;
  /** The version on the server; null while the run exists only on this phone. */
  version: number | null;
  pending: PendingState | null;
  adjustedTimeSec: number | null;
  pctOffBest: number | null;
  isBest: boolean;
}

type Unscored = Omit<RunRow, 'adjustedTimeSec' | 'pctOffBest' | 'isBest'>;

function fromSaved(run: Run): Unscored {
  return {
    id: run.id,
    carId: run.carId,
    eventId: run.eventId,
    driver: run.driver,
    runNumber: run.runNumber,
    rawTimeSec: run.rawTimeSec,
    cones: run.cones,
    status: run.status,
    recordedAt: run.recordedAt,
    notes: run.notes,
    hotPressuresKpa: run.hotPressuresKpa,
    setupId: run.setupId,
    version: run.version,
    pending: null,
  };
}

function pendingOf(entry: OutboxEntry, action: PendingState['action']): PendingState {
  return {
    state: entry.state === 'failed' ? 'failed' : 'waiting',
    entryKey: entry.key,
    action,
    ...(entry.error ? { error: entry.error } : {}),
  };
}

/** A refusal stays in view over anything merely waiting. */
function worse(a: PendingState | null, b: PendingState): PendingState {
  if (a && a.state === 'failed' && b.state !== 'failed') return a;
  return b;
}

interface MergeInput {
  saved: readonly Run[];
  /** Entries the server already confirmed but `saved` does not show yet: laid over it as saved. */
  delivered?: readonly OutboxEntry[];
  /** Outbox entries of this car at this event, in the outbox's order. */
  entries: readonly OutboxEntry[];
  /** The car's drivers, to name the driver of a run not uploaded yet. */
  people: readonly Person[];
  conePenaltySec: number;
}

/**
 * Saved runs with the outbox laid over them — new runs added, edits applied, deletions taken
 * out (a refused deletion stays, with its error) — then scored per driver with the one scoring
 * function, so adjusted times, % off and the best are right before anything is uploaded.
 * Newest first.
 */
export function mergeRuns({ saved, delivered = [], entries, people, conePenaltySec }: MergeInput): RunRow[] {
  const personOf = (id: string): Person => people.find((p) => p.id === id) ?? { id, displayName: 'Unknown driver' };
  let rows: Unscored[] = saved.map(fromSaved);

  for (const entry of [...delivered.map((e) => ({ ...e, delivered: true })), ...entries.map((e) => ({ ...e, delivered: false }))]) {
    if (entry.kind === 'run.create') {
      const body = entry.body as CreateRunBody;
      const existing = rows.find((r) => r.id === body.id);
      const row: Unscored = {
        id: body.id,
        carId: body.carId,
        eventId: body.eventId,
        driver: personOf(body.driverId),
        runNumber: body.runNumber,
        rawTimeSec: body.rawTimeSec ?? null,
        cones: body.cones ?? 0,
        status: body.status ?? 'finished',
        recordedAt: body.recordedAt,
        notes: body.notes ?? null,
        hotPressuresKpa: body.hotPressuresKpa ?? null,
        setupId: existing?.setupId ?? null,
        version: existing?.version ?? (entry.delivered ? 1 : null),
        pending: entry.delivered ? (existing?.pending ?? null) : worse(existing?.pending ?? null, pendingOf(entry, 'create')),
      };
      rows = existing ? rows.map((r) => (r.id === body.id ? row : r)) : [...rows, row];
    } else if (entry.kind === 'run.update') {
      const body = entry.body as UpdateRunInput;
      rows = rows.map((r) => {
        if (r.id !== entry.recordId) return r;
        const { version: _version, driverId, ...changes } = body;
        return {
          ...r,
          ...Object.fromEntries(Object.entries(changes).filter(([, v]) => v !== undefined)),
          ...(driverId ? { driver: personOf(driverId) } : {}),
          // The server counts one more version for each edit it took.
          ...(entry.delivered && r.version !== null ? { version: r.version + 1 } : {}),
          pending: entry.delivered ? r.pending : worse(r.pending, pendingOf(entry, 'update')),
        } as Unscored;
      });
    } else if (entry.kind === 'run.delete') {
      rows =
        entry.state === 'failed' && !entry.delivered
          ? rows.map((r) => (r.id === entry.recordId ? { ...r, pending: pendingOf(entry, 'delete') } : r))
          : rows.filter((r) => r.id !== entry.recordId);
    }
  }

  // A run the server refused to create does not count towards the best until it is fixed.
  const counts = (r: Unscored) => !(r.pending?.state === 'failed' && r.pending.action === 'create' && r.version === null);
  const scored = new Map<string, { adjustedTimeSec: number | null; pctOffBest: number | null; isBest: boolean }>();
  const drivers = new Set(rows.map((r) => r.driver.id));
  for (const driverId of drivers) {
    const own = rows.filter((r) => r.driver.id === driverId);
    const counted = own.filter(counts).sort((a, b) => a.runNumber - b.runNumber);
    const results = scoreRuns(counted, conePenaltySec);
    const best = results.find((s) => s.isBest)?.adjustedTimeSec ?? null;
    for (const s of results) scored.set(s.run.id, { adjustedTimeSec: s.adjustedTimeSec, pctOffBest: s.pctOffBest, isBest: s.isBest });
    for (const r of own.filter((x) => !counts(x))) {
      const t = adjustedTimeSec(r, conePenaltySec);
      // No best, or one of 0 s (see scoreRuns): no % off.
      scored.set(r.id, { adjustedTimeSec: t, pctOffBest: t !== null && best ? pctOffBest(t, best) : null, isBest: false });
    }
  }

  return rows
    .map((r) => ({ ...r, ...scored.get(r.id)! }))
    .sort((a, b) => new Date(b.recordedAt).getTime() - new Date(a.recordedAt).getTime() || b.runNumber - a.runNumber);
}

/** The next run number for a driver at this event: one more than the highest, saved or waiting. */
export function nextRunNumber(rows: readonly Pick<RunRow, 'driver' | 'runNumber'>[], driverId: string): number {
  return rows.filter((r) => r.driver.id === driverId).reduce((max, r) => Math.max(max, r.runNumber), 0) + 1;
}

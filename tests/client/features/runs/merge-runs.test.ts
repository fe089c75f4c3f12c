import { describe, expect, it } from 'vitest';
import { mergeRuns, nextRunNumber } from '@/features/runs/utils/merge-runs';
import type { OutboxEntry } from '@/lib/outbox';
import { IDS, savedRun } from '../../fixtures/season';

const people = [
  { id: IDS.maren, displayName: 'Maren Holt' },
  { id: IDS.tomas, displayName: 'Tomas Reyes' },
];

function entry(kind: string, recordId: string, body: unknown, extra: Partial<OutboxEntry> = {}): OutboxEntry {
  return {
    key: `${kind}-${recordId}`,
    recordId,
    kind,
    method: kind.endsWith('create') ? 'POST' : kind.endsWith('update') ? 'PATCH' : 'DELETE',
    path: '/api/runs',
    body,
    label: kind,
    scope: { carId: IDS.car, eventId: IDS.event },
    createdAt: 0,
    attempts: 0,
    nextAttemptAt: 0,
    state: 'waiting',
    ...extra,
  };
}

const create = (id: string, runNumber: number, rawTimeSec: number | null, more: Record<string, unknown> = {}) =>
  entry('run.create', id, {
    id, carId: IDS.car, eventId: IDS.event, driverId: IDS.maren, runNumber, rawTimeSec, cones: 0, status: 'finished',
    recordedAt: `2026-06-07T10:0${runNumber}:00.000Z`, ...more,
  });

const R3 = 'b3333333-3333-4333-8333-333333333333';

describe('mergeRuns', () => {
  it('when an edit waits in the outbox, then the saved run shows the edited values and is scored again', () => {
    // Run 1 46.000 clean was best; the edit adds 2 cones (50.000), so run 2 (47.000) becomes best.
    const rows = mergeRuns({
      saved: [savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 46 }), savedRun({ id: IDS.run2, runNumber: 2, rawTimeSec: 47, isBest: false })],
      entries: [entry('run.update', IDS.run1, { cones: 2, version: 1 })],
      people,
      conePenaltySec: 2,
    });
    const one = rows.find((r) => r.runNumber === 1)!;
    const two = rows.find((r) => r.runNumber === 2)!;
    expect(one).toMatchObject({ cones: 2, adjustedTimeSec: 50, isBest: false, pending: { state: 'waiting', action: 'update' } });
    expect(two).toMatchObject({ adjustedTimeSec: 47, isBest: true, pctOffBest: 0 });
    expect(one.pctOffBest).toBeCloseTo((3 / 47) * 100, 10);
  });

  it('when a deletion waits, then the run is gone from the list and no longer counts; a refused deletion stays with its error', () => {
    const saved = [savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 45 }), savedRun({ id: IDS.run2, runNumber: 2, rawTimeSec: 47 })];
    const waiting = mergeRuns({ saved, entries: [entry('run.delete', IDS.run1, undefined)], people, conePenaltySec: 2 });
    expect(waiting.map((r) => r.runNumber)).toEqual([2]);
    expect(waiting[0]!.isBest).toBe(true);

    const error = { status: 403, code: 'forbidden', message: 'Only the owner may delete this run.' };
    const refused = mergeRuns({ saved, entries: [entry('run.delete', IDS.run1, undefined, { state: 'failed', error })], people, conePenaltySec: 2 });
    expect(refused.find((r) => r.runNumber === 1)).toMatchObject({ isBest: true, pending: { state: 'failed', action: 'delete', error } });
  });

  it('when a run was refused on upload, then it is shown with its adjusted time but is never the best', () => {
    const rows = mergeRuns({
      saved: [savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 46 })],
      entries: [{ ...create(R3, 2, 40), state: 'failed', error: { status: 409, code: 'conflict', message: 'taken' } }],
      people,
      conePenaltySec: 2,
    });
    const refused = rows.find((r) => r.id === R3)!;
    expect(refused).toMatchObject({ adjustedTimeSec: 40, isBest: false, pending: { state: 'failed', action: 'create' } });
    expect(refused.pctOffBest).toBeCloseTo((-6 / 46) * 100, 10);
    expect(rows.find((r) => r.id === IDS.run1)!.isBest).toBe(true);
  });

  it('when two drivers share the car, then each is scored against their own best and numbered on their own', () => {
    const rows = mergeRuns({
      saved: [savedRun({ id: IDS.run1, runNumber: 1, rawTimeSec: 46 })],
      entries: [create(R3, 1, 48, { driverId: IDS.tomas })],
      people,
      conePenaltySec: 2,
    });
    expect(rows.filter((r) => r.isBest).map((r) => r.driver.displayName).sort()).toEqual(['Maren Holt', 'Tomas Reyes']);
    expect(nextRunNumber(rows, IDS.maren)).toBe(2);
    expect(nextRunNumber(rows, IDS.tomas)).toBe(2);
    expect(rows[0]!.driver.displayName).toBe('Tomas Reyes'); // newest first
  });

  it('when DNF and off-course runs are merged, then they have no adjusted time and are never best', () => {
    const rows = mergeRuns({
      saved: [],
      entries: [create(R3, 1, null, { status: 'dnf' }), create(IDS.run2, 2, 49.5, { cones: 1 })],
      people,
      conePenaltySec: 2,
    });
    expect(rows.find((r) => r.runNumber === 1)).toMatchObject({ adjustedTimeSec: null, pctOffBest: null, isBest: false });
    expect(rows.find((r) => r.runNumber === 2)).toMatchObject({ adjustedTimeSec: 51.5, isBest: true });
  });
});

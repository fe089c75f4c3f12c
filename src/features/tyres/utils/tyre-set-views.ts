import { CORNERS, type Corner } from '@shared/season/corners';
import type { CreateMountingInput, TyreSet } from '@shared/season/tyre.schema';
import type { OutboxEntry, OutboxError } from '@/lib/outbox';
import type { CreateTyreSetBody } from '../api/create-tyre-set';

type PendingState = { state: 'waiting' | 'failed'; entryKey: string; error?: OutboxError };

/** A rotation on this phone: not uploaded yet (state set), or uploaded and not in the data yet (null). */
export interface PendingMounting {
  mountedAt: string;
  positions: Record<Corner, number>;
  pending: PendingState | null;
}

/** A tyre set as screens show it: saved, or made on this phone and not uploaded yet; with rotations still on the phone. */
export interface TyreSetView extends TyreSet {
  pending: PendingState | null;
  localMountings: PendingMounting[];
}

const pendingOf = (entry: OutboxEntry): PendingState => ({
  state: entry.state === 'failed' ? 'failed' : 'waiting',
  entryKey: entry.key,
  ...(entry.error ? { error: entry.error } : {}),
});

function setFromEntry(entry: OutboxEntry, pending: boolean): TyreSetView {
  const body = entry.body as CreateTyreSetBody;
  return {
    id: body.id,
    carId: entry.scope.carId ?? '',
    label: body.label,
    size: body.size ?? null,
    boughtOn: body.boughtOn ?? null,
    startTreadMm: body.startTreadMm ?? null,
    notes: body.notes ?? null,
    mountings: [],
    latestReading: null,
    createdAt: new Date(entry.createdAt).toISOString(),
    pending: pending ? pendingOf(entry) : null,
    localMountings: [],
  };
}

/**
 * A car's saved tyre sets, then the sets made on this phone (waiting, refused, or just uploaded and
 * not in the list yet), each with its rotations still on the phone.
 */
export function mergeTyreSets(
  saved: readonly TyreSet[],
  entries: readonly OutboxEntry[],
  justDelivered: readonly OutboxEntry[] = [],
): TyreSetView[] {
  const sets: TyreSetView[] = saved.map((s) => ({ ...s, pending: null, localMountings: [] }));
  for (const [list, pending] of [
    [justDelivered, false],
    [entries, true],
  ] as const) {
    for (const entry of list) {
      if (entry.kind === 'tyreSet.create' && !sets.some((s) => s.id === entry.recordId)) sets.push(setFromEntry(entry, pending));
    }
  }
  for (const [list, pending] of [
    [justDelivered, false],
    [entries, true],
  ] as const) {
    for (const entry of list) {
      if (entry.kind !== 'tyreSet.rotate') continue;
      const set = sets.find((s) => s.id === entry.scope.tyreSetId);
      const body = entry.body as CreateMountingInput;
      set?.localMountings.push({ mountedAt: body.mountedAt, positions: body.positions, pending: pending ? pendingOf(entry) : null });
    }
  }
  return sets;
}

/** Tyres 1–4 on LF, RF, LR, RR: how every set starts. */
export const FIRST_POSITIONS: Readonly<Record<Corner, number>> = { lf: 1, rf: 2, lr: 3, rr: 4 };

export interface CurrentPositions {
  positions: Record<Corner, number>;
  /** Since when; null when the set is as first fitted and the server has not said when. */
  mountedAt: string | null;
  pending: PendingState | null;
}

/** Which tyre is on which corner now: the latest rotation, counting those still on the phone. */
export function currentPositions(set: TyreSetView): CurrentPositions {
  const all: CurrentPositions[] = [
    ...set.mountings.map((m) => ({ positions: m.positions, mountedAt: m.mountedAt, pending: null })),
    ...set.localMountings.map((m) => ({ positions: m.positions, mountedAt: m.mountedAt, pending: m.pending })),
  ];
  let latest: CurrentPositions | null = null;
  for (const m of all) if (!latest || new Date(m.mountedAt!).getTime() >= new Date(latest.mountedAt!).getTime()) latest = m;
  return latest ?? { positions: { ...FIRST_POSITIONS }, mountedAt: null, pending: null };
}

/** "LF 1 · RF 2 · LR 3 · RR 4" */
export function positionsText(positions: Record<Corner, number>): string {
  return CORNERS.map((c) => `${c.toUpperCase()} ${positions[c]}`).join(' · ');
}

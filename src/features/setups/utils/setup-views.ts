import type { Person } from '@shared/season/car.schema';
import { CORNERS, type Corner } from '@shared/season/corners';
import { SETUP_CORNER_FIELDS, type QuickChangeInput, type Setup, type SetupCorner } from '@shared/season/setup.schema';
import { CORNER_NAMES } from '@/components/corner-grid/corner-grid';
import type { OutboxEntry, OutboxError } from '@/lib/outbox';
import type { CreateSetupBody } from '../api/create-setup';
import type { QuickChangeBody } from '../api/quick-change';

/** A snapshot as screens show it: saved on the server, or still in the outbox (waiting or refused). */
export interface SetupView extends Setup {
  pending: null | { state: 'waiting' | 'failed'; entryKey: string; kind: string; error?: OutboxError };
}

/** What a snapshot made by a quick change between runs is named by: the words of the change follow it. */
export const QUICK_CHANGE_PREFIX = 'Quick change: ';

const emptyCorner = (): SetupCorner => Object.fromEntries(SETUP_CORNER_FIELDS.map((f) => [f, null])) as SetupCorner;

const time = (iso: string) => new Date(iso).getTime();

/** Newest effectiveFrom first; for equal times the later-made snapshot first (as the server orders them). */
export function sortSetups<T extends Pick<Setup, 'effectiveFrom' | 'createdAt'>>(setups: readonly T[]): T[] {
  return [...setups].sort((a, b) => time(b.effectiveFrom) - time(a.effectiveFrom) || time(b.createdAt) - time(a.createdAt));
}

/**
 * The snapshot in force at a moment: the one with the latest effectiveFrom not after it — the
 * server's rule for tying a run to a setup, applied on the device for what is not uploaded yet.
 */
export function setupInForce<T extends Pick<Setup, 'effectiveFrom' | 'createdAt'>>(setups: readonly T[], at: string): T | null {
  const t = time(at);
  return sortSetups(setups).find((s) => time(s.effectiveFrom) <= t) ?? null;
}

export interface AppliedQuickChange {
  corners: Record<Corner, SetupCorner>;
  /** Problems the server would refuse the change for, in words. */
  problems: string[];
}

const FIELD_WORDS: Record<QuickChangeInput['changes'][number]['field'], string> = {
  damperClicks: 'clicks',
  damperReboundClicks: 'rebound clicks',
  coldPressureKpa: 'cold pressure',
  camberDeg: 'camber',
  toeMm: 'toe',
  rideHeightMm: 'ride height',
};

/**
 * A quick change applied to the snapshot in force, as the server will apply it. `problems` here are only the values
 * a change by an amount has nothing to start from; whether the results are in range is `checkedQuickChange`'s
 * question, asked where a quick change is made, so the range rules stay out of the trackside page's first download.
 */
export function applyQuickChange(base: Pick<Setup, 'corners'> | null, changes: QuickChangeInput['changes']): AppliedQuickChange {
  const corners = Object.fromEntries(CORNERS.map((c) => [c, { ...emptyCorner(), ...(base?.corners[c] ?? {}) }])) as Record<
    Corner,
    SetupCorner
  >;
  const problems: string[] = [];
  for (const change of changes) {
    const missing: string[] = [];
    for (const corner of change.corners) {
      const current = corners[corner][change.field];
      if (change.value !== undefined) corners[corner][change.field] = change.value;
      else if (current === null || current === undefined) missing.push(CORNER_NAMES[corner].toLowerCase());
      else corners[corner][change.field] = Math.round((current + (change.delta ?? 0)) * 1e6) / 1e6;
    }
    // One sentence for the change, naming every corner with nothing to change from.
    if (missing.length) {
      problems.push(`No ${FIELD_WORDS[change.field]} recorded at the ${new Intl.ListFormat('en').format(missing)} to change by; use “Set to”`);
    }
  }
  return { corners, problems };
}

function pendingOf(entry: OutboxEntry): SetupView['pending'] {
  return {
    state: entry.state === 'failed' ? 'failed' : 'waiting',
    entryKey: entry.key,
    kind: entry.kind,
    ...(entry.error ? { error: entry.error } : {}),
  };
}

/**
 * Saved snapshots plus those still in the outbox (new setups and quick changes), newest first.
 * A quick change made offline is worked out on the device from the snapshot in force at its
 * time, so the next runs can show it before it is uploaded.
 */
export function mergePendingSetups(
  saved: readonly Setup[],
  entries: readonly OutboxEntry[],
  me: Person,
  /** Confirmed by the server but not in `saved` yet: shown as saved. */
  delivered: readonly OutboxEntry[] = [],
): SetupView[] {
  let views: SetupView[] = saved.map((s) => ({ ...s, pending: null }));
  const confirmed = new Set(delivered.map((e) => e.key));
  for (const entry of [...delivered, ...entries]) {
    if (entry.kind !== 'setup.create' && entry.kind !== 'setup.quickChange') continue;
    if (views.some((v) => v.id === entry.recordId)) continue;
    const createdAt = new Date(entry.createdAt).toISOString();
    if (entry.kind === 'setup.create') {
      const body = entry.body as CreateSetupBody;
      views.push({
        id: body.id,
        carId: entry.scope.carId ?? '',
        label: body.label,
        effectiveFrom: body.effectiveFrom,
        createdBy: me,
        derivedFromId: body.derivedFromId ?? null,
        suggestion: null,
        workOrder: null,
        notes: body.notes ?? null,
        corners: Object.fromEntries(CORNERS.map((c) => [c, { ...emptyCorner(), ...(body.corners?.[c] ?? {}) }])) as Record<Corner, SetupCorner>,
        axles: {
          front: { antiRollBar: body.axles?.front?.antiRollBar ?? null },
          rear: { antiRollBar: body.axles?.rear?.antiRollBar ?? null },
        },
        version: 0,
        createdAt,
        updatedAt: createdAt,
        pending: confirmed.has(entry.key) ? null : pendingOf(entry),
      });
    } else {
      const body = entry.body as QuickChangeBody;
      const effectiveFrom = body.effectiveFrom ?? createdAt;
      const base = setupInForce(views, effectiveFrom);
      const { corners } = applyQuickChange(base, body.changes);
      views.push({
        id: body.id,
        carId: entry.scope.carId ?? '',
        label: body.label,
        effectiveFrom,
        createdBy: me,
        derivedFromId: base?.id ?? null,
        suggestion: null,
        workOrder: null,
        notes: body.notes ?? null,
        corners,
        axles: base?.axles ?? { front: { antiRollBar: null }, rear: { antiRollBar: null } },
        version: 0,
        createdAt,
        updatedAt: createdAt,
        pending: confirmed.has(entry.key) ? null : pendingOf(entry),
      });
    }
    views = sortSetups(views);
  }
  return sortSetups(views);
}

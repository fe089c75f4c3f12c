import type { Car, DamperAdjuster, DamperAdjusterInput, Person } from '@shared/season/car.schema';
import type { OutboxEntry, OutboxError } from '@/lib/outbox';
import type { CreateCarBody } from '../api/create-car';

/** A car as screens show it: saved on the server, or made on this phone and not uploaded yet. */
export interface CarView extends Car {
  pending: null | { state: 'waiting' | 'failed'; entryKey: string; error?: OutboxError };
}

/** An axle's adjuster as sent, as the car will hold it: no rebound adjuster unless one was given. */
const adjuster = (a: DamperAdjusterInput | null | undefined): DamperAdjuster | null => (a ? { ...a, rebound: a.rebound ?? null } : null);

export const isCarCreate = (entry: OutboxEntry) => entry.kind === 'car.create';

/** The car an outbox entry will create; whoever made it on this phone owns it. */
export function carFromEntry(entry: OutboxEntry, owner: Person, pending: boolean): CarView {
  const body = entry.body as CreateCarBody;
  const made = new Date(entry.createdAt).toISOString();
  return {
    id: body.id,
    owner,
    coDrivers: [],
    name: body.name,
    classCode: body.classCode,
    carNumber: body.carNumber ?? null,
    tyreSize: body.tyreSize ?? null,
    damperAdjusters: { front: adjuster(body.damperAdjusters?.front), rear: adjuster(body.damperAdjusters?.rear) },
    motionRatios: { front: body.motionRatios?.front ?? null, rear: body.motionRatios?.rear ?? null },
    notes: body.notes ?? null,
    version: 0,
    createdAt: made,
    updatedAt: made,
    pending: pending
      ? { state: entry.state === 'failed' ? 'failed' : 'waiting', entryKey: entry.key, ...(entry.error ? { error: entry.error } : {}) }
      : null,
  };
}

/** Saved cars, then cars made on this phone (waiting, refused, or just uploaded and not in the list yet), oldest first. */
export function mergeCars(
  saved: readonly Car[],
  entries: readonly OutboxEntry[],
  owner: Person,
  justDelivered: readonly OutboxEntry[] = [],
): CarView[] {
  const known = new Set(saved.map((c) => c.id));
  const out: CarView[] = saved.map((c) => ({ ...c, pending: null }));
  for (const [list, pending] of [
    [justDelivered, false],
    [entries, true],
  ] as const) {
    for (const entry of list) {
      if (!isCarCreate(entry) || known.has(entry.recordId)) continue;
      known.add(entry.recordId);
      out.push(carFromEntry(entry, owner, pending));
    }
  }
  return out;
}

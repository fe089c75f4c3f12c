import { useSyncExternalStore } from 'react';
import type { Outbox, OutboxEntry } from './outbox';
import { useOutbox } from './outbox-context';

/*
 * Entries the server has just confirmed. An entry leaves the outbox the moment it is delivered,
 * but the screen's data refreshes a little later (a weak signal can make that seconds): without
 * this, a run just uploaded would vanish from the list until the refresh arrives. Screens lay
 * these over their data until a fetch newer than the delivery has landed.
 */

export interface DeliveredEntry {
  entry: OutboxEntry;
  /** When it left the outbox (ms since the epoch). */
  at: number;
}

const KEEP_MS = 10 * 60_000;

class DeliveredTracker {
  private previous: readonly OutboxEntry[];
  private delivered: readonly DeliveredEntry[] = [];
  private listeners = new Set<() => void>();

  constructor(private readonly outbox: Outbox) {
    this.previous = outbox.getSnapshot();
    outbox.subscribe(this.onChange);
  }

  private onChange = () => {
    const current = this.outbox.getSnapshot();
    // Only an entry that was being sent leaves because the server took it; a waiting or refused
    // entry that disappears was cancelled or discarded.
    const gone = this.previous.filter((e) => e.state === 'sending' && !current.some((c) => c.key === e.key));
    this.previous = current;
    if (gone.length === 0) return;
    const now = Date.now();
    this.delivered = [...this.delivered.filter((d) => now - d.at < KEEP_MS), ...gone.map((entry) => ({ entry, at: now }))];
    for (const listener of this.listeners) listener();
  };

  getSnapshot = (): readonly DeliveredEntry[] => this.delivered;

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };
}

const trackers = new WeakMap<Outbox, DeliveredTracker>();

function trackerFor(outbox: Outbox): DeliveredTracker {
  let tracker = trackers.get(outbox);
  if (!tracker) {
    tracker = new DeliveredTracker(outbox);
    trackers.set(outbox, tracker);
  }
  return tracker;
}

/** Entries delivered recently, oldest first. */
export function useDeliveredEntries(): readonly DeliveredEntry[] {
  const tracker = trackerFor(useOutbox());
  return useSyncExternalStore(tracker.subscribe, tracker.getSnapshot, tracker.getSnapshot);
}

/** The delivered entries a screen's data does not show yet: delivered after its last successful fetch. */
export function notYetFetched(delivered: readonly DeliveredEntry[], dataUpdatedAt: number): OutboxEntry[] {
  return delivered.filter((d) => d.at >= dataUpdatedAt).map((d) => d.entry);
}

import type { OutboxEntry } from './outbox';

/** What an entry's kind is about, in words: one and many. */
const NOUNS: Record<string, [string, string]> = {
  run: ['run', 'runs'],
  setup: ['setup', 'setups'],
  tyreSet: ['tyre set', 'tyre sets'],
  tread: ['tread reading', 'tread readings'],
  pressure: ['pressure reading', 'pressure readings'],
  change: ['change-log entry', 'change-log entries'],
  event: ['event', 'events'],
  car: ['car', 'cars'],
};

function nounOf(kind: string): string {
  return kind.split('.')[0] ?? kind;
}

/**
 * "3 runs", "1 setup", "2 runs and 1 change", "4 changes": new records of one kind by that kind (a quick change
 * makes a setup), and edits, deletions and rotations as changes, so an edit of a run is not another run.
 */
export function countWords(entries: readonly OutboxEntry[]): string {
  const made = entries.filter((e) => /\.(create|quickChange)$/.test(e.kind));
  const kinds = new Set(made.map((e) => nounOf(e.kind)));
  const nouns = kinds.size === 1 ? NOUNS[[...kinds][0]!] : undefined;
  const count = (n: number, [one, many]: [string, string]) => `${n} ${n === 1 ? one : many}`;
  const changes: [string, string] = ['change', 'changes'];
  if (!nouns) return count(entries.length, changes);
  const changed = entries.length - made.length;
  return changed ? `${count(made.length, nouns)} and ${count(changed, changes)}` : count(made.length, nouns);
}

export interface OutboxSummary {
  waiting: OutboxEntry[];
  failed: OutboxEntry[];
  /** "All saved", "2 runs waiting to upload", "1 needs attention", "1 needs attention · 2 runs waiting to upload". */
  text: string;
  /** The same, short enough for a phone's top bar: "All saved", "2 waiting", "1 needs attention". */
  short: string;
  tone: 'saved' | 'waiting' | 'attention';
}

/** The save state in words, from the outbox's entries. */
export function summariseOutbox(entries: readonly OutboxEntry[]): OutboxSummary {
  const failed = entries.filter((e) => e.state === 'failed');
  const waiting = entries.filter((e) => e.state !== 'failed');
  const parts: string[] = [];
  if (failed.length) parts.push(`${failed.length} ${failed.length === 1 ? 'needs' : 'need'} attention`);
  if (waiting.length) parts.push(`${countWords(waiting)} waiting to upload`);
  const text = parts.length ? parts.join(' · ') : 'All saved';
  const short = failed.length
    ? `${failed.length} ${failed.length === 1 ? 'needs' : 'need'} attention`
    : waiting.length
      ? `${waiting.length} waiting`
      : 'All saved';
  return { waiting, failed, text, short, tone: failed.length ? 'attention' : waiting.length ? 'waiting' : 'saved' };
}

/** "3 runs are still on this phone only" — for the sign-out warning. */
export function onDeviceOnlyText(entries: readonly OutboxEntry[]): string {
  const n = entries.length;
  return `${countWords(entries)} ${n === 1 ? 'is' : 'are'} still on this phone only`;
}

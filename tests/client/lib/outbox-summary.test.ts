import { describe, expect, it } from 'vitest';
import { countWords, summariseOutbox } from '@/lib/outbox-summary';
import type { OutboxEntry } from '@/lib/outbox';

const entry = (kind: string, n: number): OutboxEntry => ({
  key: `${kind}-${n}`,
  recordId: `r-${n}`,
  kind,
  method: kind.endsWith('.delete') ? 'DELETE' : kind.endsWith('.update') ? 'PATCH' : 'POST',
  path: '/api/x',
  label: `${kind} ${n}`,
  scope: {},
  createdAt: n,
  attempts: 0,
  nextAttemptAt: 0,
  state: 'waiting',
});

describe('what the waiting changes are called', () => {
  it('when two new runs wait with an edit of each of two runs, then it says 2 runs and 2 changes, not 4 runs', () => {
    const entries = [entry('run.create', 1), entry('run.create', 2), entry('run.update', 3), entry('run.update', 4)];
    expect(countWords(entries)).toBe('2 runs and 2 changes');
    expect(summariseOutbox(entries).text).toBe('2 runs and 2 changes waiting to upload');
  });

  it('when only new records of one kind wait, then they are named by it; a quick change is a setup', () => {
    expect(countWords([entry('run.create', 1)])).toBe('1 run');
    expect(countWords([entry('setup.quickChange', 1), entry('setup.create', 2)])).toBe('2 setups');
  });

  it('when only edits, deletions or rotations wait, or new records of several kinds, then they are changes', () => {
    expect(countWords([entry('run.delete', 1)])).toBe('1 change');
    expect(countWords([entry('run.update', 1), entry('tyreSet.rotate', 2)])).toBe('2 changes');
    expect(countWords([entry('run.create', 1), entry('setup.create', 2), entry('run.update', 3)])).toBe('3 changes');
  });
});

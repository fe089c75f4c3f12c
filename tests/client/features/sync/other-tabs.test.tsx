// @vitest-environment jsdom
import { cleanup, renderHook, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { memoryStorage, Outbox, type OutboxEntry } from '@/lib/outbox';
import { OutboxProvider } from '@/lib/outbox-context';
import { useOtherTabs } from '@/features/sync/hooks/use-other-tabs';

afterEach(cleanup);

const run = (n: number) => ({
  recordId: `run-${n}`,
  kind: 'run.create',
  method: 'POST' as const,
  path: '/api/runs',
  body: { runNumber: n },
  label: `Run ${n}`,
  scope: { eventId: 'e1' },
});

/** One tab: its own outbox copy and query cache over the one device store; sending fails (no signal) unless told. */
function openTab(
  storage: ReturnType<typeof memoryStorage>,
  send: (e: OutboxEntry) => Promise<unknown> = () => Promise.reject(new Error('offline')),
  lock?: (run: () => Promise<void>) => Promise<void>,
) {
  const outbox = new Outbox({ storage, send, classify: () => ({ kind: 'retry', reason: 'No connection' }), backoffMs: () => 60_000, ...(lock ? { lock } : {}) });
  const queryClient = new QueryClient();
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={queryClient}>
      <OutboxProvider outbox={outbox}>{children}</OutboxProvider>
    </QueryClientProvider>
  );
  renderHook(() => useOtherTabs(), { wrapper });
  return { outbox, queryClient };
}

describe('two tabs of the app on one phone', () => {
  it('when a run is logged in one tab, then the other tab shows it waiting too, without a reload', async () => {
    const storage = memoryStorage();
    const a = openTab(storage);
    const b = openTab(storage);
    await Promise.all([a.outbox.ready(), b.outbox.ready()]);

    await a.outbox.add(run(11));
    await waitFor(() => expect(b.outbox.getSnapshot().map((e) => e.recordId)).toEqual(['run-11']));

    await b.outbox.add(run(12));
    await waitFor(() => expect(a.outbox.getSnapshot().map((e) => e.recordId)).toEqual(['run-11', 'run-12']));
  });

  it('when a run not sent yet is edited in one tab, then the other tab shows the edit (the entry keeps its key)', async () => {
    const storage = memoryStorage();
    // Unsent means not tried yet: here no tab ever gets its turn to send.
    const noTurn = () => new Promise<void>(() => undefined);
    const a = openTab(storage, undefined, noTurn);
    const b = openTab(storage, undefined, noTurn);
    await Promise.all([a.outbox.ready(), b.outbox.ready()]);
    await b.outbox.add(run(5));
    await waitFor(() => expect(a.outbox.getSnapshot()).toHaveLength(1));

    await b.outbox.add({ ...run(5), kind: 'run.update', method: 'PATCH', body: { runNumber: 6, version: 1 }, label: 'Run 6' });
    await waitFor(() => expect((a.outbox.getSnapshot()[0]?.body as { runNumber: number }).runNumber).toBe(6));
  });

  it('when the other tab delivers a run, then it leaves this tab’s list and this tab reads its data again', async () => {
    const storage = memoryStorage();
    const delivered: string[] = [];
    const sender = openTab(storage, async (e) => void delivered.push(e.recordId));
    const other = openTab(storage);
    await Promise.all([sender.outbox.ready(), other.outbox.ready()]);
    // The other tab holds the run too (it was logged there and the sender learned of it).
    await other.outbox.add(run(3));
    await waitFor(() => expect(sender.outbox.getSnapshot()).toHaveLength(1));
    const refresh = vi.spyOn(other.queryClient, 'invalidateQueries');

    await sender.outbox.retryNow();
    expect(delivered).toEqual(['run-3']);
    await waitFor(() => expect(other.outbox.getSnapshot()).toHaveLength(0));
    // What a run changes, read again without cutting off reads on their way; nothing else.
    const asked = refresh.mock.calls.map(([filters, options]) => [filters?.queryKey, options?.cancelRefetch]);
    expect(asked).toEqual(expect.arrayContaining([[['runs'], false], [['events'], false], [['setups'], false]]));
    expect(asked).toHaveLength(3);
  });
});

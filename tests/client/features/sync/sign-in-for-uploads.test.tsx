// @vitest-environment jsdom
import { cleanup, renderHook, waitFor } from '@testing-library/react';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import type { ReactNode } from 'react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { memoryStorage, Outbox } from '@/lib/outbox';
import { OutboxProvider } from '@/lib/outbox-context';
import { SIGNED_OUT_REASON } from '@/app/outbox';
import { authKeys } from '@/features/auth/api/auth-keys';
import { useSignInForUploads } from '@/features/sync/hooks/use-sign-in-for-uploads';

afterEach(cleanup);

const run = { recordId: 'run-1', kind: 'run.create', method: 'POST' as const, path: '/api/runs', body: { runNumber: 1 }, label: 'Run 1', scope: { eventId: 'e1' } };

/** An outbox whose uploads are refused for `reason` (401: the session is over), and a query cache watched for "who am I" again. */
function phone(reason: string) {
  const outbox = new Outbox({
    storage: memoryStorage(),
    send: () => Promise.reject(new Error('refused')),
    classify: () => ({ kind: 'retry', reason }),
    backoffMs: () => 60_000,
  });
  const queryClient = new QueryClient();
  const asked = vi.spyOn(queryClient, 'invalidateQueries');
  const wrapper = ({ children }: { children: ReactNode }) => (
    <QueryClientProvider client={queryClient}>
      <OutboxProvider outbox={outbox}>{children}</OutboxProvider>
    </QueryClientProvider>
  );
  const askedWhoIsSignedIn = () => asked.mock.calls.filter(([filters]) => JSON.stringify(filters?.queryKey) === JSON.stringify(authKeys.me())).length;
  return { outbox, wrapper, askedWhoIsSignedIn };
}

describe('an upload refused because the session is over', () => {
  it('when the refusal came before this part of the shell loaded, then it asks who is signed in as soon as it loads', async () => {
    const p = phone(SIGNED_OUT_REASON);
    await p.outbox.ready();
    await p.outbox.add(run);
    await waitFor(() => expect(p.outbox.retryReason()).toBe(SIGNED_OUT_REASON));

    renderHook(() => useSignInForUploads(), { wrapper: p.wrapper });
    expect(p.askedWhoIsSignedIn()).toBe(1);
  });

  it('when the refusal comes while it is loaded, then it asks once, not again at each refused retry of the same kind', async () => {
    const p = phone(SIGNED_OUT_REASON);
    await p.outbox.ready();
    renderHook(() => useSignInForUploads(), { wrapper: p.wrapper });
    expect(p.askedWhoIsSignedIn()).toBe(0);

    await p.outbox.add(run);
    await waitFor(() => expect(p.askedWhoIsSignedIn()).toBe(1));
    await p.outbox.retryNow();
    // Refused again, for the same reason: still the one question.
    await waitFor(() => expect(p.outbox.getSnapshot()[0]!.attempts).toBeGreaterThanOrEqual(2));
    expect(p.askedWhoIsSignedIn()).toBe(1);
  });

  it('when uploads wait for want of signal, then it does not ask who is signed in', async () => {
    const p = phone('No connection');
    await p.outbox.ready();
    await p.outbox.add(run);
    await waitFor(() => expect(p.outbox.retryReason()).toBe('No connection'));
    renderHook(() => useSignInForUploads(), { wrapper: p.wrapper });
    expect(p.askedWhoIsSignedIn()).toBe(0);
  });
});

// @vitest-environment jsdom
import { act, cleanup, render, screen } from '@testing-library/react';
import { dehydrate, QueryClientProvider, useMutation } from '@tanstack/react-query';
import { afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { ApiError } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { ToastProvider } from '@/components/ui/toaster';
import { createQueryClient, keptOnDevice, lastAnswers } from '@/app/query-client';
import { accountsQueryOptions } from '@/features/admin/api/accounts';

// The toasts' layer is loaded on first use; load it before the clock of the first test starts,
// so a busy machine does not make the first toast miss its wait.
beforeAll(async () => {
  await import('@/components/ui/toast-layer');
}, 30_000);

afterEach(() => {
  cleanup();
  clearToasts();
});

function Failing({ error, inline = false }: { error: ApiError; inline?: boolean }) {
  const mutation = useMutation({
    mutationFn: () => Promise.reject(error),
    meta: { errorsShownInline: inline },
  });
  return (
    <button type="button" onClick={() => mutation.mutate()}>
      Save
    </button>
  );
}

function renderFailing(error: ApiError, options: { inline?: boolean; onUnauthenticated?: () => void } = {}) {
  const queryClient = createQueryClient({ retry: false, onUnauthenticated: options.onUnauthenticated });
  render(
    <QueryClientProvider client={queryClient}>
      <ToastProvider>
        <Failing error={error} inline={options.inline} />
      </ToastProvider>
    </QueryClientProvider>,
  );
  return queryClient;
}

async function clickSave() {
  await act(async () => {
    screen.getByRole('button', { name: 'Save' }).click();
  });
}

describe('query client error handling', () => {
  it('when a mutation fails with a server error, then its message is toasted', async () => {
    renderFailing(new ApiError({ status: 500, code: 'internal', message: 'Something went wrong on our side.' }));

    await clickSave();

    expect(await screen.findByText('Something went wrong on our side.')).toBeTruthy();
  });

  it('when a mutation fails with field errors, then nothing is toasted (the form shows them)', async () => {
    renderFailing(
      new ApiError({ status: 400, code: 'validation_failed', message: 'Check the fields.', fieldErrors: { name: ['Required'] } }),
    );

    await clickSave();

    expect(screen.queryByText('Check the fields.')).toBeNull();
  });

  it('when the screen shows the error itself, then nothing is toasted', async () => {
    renderFailing(new ApiError({ status: 0, code: 'network', message: 'No connection' }), { inline: true });

    await clickSave();

    expect(screen.queryByText('No connection')).toBeNull();
  });

  it('when a read with an answer on screen fails for want of signal, then nothing is toasted; a first read that fails is', async () => {
    const queryClient = createQueryClient({ retry: false });
    render(
      <QueryClientProvider client={queryClient}>
        <ToastProvider>
          <span />
        </ToastProvider>
      </QueryClientProvider>,
    );
    const noSignal = () => Promise.reject(new ApiError({ status: 0, code: 'network', message: 'No connection' }));
    queryClient.setQueryData(['cars'], []);
    await act(() => queryClient.fetchQuery({ queryKey: ['cars'], queryFn: noSignal, staleTime: 0 }).catch(() => undefined));
    await act(() => new Promise((r) => setTimeout(r, 50)));
    expect(screen.queryByText('No connection')).toBeNull();

    await act(() => queryClient.fetchQuery({ queryKey: ['events'], queryFn: noSignal }).catch(() => undefined));
    expect(await screen.findByText('No connection')).toBeTruthy();
  });

  it('when a mutation answers 401, then the app is told the session ended', async () => {
    const onUnauthenticated = vi.fn();
    renderFailing(new ApiError({ status: 401, code: 'unauthenticated', message: 'Sign in to continue.' }), {
      onUnauthenticated,
    });

    await clickSave();

    expect(onUnauthenticated).toHaveBeenCalledTimes(1);
    expect(await screen.findByText('Your session ended')).toBeTruthy();
  });
});

describe('what is written to the device for the next page load', () => {
  it('when the cache is written, then a car and who is signed in are kept, but not other people’s accounts nor “nobody is signed in”', async () => {
    const queryClient = createQueryClient({ retry: false });
    queryClient.setQueryData(['cars', 'list'], [{ id: 'c1' }]);
    queryClient.setQueryData(['auth', 'me'], { id: 'u1' });
    await queryClient.prefetchQuery({ ...accountsQueryOptions(''), queryFn: () => ({ items: [], count: 0, total: 0 }) });
    await queryClient.prefetchQuery({ ...accountsQueryOptions('odile'), queryFn: () => ({ items: [], count: 0, total: 0 }) });
    const kept = (client: typeof queryClient) =>
      dehydrate(client, { shouldDehydrateQuery: keptOnDevice }).queries.map((q) => JSON.stringify(q.queryKey));

    expect(kept(queryClient)).toEqual(['["cars","list"]', '["auth","me"]']);

    queryClient.setQueryData(['auth', 'me'], null);
    expect(kept(queryClient)).toEqual(['["cars","list"]']);
  });

  it('when asking again fails for want of an answer, then the last answer is kept as an answer; when it is refused, it is dropped', async () => {
    const queryClient = createQueryClient({ retry: false });
    const failOnRefresh = async (key: string, error: ApiError) => {
      queryClient.setQueryData([key], { id: key });
      await queryClient.fetchQuery({ queryKey: [key], queryFn: () => Promise.reject(error), staleTime: 0 }).catch(() => undefined);
    };
    await failOnRefresh('no-signal', new ApiError({ status: 0, code: 'network', message: 'No connection' }));
    await failOnRefresh('server-down', new ApiError({ status: 503, code: 'unavailable', message: 'Down' }));
    await failOnRefresh('too-busy', new ApiError({ status: 429, code: 'rate_limited', message: 'Busy' }));
    await failOnRefresh('deleted', new ApiError({ status: 404, code: 'not_found', message: 'Gone' }));
    // Never answered at all: nothing to keep.
    await queryClient.fetchQuery({ queryKey: ['never'], queryFn: () => Promise.reject(new ApiError({ status: 0, code: 'network', message: 'x' })) }).catch(() => undefined);
    expect(queryClient.getQueryState(['no-signal'])?.status).toBe('error');

    const written = lastAnswers({ timestamp: 0, buster: '', clientState: dehydrate(queryClient, { shouldDehydrateQuery: keptOnDevice }) });
    const queries = written.clientState.queries;
    expect(queries.map((q) => q.queryKey[0])).toEqual(['no-signal', 'server-down', 'too-busy']);
    for (const q of queries) {
      expect(q.state).toMatchObject({ status: 'success', error: null, data: { id: q.queryKey[0] } });
    }
    // The cache in memory still knows the refresh failed.
    expect(queryClient.getQueryState(['no-signal'])?.status).toBe('error');
  });
});

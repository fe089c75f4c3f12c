import { QueryClient, QueryObserver } from '@tanstack/react-query';
import { describe, expect, it } from 'vitest';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** A server whose answers each say how many writes it had taken when the read reached it; each answer waits for `release`. */
function slowServer() {
  let writes = 0;
  let reads = 0;
  const held: (() => void)[] = [];
  return {
    write: () => void (writes += 1),
    read: () => {
      reads += 1;
      const seen = writes;
      return new Promise<{ writes: number }>((resolve) => held.push(() => resolve({ writes: seen })));
    },
    releaseAll: () => held.splice(0).forEach((release) => release()),
    get reads() {
      return reads;
    },
  };
}

const settle = () => new Promise((resolve) => setTimeout(resolve, 0));

describe('reading again after a write', () => {
  it('when a list’s first read left before the write, then it is read again after, and what waited on that first read still gets an answer', async () => {
    const server = slowServer();
    const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    const observer = new QueryObserver(queryClient, { queryKey: ['accounts', 'odile'], queryFn: server.read });
    const unsubscribe = observer.subscribe(() => undefined);
    // A page's loader waiting on the same first read.
    const loader = queryClient.ensureQueryData({ queryKey: ['accounts', 'odile'], queryFn: server.read });

    server.write();
    const refreshed = refreshAfterWrite(queryClient, { queryKey: ['accounts'] });
    server.releaseAll();
    await settle();
    server.releaseAll();
    await refreshed;

    expect(await loader).toEqual({ writes: 0 });
    expect(server.reads).toBe(2);
    expect(queryClient.getQueryData(['accounts', 'odile'])).toEqual({ writes: 1 });
    unsubscribe();
  });

  it('when a list already holds data and is being read again, then the write’s refresh restarts that read once', async () => {
    const server = slowServer();
    const queryClient = new QueryClient({ defaultOptions: { queries: { retry: false } } });
    queryClient.setQueryData(['accounts', ''], { writes: -1 });
    const observer = new QueryObserver(queryClient, { queryKey: ['accounts', ''], queryFn: server.read, staleTime: 0 });
    // Data held but stale: subscribing reads again.
    const unsubscribe = observer.subscribe(() => undefined);
    expect(server.reads).toBe(1);

    server.write();
    const refreshed = refreshAfterWrite(queryClient, { queryKey: ['accounts'] });
    await settle();
    // The read from before the write was dropped and one new read went out; nothing more.
    expect(server.reads).toBe(2);
    server.releaseAll();
    await refreshed;

    expect(queryClient.getQueryData(['accounts', ''])).toEqual({ writes: 1 });
    unsubscribe();
  });
});

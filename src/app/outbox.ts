import type { QueryClient } from '@tanstack/react-query';
import { api, isApiError } from '@/lib/api-client';
import { deviceStorage, Outbox, type NewOutboxEntry, type OutboxEntry, type SendFailure } from '@/lib/outbox';
import { outboxMutationKey } from '@/lib/outbox-context';
import { refreshAfterWrite } from '@/lib/refresh-after-write';
import type { User } from '@shared/auth/auth.schema';
import { authKeys } from '@/features/auth/api/auth-keys';

/** The kinds of change made at the car; each is a mutation registered with setMutationDefaults. */
export const OUTBOX_KINDS = [
  'run.create', 'run.update', 'run.delete',
  'setup.create', 'setup.quickChange',
  'tyreSet.create', 'tyreSet.rotate', 'tread.create', 'pressure.create', 'change.create', 'event.create', 'car.create',
] as const;

/** Which cached data an entry changes once it lands, by the first part of its kind. */
export const INVALIDATES: Record<string, string[][]> = {
  run: [['runs'], ['events'], ['setups']],
  setup: [['setups'], ['runs'], ['events']],
  // tyreSet.create and tyreSet.rotate (a rotation changes which tyre each reading and wear interval belongs to).
  tyreSet: [['tyres']],
  tread: [['tyres']],
  pressure: [['pressures']],
  change: [['changes']],
  event: [['events']],
  car: [['cars']],
};

function send(entry: OutboxEntry) {
  switch (entry.method) {
    case 'POST':
      return api.post(entry.path, entry.body);
    case 'PATCH':
      return api.patch(entry.path, entry.body);
    case 'DELETE':
      return api.delete(entry.path);
  }
}

/** Why uploads wait when the server no longer knows the session (it expired, or was signed out elsewhere). */
export const SIGNED_OUT_REASON = 'Sign in again to upload';

/** Network trouble and server trouble wait and retry; a refusal stays visible until fixed; a deleted record is done. */
export function classifySendError(entry: OutboxEntry | null, error: unknown): SendFailure {
  if (!isApiError(error)) return { kind: 'retry', reason: 'Could not reach Scrubline' };
  if (error.code === 'network') return { kind: 'retry', reason: 'No connection' };
  if (error.status === 401) return { kind: 'retry', reason: SIGNED_OUT_REASON };
  if (error.status === 408 || error.status === 429 || error.status >= 500) return { kind: 'retry', reason: 'Scrubline is busy' };
  if (error.status === 404 && entry?.method === 'DELETE') return { kind: 'gone' };
  return {
    kind: 'refused',
    error: { status: error.status, code: error.code, message: error.message, ...(error.fieldErrors ? { fieldErrors: error.fieldErrors } : {}) },
  };
}

/** Who is signed in, as the query cache knows it: the owner of the changes made now. */
export const signedInAccount = (queryClient: QueryClient) => () => queryClient.getQueryData<User | null>(authKeys.me())?.id;

/**
 * Shows and sends the entries of whoever is signed in. Someone signing in after a session ended gets
 * theirs sent at once; the first answer of a page load (kept on the device or from the server) lets
 * them wait out their backoff, as they would have.
 */
export function followSignIn(queryClient: QueryClient, outbox: Outbox): void {
  const owner = signedInAccount(queryClient);
  let signedIn = owner();
  queryClient.getQueryCache().subscribe(() => {
    const now = owner();
    if (now === signedIn) return;
    const again = signedIn !== undefined;
    signedIn = now;
    // Nobody signed in: nothing is sent (see Outbox), and the sign-in page shows none of it.
    if (now) void (again ? outbox.retryNow() : outbox.flush());
  });
}

/** Is this record (an event, a car) still only on the phone, its creation waiting in the outbox? The server cannot know it yet. */
export const waitingIn = (outbox: Outbox) => (id: string) =>
  outbox.getSnapshot().some((e) => e.recordId === id && e.kind.endsWith('.create'));

/** The app's one outbox, wired to the API and the query cache. */
export function createAppOutbox(queryClient: QueryClient): Outbox {
  let current: OutboxEntry | null = null;
  const outbox = new Outbox({
    storage: deviceStorage(),
    owner: signedInAccount(queryClient),
    send: (entry) => {
      current = entry;
      return send(entry);
    },
    classify: (error) => classifySendError(current, error),
    onDelivered: (entry) => {
      for (const queryKey of INVALIDATES[entry.kind.split('.')[0]!] ?? []) void refreshAfterWrite(queryClient, { queryKey });
    },
  });
  for (const kind of OUTBOX_KINDS) {
    queryClient.setMutationDefaults(outboxMutationKey(kind), {
      mutationFn: (entry: NewOutboxEntry) => outbox.add(entry),
      // Writing to the device works with no signal at all.
      networkMode: 'always',
    });
  }
  followSignIn(queryClient, outbox);
  if (typeof window !== 'undefined') {
    window.addEventListener('online', () => void outbox.retryNow());
    void outbox.ready().then(() => outbox.flush());
  }
  return outbox;
}

import { MutationCache, QueryCache, type Query, QueryClient } from '@tanstack/react-query';
import type { PersistedClient } from '@tanstack/react-query-persist-client';
import { isApiError } from '@/lib/api-client';
import { toast } from '@/lib/toast-store';

export interface QueryClientOptions {
  /** Called when the server says the session is gone; the app sends the user to sign in. */
  onUnauthenticated?: () => void;
  /** Tests turn retries off. */
  retry?: boolean;
}

/** How long data kept on the device stays usable with no signal: a week covers an event weekend and the drive home. */
export const CACHE_MAX_AGE_MS = 7 * 24 * 60 * 60 * 1000;

/**
 * Which answers are written to the device for the next page load: those the server gave, kept too when asking
 * again failed for want of an answer (see `unanswered`). Not "nobody is signed in" (a copy written just
 * before a sign-in would send the next load back to the sign-in form), and not a query marked
 * `meta.notKeptOnDevice`: other people's accounts, read at a desk, that must not outlive the page on a shared
 * computer nor come back from it stale after a suspension.
 */
export function keptOnDevice(query: Query): boolean {
  const { status, data, error } = query.state;
  if (query.meta?.notKeptOnDevice || (status !== 'success' && (data === undefined || !unanswered(error)))) return false;
  return data != null || query.queryKey[0] !== 'auth';
}

/**
 * No answer came (no signal), or the server could not give one (5xx, a timeout, too many requests: the answers
 * the outbox waits out too): the answer kept before still stands. A refusal (403, 404: the car was deleted or
 * unshared) does not.
 */
const unanswered = (error: unknown) => isApiError(error) && (!error.status || error.status > 499 || error.status === 408 || error.status === 429);

/**
 * What is written to the device: a read whose refresh failed for want of signal is kept as its last answer, not
 * as a failure, so that the next page load with no signal opens on it as on any other.
 */
export const lastAnswers = (client: PersistedClient): PersistedClient => {
  for (const q of client.clientState.queries) if (q.state.status === 'error') q.state = { ...q.state, status: 'success', error: null };
  return client;
};

const FALLBACK_MESSAGE = 'Something went wrong. Your saved data is safe; try again.';

/** Errors a form shows beside its inputs are never toasted. */
function isFieldValidationError(error: unknown): boolean {
  return isApiError(error) && error.hasFieldErrors;
}

function isUnauthenticated(error: unknown): boolean {
  return isApiError(error) && error.status === 401;
}

function toastError(error: unknown) {
  const message = error instanceof Error && error.message ? error.message : FALLBACK_MESSAGE;
  toast({ tone: 'warning', title: message });
}

/** Retry reads that may work next time (weak signal, busy server); never retry a refusal. */
function shouldRetry(failureCount: number, error: unknown): boolean {
  if (isApiError(error) && error.status >= 400 && error.status < 500) return false;
  return failureCount < 2;
}

/**
 * Builds a QueryClient; the app makes exactly one (see main.tsx), tests make one each.
 * Every query and mutation error passes through here: a 401 sends the user to sign in, field
 * errors stay on their form, a screen that shows its own errors (`meta.errorsShownInline`)
 * is left alone, so is a read that failed for want of an answer while its last one is on screen,
 * and everything else becomes a toast.
 */
export function createQueryClient({ onUnauthenticated, retry = true }: QueryClientOptions = {}): QueryClient {
  return new QueryClient({
    queryCache: new QueryCache({
      onSuccess: (data, query) => {
        if (data === null && query.meta?.nullMeansSignedOut) onUnauthenticated?.();
      },
      onError: (error, query) => {
        if (isUnauthenticated(error)) {
          onUnauthenticated?.();
          return;
        }
        // A page that has its last answer keeps showing it with no signal; the top bar says "offline".
        if (query.meta?.errorsShownInline || isFieldValidationError(error) || (query.state.data !== undefined && unanswered(error))) return;
        toastError(error);
      },
    }),
    mutationCache: new MutationCache({
      onError: (error, _variables, _onMutateResult, mutation) => {
        // On a signed-in page a 401 means the session ended; on the sign-in form it means a wrong
        // password, and the handler leaves public pages alone.
        if (isUnauthenticated(error)) onUnauthenticated?.();
        if (mutation.meta?.errorsShownInline || isFieldValidationError(error)) return;
        if (isUnauthenticated(error)) {
          toast({ tone: 'warning', title: 'Your session ended', description: 'Sign in again to carry on.' });
          return;
        }
        toastError(error);
      },
    }),
    defaultOptions: {
      queries: {
        retry: retry ? shouldRetry : false,
        staleTime: 30_000,
        // Kept at least as long as the persisted copy, or the restored cache would be thrown away.
        gcTime: CACHE_MAX_AGE_MS,
      },
      mutations: {
        retry: false,
      },
    },
  });
}

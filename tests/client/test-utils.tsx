import { memoryStorage, Outbox, type OutboxEntry } from '../../src/lib/outbox';
import { outboxMutationKey } from '@/lib/outbox-context';
import { api, dropCsrfToken } from '@/lib/api-client';
import { clearToasts } from '@/lib/toast-store';
import { classifySendError, followSignIn, OUTBOX_KINDS, signedInAccount, waitingIn } from '@/app/outbox';
import { cleanup, configure, render } from '@testing-library/react';
import type { ReactNode } from 'react';
import { QueryClientProvider, type QueryClient } from '@tanstack/react-query';
import { createMemoryRouter } from 'react-router-dom';
import { afterEach, beforeAll, beforeEach, vi, type Mock } from 'vitest';
import { AppProvider } from '@/app/provider';
import { createQueryClient } from '@/app/query-client';
import { createRoutes, sendToSignIn } from '@/app/router';

// Pages load lazily and the suite runs many files side by side: give screens a few seconds to appear
// before a test gives up (a passing test waits no longer than the screen needs).
configure({ asyncUtilTimeout: 5000 });

export interface RecordedRequest {
  method: string;
  url: string;
  headers: Headers;
  body: unknown;
}

type Answer = Response | ((request: RecordedRequest) => Response | Promise<Response>);

/** A fake server's answers, keyed "METHOD /path" (see stubFetch). */
export type StubRoutes = Record<string, Answer | Answer[]>;

export function jsonResponse(status: number, body?: unknown): Response {
  return new Response(body === undefined ? null : JSON.stringify(body), {
    status,
    headers: body === undefined ? {} : { 'Content-Type': 'application/json' },
  });
}

export function errorResponse(
  status: number,
  code: string,
  message: string,
  fieldErrors?: Record<string, string[]>,
): Response {
  return jsonResponse(status, { error: { code, message, ...(fieldErrors ? { fieldErrors } : {}) } });
}

export const CSRF_TOKEN = 'token-1';

/** Any signed-in route's answer once the session has ended. */
export const SIGNED_OUT = errorResponse(401, 'unauthenticated', 'Sign in to continue.');

/** GET /api/auth/session when nobody is signed in. */
export const NOBODY_SIGNED_IN = jsonResponse(200, { user: null });

/**
 * Stubs the global fetch with answers keyed "METHOD /path". An array is answered in order
 * (the last one repeats). GET /api/auth/csrf answers a token and GET /api/notifications/unread-count
 * answers 0 unless given. Unknown routes fail the test.
 */
export function stubFetch(routes: StubRoutes): Mock<typeof fetch> {
  const calls = new Map<string, number>();
  const all: StubRoutes = {
    'GET /api/auth/csrf': () => jsonResponse(200, { token: CSRF_TOKEN }),
    // The bell in the top bar asks on every signed-in page.
    'GET /api/notifications/unread-count': () => jsonResponse(200, { unread: 0 }),
    // So does Home, for the links to each team's class board.
    'GET /api/teams/mine': () => jsonResponse(200, { items: [], count: 0 }),
    // And, for someone with a car, for the suggestions waiting for their answer.
    'GET /api/suggestions/waiting': () => jsonResponse(200, { items: [], count: 0 }),
    ...routes,
  };
  const mock = vi.fn<typeof fetch>(async (input, init) => {
    const url = typeof input === 'string' ? input : input instanceof URL ? input.href : input.url;
    const method = (init?.method ?? 'GET').toUpperCase();
    const key = `${method} ${url}`;
    const entry = all[key];
    if (!entry) throw new Error(`Unexpected request in test: ${key}`);
    const n = calls.get(key) ?? 0;
    calls.set(key, n + 1);
    const answer = Array.isArray(entry) ? entry[Math.min(n, entry.length - 1)] : entry;
    if (!answer) throw new Error(`No answer for ${key}`);
    const request: RecordedRequest = {
      method,
      url,
      headers: new Headers(init?.headers),
      body: typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined,
    };
    return typeof answer === 'function' ? answer(request) : answer.clone();
  });
  vi.stubGlobal('fetch', mock);
  return mock;
}

/** The requests a stubbed fetch received for one "METHOD /path". */
export function requestsTo(mock: Mock<typeof fetch>, key: string): RecordedRequest[] {
  return mock.mock.calls
    .map(([input, init]) => ({
      method: (init?.method ?? 'GET').toUpperCase(),
      url: String(input),
      headers: new Headers(init?.headers),
      body: typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined,
    }))
    .filter((r) => `${r.method} ${r.url}` === key);
}

export function createTestQueryClient(): QueryClient {
  return createQueryClient({ retry: false });
}

export interface RenderAppOptions {
  /** Entries already on the device when the app opens (e.g. runs logged offline earlier). */
  outboxEntries?: OutboxEntry[];
  /** Settles when the device has read what it keeps (the query cache, as main.tsx restores it); at once by default. */
  deviceRead?: Promise<unknown>;
}

const liveOutboxes = new Set<Outbox>();

/** Empties every outbox a test made, which also stops its retry timers; call it in afterEach. */
export async function clearTestOutboxes(): Promise<void> {
  await Promise.all([...liveOutboxes].map((o) => o.clear()));
  liveOutboxes.clear();
}

export interface AppTestOptions {
  /** Also empty localStorage after each test (for pages that remember a choice there). */
  clearLocalStorage?: boolean;
}

/**
 * The hooks of a test file that renders the app: the given pages loaded once, in order, before
 * the first test (pages load lazily; otherwise the first test spends its wait compiling), a fresh
 * CSRF token for each test, and after each test its outboxes, screen, toasts and stubbed fetch gone.
 */
export function setUpAppTests(pages: readonly (() => Promise<unknown>)[] = [], { clearLocalStorage = false }: AppTestOptions = {}): void {
  if (pages.length > 0) {
    beforeAll(async () => {
      for (const load of pages) await load();
    }, 30_000);
  }
  beforeEach(() => {
    dropCsrfToken();
    // jsdom draws nothing and has no scrolling; a page opened by a link asks for its top (use-new-page-at-top.ts).
    vi.stubGlobal('scrollTo', () => {});
  });
  afterEach(async () => {
    await clearTestOutboxes();
    cleanup();
    clearToasts();
    if (clearLocalStorage) localStorage.clear();
    vi.unstubAllGlobals();
  });
}

/**
 * Renders the whole app (real routes, providers and toasts) at an address, with a fresh QueryClient
 * and an outbox kept in memory. The outbox works as the app's does: every write kind is registered,
 * entries are sent through the (stubbed) fetch in order, and failures are classified the same way —
 * a network error waits, a refusal stays with its error. Retries wait a minute, past any test.
 */
export function renderApp(path: string, { outboxEntries = [], deviceRead = Promise.resolve() }: RenderAppOptions = {}) {
  const queryClient = createQueryClient({ retry: false, onUnauthenticated: () => sendToSignIn(router, queryClient) });
  // As main.tsx does: an event whose creation waits in this outbox (made below, so read after this turn) is not asked of the server.
  const { routes, discover } = createRoutes(queryClient, { waiting: (id) => waitingIn(outbox)(id), read: Promise.all([deviceRead, Promise.resolve().then(() => outbox.ready())]) });
  const router = createMemoryRouter(routes, { initialEntries: [path], patchRoutesOnNavigation: discover });
  let current: OutboxEntry | null = null;
  // What the device holds, whoever is signed in (the outbox shows only their entries).
  const storage = memoryStorage(outboxEntries);
  const outbox = new Outbox({
    storage,
    send: (entry) => {
      current = entry;
      if (entry.method === 'POST') return api.post(entry.path, entry.body);
      if (entry.method === 'PATCH') return api.patch(entry.path, entry.body);
      return api.delete(entry.path);
    },
    classify: (error) => classifySendError(current, error),
    onDelivered: () => void queryClient.invalidateQueries(),
    owner: signedInAccount(queryClient),
    backoffMs: () => 60_000,
  });
  liveOutboxes.add(outbox);
  followSignIn(queryClient, outbox);
  for (const kind of OUTBOX_KINDS) {
    queryClient.setMutationDefaults(outboxMutationKey(kind), {
      mutationFn: (entry: Parameters<Outbox['add']>[0]) => outbox.add(entry),
      networkMode: 'always',
    });
  }
  const result = render(<AppProvider queryClient={queryClient} router={router} outbox={outbox} />);
  return { ...result, router, queryClient, outbox, storage };
}

/** A stored outbox entry, as the outbox keeps it (for `outboxEntries`). */
export function storedEntry(partial: Partial<OutboxEntry> & Pick<OutboxEntry, 'recordId' | 'kind' | 'method' | 'path'>): OutboxEntry {
  return {
    key: partial.key ?? `k-${partial.recordId}-${partial.kind}`,
    label: partial.kind,
    scope: {},
    createdAt: Date.now() - 60_000,
    attempts: 0,
    nextAttemptAt: Date.now() - 60_000,
    state: 'waiting',
    ...partial,
  };
}

/** An entry whose last try failed for want of signal and that waits a while: everything behind it stays unsent. */
export function blockingEntry(): OutboxEntry {
  return storedEntry({
    key: 'blocker',
    recordId: '00000000-0000-4000-8000-00000000b10c',
    kind: 'change.create',
    method: 'POST',
    path: '/api/cars/elsewhere/changes',
    body: { id: '00000000-0000-4000-8000-00000000b10c', changedOn: '2026-06-01', what: 'Earlier note' },
    label: 'Change log · Earlier note',
    scope: { carId: 'elsewhere' },
    attempts: 1,
    nextAttemptAt: Date.now() + 10 * 60_000,
  });
}

/** Renders one component with a fresh QueryClient around it. */
export function renderWithQueryClient(ui: ReactNode) {
  const queryClient = createTestQueryClient();
  const result = render(<QueryClientProvider client={queryClient}>{ui}</QueryClientProvider>);
  return { ...result, queryClient };
}

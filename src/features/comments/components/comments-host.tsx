import { lazy, Suspense, useCallback, useEffect, useState, useSyncExternalStore, type ReactNode } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useLocation, useNavigate } from 'react-router-dom';
import type { CommentTarget } from '@shared/collab/comment.schema';
import { ErrorBoundary } from '@/components/errors/error-boundary';
import { toast } from '@/lib/toast-store';
// Type only: importing the button's module would tie this chunk (on every page) to the trackside one.
import type { OpenCommentsDetail } from './comments-button';

/** Must match OPEN_COMMENTS_EVENT in comments-button.tsx. */
const OPEN_COMMENTS_EVENT = 'scrubline:open-comments';

const lazyDialog = () => lazy(async () => ({ default: (await import('./comment-thread')).CommentDialog }));

/** The thread's code could not be fetched (no signal since the app was kept on the device): say so once. */
function CouldNotOpen({ onShown }: { onShown: () => void }) {
  useEffect(() => {
    toast({ tone: 'warning', title: 'Comments could not open', description: 'They need a connection the first time.' });
    onShown();
  }, [onShown]);
  return null;
}

/** A run's thread opened from a link, before the board's runs say which run it is. */
const THIS_RUN = 'this run';

/** Must match `runKeys.all` in features/runs (importing it would tie this chunk, on every page, to the trackside one). */
const RUNS_KEY = ['runs'];

/**
 * "run 4, Teo Marsh": a run as the day's board has read it, for the title of its thread opened from a link (which
 * names only its id); null until the board's runs are in.
 */
function useRunWords(runId: string | null): string | null {
  const queryClient = useQueryClient();
  const subscribe = useCallback((onChange: () => void) => queryClient.getQueryCache().subscribe(onChange), [queryClient]);
  const words = useCallback(() => {
    if (!runId) return null;
    for (const query of queryClient.getQueryCache().findAll({ queryKey: RUNS_KEY })) {
      const items = (query.state.data as { items?: { id: string; runNumber: number; driver?: { displayName: string } }[] } | undefined)?.items;
      const run = items?.find((r) => r.id === runId);
      if (run) return `run ${run.runNumber}${run.driver ? `, ${run.driver.displayName}` : ''}`;
    }
    return null;
  }, [queryClient, runId]);
  return useSyncExternalStore(subscribe, words);
}

/**
 * The thread a day's board was opened for (a notification's link): `?comments=` names a run, or the day itself
 * (the event's own id, with `carId`, for the car's day).
 */
function threadAsked(pathname: string, search: string): OpenCommentsDetail | null {
  const eventId = /^\/events\/([^/]+)$/.exec(pathname)?.[1];
  const params = new URLSearchParams(search);
  const id = params.get('comments');
  const carId = params.get('carId');
  if (!eventId || !id) return null;
  if (id !== eventId) return { target: { type: 'run', id }, what: THIS_RUN };
  return carId ? { target: { type: 'event', id, carId }, what: 'this day' } : null;
}

/**
 * Opens a comment thread over whatever page asked (the trackside "Comments" buttons, or a day's board opened
 * from a notification): the app shell mounts this once, and the thread's code is fetched on the first request.
 * `renderExtras` adds more about the same record above the thread (the shell passes the record's photos).
 */
export function CommentsHost({ renderExtras }: { renderExtras?: (target: CommentTarget) => ReactNode } = {}) {
  const [request, setRequest] = useState<OpenCommentsDetail | null>(null);
  // A fresh lazy component after a failed download, so the next tap tries again.
  const [CommentDialog, setCommentDialog] = useState(() => lazyDialog());
  useEffect(() => {
    const onOpen = (event: Event) => setRequest((event as CustomEvent<OpenCommentsDetail>).detail);
    window.addEventListener(OPEN_COMMENTS_EVENT, onOpen);
    return () => window.removeEventListener(OPEN_COMMENTS_EVENT, onOpen);
  }, []);
  const { pathname, search, hash } = useLocation();
  const navigate = useNavigate();
  const asked = threadAsked(pathname, search);
  const askedAt = asked ? pathname + search : null;
  const [opened, setOpened] = useState<string | null>(null);
  if (askedAt !== opened && (asked || opened !== null)) {
    // Forgotten once the address drops it, so the same link followed again opens the thread again.
    setOpened(askedAt);
    if (asked) setRequest(asked);
  }
  useEffect(() => {
    if (!askedAt) return;
    // Opened once: the address drops it, so closing the thread, or a reload, leaves the board as it is.
    const params = new URLSearchParams(search);
    params.delete('comments');
    void navigate({ pathname, search: `?${params.toString()}`, hash }, { replace: true });
  }, [askedAt, pathname, search, hash, navigate]);
  const runWords = useRunWords(request?.what === THIS_RUN ? request.target.id : null);
  if (!request) return null;
  return (
    <ErrorBoundary
      fallback={({ reset }) => (
        <CouldNotOpen
          onShown={() => {
            setRequest(null);
            setCommentDialog(() => lazyDialog());
            reset();
          }}
        />
      )}
    >
      <Suspense fallback={null}>
        <CommentDialog
          target={request.target}
          title={`Comments on ${runWords ?? request.what}`}
          open
          onOpenChange={(open) => {
            if (!open) setRequest(null);
          }}
        >
          {renderExtras?.(request.target)}
        </CommentDialog>
      </Suspense>
    </ErrorBoundary>
  );
}

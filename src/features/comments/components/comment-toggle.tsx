import { lazy, Suspense, useId, useState } from 'react';
import { ChevronDown, ChevronRight, MessageSquare } from 'lucide-react';
import type { CommentTarget } from '@shared/collab/comment.schema';
import { ErrorBoundary } from '@/components/errors/error-boundary';

// The thread's code comes with the first thread opened on the page.
const CommentThread = lazy(async () => ({ default: (await import('./comment-thread')).CommentThread }));

interface CommentToggleProps {
  target: CommentTarget;
  /** What the thread is about, to finish "Comments on …": "run 3", "“Spring baseline”". */
  what: string;
  /** How many comments the thread holds, when the list already knows. */
  count?: number;
}

/** A thread folded away under its button; fetched only when opened, so a long list asks for nothing up front. */
export function CommentToggle({ target, what, count }: CommentToggleProps) {
  const [open, setOpen] = useState(false);
  const panelId = useId();
  const Chevron = open ? ChevronDown : ChevronRight;
  return (
    <div className="flex flex-col gap-2">
      <button
        type="button"
        aria-expanded={open}
        aria-controls={panelId}
        onClick={() => setOpen((v) => !v)}
        className="inline-flex min-h-tap items-center gap-1 self-start font-semibold text-link"
      >
        <Chevron aria-hidden="true" className="size-4" />
        <MessageSquare aria-hidden="true" className="size-4" />
        Comments{count !== undefined ? ` (${count})` : ''}
        <span className="sr-only"> on {what}</span>
      </button>
      <div id={panelId} hidden={!open}>
        {open ? (
          <ErrorBoundary fallback={() => <p className="text-ink-muted">Comments could not be opened. Try again when you have signal.</p>}>
            <Suspense fallback={<p className="text-ink-muted">Loading comments…</p>}>
              <CommentThread target={target} label={`Comments on ${what}`} />
            </Suspense>
          </ErrorBoundary>
        ) : null}
      </div>
    </div>
  );
}

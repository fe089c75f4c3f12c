import { lazy } from 'react';
import { MessageSquare } from 'lucide-react';
import type { CommentTarget } from '@shared/collab/comment.schema';
import { FoldOut } from '@/components/fold-out/fold-out';

// The thread's code comes with the first thread opened on the page.
const CommentThread = lazy(async () => ({ default: (await import('./comment-thread')).CommentThread }));

interface CommentToggleProps {
  target: CommentTarget;
  /** What the thread is about, to finish "Comments on …": "run 3", "“Spring baseline”". */
  what: string;
  /** How many comments the thread holds, when the list already knows. */
  count?: number;
  /** The page was opened for this thread: it is open and scrolled to. */
  revealed?: boolean;
}

/** A thread folded away under its button; fetched only when opened, so a long list asks for nothing up front. */
export function CommentToggle({ target, what, count, revealed }: CommentToggleProps) {
  return (
    <FoldOut
      revealed={revealed}
      icon={MessageSquare}
      label={`Comments${count !== undefined ? ` (${count})` : ''}`}
      what={what}
      loadingText="Loading comments…"
      failedText="Comments could not be opened. Try again when you have signal."
    >
      <CommentThread target={target} label={`Comments on ${what}`} />
    </FoldOut>
  );
}

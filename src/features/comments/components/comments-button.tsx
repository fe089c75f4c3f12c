import type { CommentTarget } from '@shared/collab/comment.schema';
import { Button } from '@/components/ui/button';

/** The request the trackside button sends to the shell's comments host (comments-host.tsx). */
export const OPEN_COMMENTS_EVENT = 'scrubline:open-comments';
export interface OpenCommentsDetail {
  target: CommentTarget;
  /** "run 3", "Grey roadster at Harbour Lot Sprint". */
  what: string;
}

/**
 * "Comments (n)" on a run or on a car's day at the track. The thread opens in a dialog the app
 * shell hosts and downloads on the first tap, so the trackside screen carries only this button.
 */
export function CommentsButton({ target, what, count }: OpenCommentsDetail & { count?: number }) {
  return (
    <Button
      variant="quiet"
      className="px-2"
      onClick={() => dispatchEvent(new CustomEvent<OpenCommentsDetail>(OPEN_COMMENTS_EVENT, { detail: { target, what } }))}
    >
      Comments{count === undefined ? '' : ` (${count})`}
      <span className="sr-only"> on {what}</span>
    </Button>
  );
}

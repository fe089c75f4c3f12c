import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Comment, CommentTarget, UpdateCommentInput } from '@shared/collab/comment.schema';
import { api } from '@/lib/api-client';
import { commentKeys } from './comment-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function updateComment(commentId: string, input: UpdateCommentInput): Promise<Comment> {
  return api.patch(`/api/comments/${encodeURIComponent(commentId)}`, input);
}

/** Edits the author's own comment; a stale version comes back as a 409 the form explains. */
export function useUpdateComment(target: CommentTarget) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ commentId, input }: { commentId: string; input: UpdateCommentInput }) => updateComment(commentId, input),
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: commentKeys.thread(target) }),
  });
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CommentTarget } from '@shared/collab/comment.schema';
import { api } from '@/lib/api-client';
import { commentKeys } from './comment-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

export function deleteComment(commentId: string): Promise<void> {
  return api.delete(`/api/comments/${encodeURIComponent(commentId)}`);
}

export function useDeleteComment(target: CommentTarget) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: deleteComment,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: () => refreshAfterWrite(queryClient, { queryKey: commentKeys.thread(target) }),
  });
}

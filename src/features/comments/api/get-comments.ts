import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Comment, CommentTarget } from '@shared/collab/comment.schema';
import { api } from '@/lib/api-client';
import { commentKeys } from './comment-keys';

/** One thread, oldest first. */
export function getComments(target: CommentTarget, { signal }: { signal?: AbortSignal } = {}): Promise<{ items: Comment[]; count: number }> {
  const query = new URLSearchParams({ type: target.type, id: target.id, ...(target.carId ? { carId: target.carId } : {}) });
  return api.get(`/api/comments?${query.toString()}`, { signal });
}

export function commentsQueryOptions(target: CommentTarget) {
  return queryOptions({
    queryKey: commentKeys.thread(target),
    queryFn: ({ signal }) => getComments(target, { signal }),
    meta: { errorsShownInline: true },
  });
}

export function useComments(target: CommentTarget) {
  return useQuery(commentsQueryOptions(target));
}

import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { Comment, CreateCommentInput } from '@shared/collab/comment.schema';
import { api } from '@/lib/api-client';
import { commentKeys } from './comment-keys';
import { refreshAfterWrite } from '@/lib/refresh-after-write';

/** Always sent with an id made on the device, so sending the same comment again never posts it twice. */
export type CreateCommentBody = CreateCommentInput & { id: string };

export function createComment(body: CreateCommentBody): Promise<Comment> {
  return api.post('/api/comments', body);
}

/** An online write: its errors (a field error, no connection) are shown on the form, which keeps the text. */
export function useCreateComment() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createComment,
    networkMode: 'always',
    meta: { errorsShownInline: true },
    onSuccess: (_comment, body) => refreshAfterWrite(queryClient, { queryKey: commentKeys.thread(body.target) }),
  });
}

import type { CommentTarget } from '@shared/collab/comment.schema';

/** Every comment query key; a thread's key holds its whole target (an event thread is per car). */
export const commentKeys = {
  all: ['comments'] as const,
  thread: (target: CommentTarget) => [...commentKeys.all, 'thread', { type: target.type, id: target.id, carId: target.carId ?? null }] as const,
};

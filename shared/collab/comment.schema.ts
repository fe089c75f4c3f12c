import * as z from '../zod';
import { versionSchema } from '../season/car.schema';

/** What a thread hangs on. An event thread is per car: each car's people talk about their own day. */
export const COMMENT_TARGETS = ['run', 'event', 'setup', 'tread_reading', 'work_order'] as const;
export type CommentTargetType = (typeof COMMENT_TARGETS)[number];

const body = z
  .string({ error: 'Write a comment' })
  .check(z.trim(), z.minLength(1, 'Write a comment'), z.maxLength(4000, 'Use at most 4000 characters'));

export const commentTargetSchema = z.strictObject({
  type: z.enum(COMMENT_TARGETS),
  id: z.uuid({ error: 'Not a valid id' }),
  /** Required for an event thread: whose day it is about. Ignored otherwise. */
  carId: z.optional(z.uuid()),
});
export type CommentTarget = z.infer<typeof commentTargetSchema>;

export const createCommentInputSchema = z.strictObject({
  /** Client-made id, so a resend never posts twice. */
  id: z.optional(z.uuid()),
  target: commentTargetSchema,
  body,
});
export type CreateCommentInput = z.infer<typeof createCommentInputSchema>;

export const updateCommentInputSchema = z.strictObject({ body, version: versionSchema });
export type UpdateCommentInput = z.infer<typeof updateCommentInputSchema>;

/** GET /api/comments?type=run&id=… (&carId=… for an event) */
export const commentThreadQuerySchema = z.strictObject({
  type: z.enum(COMMENT_TARGETS),
  id: z.uuid(),
  carId: z.optional(z.uuid()),
});

export interface Comment {
  id: string;
  carId: string;
  target: { type: CommentTargetType; id: string };
  author: { id: string; displayName: string };
  /** Set when the author wrote as shop staff: shown beside the name. */
  shop: { id: string; name: string } | null;
  body: string;
  /** The signed-in user wrote it, so may edit and delete it. */
  mine: boolean;
  editedAt: string | null;
  version: number;
  createdAt: string;
}

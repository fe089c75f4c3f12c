import { Router } from 'express';
import type { DataSource } from 'typeorm';
import {
  commentThreadQuerySchema, createCommentInputSchema, updateCommentInputSchema,
  type CommentTarget, type CreateCommentInput, type UpdateCommentInput,
} from '@shared/collab/comment.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import type { MailSettings } from '../../mail/mailer';
import { createComment, deleteComment, listComments, updateComment } from './comment.service';

/** Routes under /api/comments: threads on runs, (event, car) pairs, setups and tread readings. */
export function commentRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const commentParam = idParam('commentId');

  router.get('/', validate({ query: commentThreadQuerySchema }), async (req, res) => {
    res.json(list(await listComments(ds, currentUser(req), parsed<CommentTarget>(res, 'query'))));
  });
  router.post('/', validate({ body: createCommentInputSchema }), async (req, res) => {
    const { comment, created } = await createComment(ds, mail, currentUser(req), parsed<CreateCommentInput>(res, 'body'));
    res.status(created ? 201 : 200).json(comment);
  });
  router.patch('/:commentId', validate({ params: commentParam, body: updateCommentInputSchema }), async (req, res) => {
    const { commentId } = parsed<{ commentId: string }>(res, 'params');
    res.json(await updateComment(ds, currentUser(req), commentId, parsed<UpdateCommentInput>(res, 'body')));
  });
  router.delete('/:commentId', validate({ params: commentParam }), async (req, res) => {
    await deleteComment(ds, currentUser(req), parsed<{ commentId: string }>(res, 'params').commentId);
    res.status(204).end();
  });
  return router;
}

import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { markReadInputSchema, type MarkReadInput } from '@shared/collab/notification.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import type { MailSettings } from '../../mail/mailer';
import { listNotifications, markRead, unreadCount } from './notification.service';

/** Routes under /api/notifications: the signed-in user's own, nobody else's. */
export function notificationRoutes(ds: DataSource, _mail?: MailSettings) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);

  router.get('/', async (req, res) => {
    res.json(await listNotifications(ds, currentUser(req)));
  });
  router.get('/unread-count', async (req, res) => {
    res.json(await unreadCount(ds, currentUser(req)));
  });
  router.post('/read', validate({ body: markReadInputSchema }), async (req, res) => {
    res.json(await markRead(ds, currentUser(req), parsed<MarkReadInput>(res, 'body')));
  });
  return router;
}

import { Router, type RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import * as z from '@shared/zod';
import { currentUser, requireAuth } from '../../auth/access';
import { idParam } from '../../lib/http';
import { notFound } from '../../lib/app-error';
import { parsed, validate } from '../../lib/validate';
import type { MailSettings } from '../../mail/mailer';
import { unsubscribeByToken } from '../users/user.service';
import { acceptInvitation, previewInvitation } from './invitation.service';

/** A link token is base64url; anything else names no invitation (404). */
const tokenParam = z.strictObject({
  token: z.string().check(z.minLength(20), z.maxLength(200), z.regex(/^[A-Za-z0-9_-]+$/)),
});
type TokenParam = z.infer<typeof tokenParam>;

export function invitationRoutes(ds: DataSource, _mail?: MailSettings) {
  const router = Router({ mergeParams: true });

  router.get('/:token', validate({ params: tokenParam }), async (_req, res) => {
    res.json(await previewInvitation(ds, parsed<TokenParam>(res, 'params').token));
  });

  router.post('/:token/accept', requireAuth, validate({ params: tokenParam }), async (req, res) => {
    res.json(await acceptInvitation(ds, currentUser(req), parsed<TokenParam>(res, 'params').token));
  });

  return router;
}

const unsubscribeParams = idParam('token');

const unsubscribe =
  (ds: DataSource): RequestHandler =>
  async (_req, res) => {
    if (!(await unsubscribeByToken(ds, parsed<{ token: string }>(res, 'params').token))) throw notFound('That unsubscribe link');
    res.status(204).end();
  };

/** POST /api/unsubscribe/:token — from the unsubscribe page; the token alone decides, no sign-in needed. */
export function unsubscribeRoutes(ds: DataSource, _mail?: MailSettings) {
  const router = Router({ mergeParams: true });
  router.post('/:token', validate({ params: unsubscribeParams }), unsubscribe(ds));
  return router;
}

/**
 * RFC 8058 one-click unsubscribe: mail programs POST to the List-Unsubscribe address
 * itself (the /unsubscribe/:token page), with no cookies and no CSRF token. Mounted
 * outside /api, so neither sessions nor the CSRF check apply; the unguessable token is
 * the only authority, and all it can do is turn notification e-mails off.
 */
export function oneClickUnsubscribe(ds: DataSource): RequestHandler[] {
  return [validate({ params: unsubscribeParams }), unsubscribe(ds)];
}

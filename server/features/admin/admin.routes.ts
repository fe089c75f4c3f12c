import { Router } from 'express';
import type { DataSource } from 'typeorm';
import {
  accountListQuerySchema, closeAccountByAdminInputSchema, setAdminInputSchema, suspendAccountInputSchema,
  type AccountListQuery, type CloseAccountByAdminInput, type SetAdminInput, type SuspendAccountInput,
} from '@shared/auth/admin.schema';
import { currentUser, requireRole } from '../../auth/access';
import { idParam } from '../../lib/http';
import { securityEvent } from '../../lib/security-log';
import { parsed, validate } from '../../lib/validate';
import { closeAccountAsAdmin } from '../../auth/close-account';
import type { MailSettings } from '../../mail/mailer';
import { listAccounts, restoreAccount, setAdmin, suspendAccount } from './admin.service';

/** Administration: the accounts, suspending or restoring one's sign-in, closing a suspended one, and the admin role. */
export function adminRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router();
  router.use(requireRole('admin'));
  const userParam = validate({ params: idParam('userId') });

  router.get('/users', validate({ query: accountListQuerySchema }), async (_req, res) => {
    res.json(await listAccounts(ds, parsed<AccountListQuery>(res, 'query').q || undefined));
  });
  router.post('/users/:userId/suspend', userParam, validate({ body: suspendAccountInputSchema }), async (req, res) => {
    const { userId } = parsed<{ userId: string }>(res, 'params');
    const account = await suspendAccount(ds, currentUser(req), userId, parsed<SuspendAccountInput>(res, 'body'));
    securityEvent(req, 'account-suspended', { target: userId });
    res.json(account);
  });
  router.post('/users/:userId/restore', userParam, async (req, res) => {
    const { userId } = parsed<{ userId: string }>(res, 'params');
    const account = await restoreAccount(ds, userId);
    securityEvent(req, 'account-restored', { target: userId });
    res.json(account);
  });
  /** A suspended account closed for good, its address typed again: 204, and it no longer appears. */
  router.post('/users/:userId/close', userParam, validate({ body: closeAccountByAdminInputSchema }), async (req, res) => {
    const { userId } = parsed<{ userId: string }>(res, 'params');
    await closeAccountAsAdmin(ds, mail, currentUser(req), userId, parsed<CloseAccountByAdminInput>(res, 'body'));
    securityEvent(req, 'account-closed-by-admin', { target: userId });
    res.status(204).end();
  });
  router.put('/users/:userId/admin', userParam, validate({ body: setAdminInputSchema }), async (req, res) => {
    const { userId } = parsed<{ userId: string }>(res, 'params');
    const { isAdmin } = parsed<SetAdminInput>(res, 'body');
    const account = await setAdmin(ds, currentUser(req), userId, isAdmin);
    securityEvent(req, 'admin-role-changed', { target: userId, isAdmin });
    res.json(account);
  });
  return router;
}

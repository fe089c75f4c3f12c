import { Router } from 'express';
import type { DataSource } from 'typeorm';
import * as z from '@shared/zod';
import {
  createShopInputSchema, grantShopInputSchema, inviteInputSchema, updateShopSettingsInputSchema,
  type CreateShopInput, type GrantShopInput, type InviteInput, type UpdateShopSettingsInput,
} from '@shared/collab/shop.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import type { MailSettings } from '../../mail/mailer';
import {
  createShop, getShop, grantShop, inviteStaff, listCustomers, listGrants, listShops, myShops, removeStaff, revokeShop,
  updateShopSettings,
} from './shop.service';

const shopListQuery = z.strictObject({ q: z.optional(z.string().check(z.maxLength(80, 'Use at most 80 characters'))) });

/** Routes under /api/shops. */
export function shopRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const shopParam = validate({ params: idParam('shopId') });

  router.get('/', validate({ query: shopListQuery }), async (_req, res) => {
    res.json(list(await listShops(ds, parsed<{ q?: string }>(res, 'query').q)));
  });
  router.post('/', validate({ body: createShopInputSchema }), async (req, res) => {
    res.status(201).json(await createShop(ds, currentUser(req), parsed<CreateShopInput>(res, 'body')));
  });
  router.get('/mine', async (req, res) => {
    res.json(list(await myShops(ds, currentUser(req))));
  });
  router.get('/:shopId', shopParam, async (req, res) => {
    res.json(await getShop(ds, currentUser(req), parsed<{ shopId: string }>(res, 'params').shopId));
  });
  router.patch('/:shopId/settings', validate({ params: idParam('shopId'), body: updateShopSettingsInputSchema }), async (req, res) => {
    const { shopId } = parsed<{ shopId: string }>(res, 'params');
    res.json(await updateShopSettings(ds, currentUser(req), shopId, parsed<UpdateShopSettingsInput>(res, 'body')));
  });
  router.get('/:shopId/customers', shopParam, async (req, res) => {
    res.json(list(await listCustomers(ds, currentUser(req), parsed<{ shopId: string }>(res, 'params').shopId)));
  });
  router.post('/:shopId/invitations', validate({ params: idParam('shopId'), body: inviteInputSchema }), async (req, res) => {
    const { shopId } = parsed<{ shopId: string }>(res, 'params');
    res.status(201).json(await inviteStaff(ds, mail, currentUser(req), shopId, parsed<InviteInput>(res, 'body')));
  });
  router.delete('/:shopId/staff/:userId', validate({ params: idParam('shopId', 'userId') }), async (req, res) => {
    const { shopId, userId } = parsed<{ shopId: string; userId: string }>(res, 'params');
    await removeStaff(ds, currentUser(req), shopId, userId);
    res.status(204).end();
  });
  return router;
}

/** Routes under /api/cars/:carId/shop-grants. */
export function carShopGrantRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);

  router.get('/', validate({ params: idParam('carId') }), async (req, res) => {
    res.json(list(await listGrants(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId)));
  });
  router.post('/', validate({ params: idParam('carId'), body: grantShopInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    const { grant, created } = await grantShop(ds, mail, currentUser(req), carId, parsed<GrantShopInput>(res, 'body').shopId);
    res.status(created ? 201 : 200).json(grant);
  });
  router.delete('/:shopId', validate({ params: idParam('carId', 'shopId') }), async (req, res) => {
    const { carId, shopId } = parsed<{ carId: string; shopId: string }>(res, 'params');
    await revokeShop(ds, currentUser(req), carId, shopId);
    res.status(204).end();
  });
  return router;
}

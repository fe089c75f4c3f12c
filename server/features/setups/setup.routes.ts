import { Router } from 'express';
import type { DataSource } from 'typeorm';
import {
  createSetupInputSchema, quickChangeInputSchema, updateSetupInputSchema,
  type CreateSetupInput, type QuickChangeInput, type UpdateSetupInput,
} from '@shared/season/setup.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import { runsOfSetup } from '../runs/run.service';
import { createSetup, deleteSetup, diff, getSetup, listSetups, quickChange, updateSetup } from './setup.service';

/** Routes under /api/cars/:carId/setups. */
export function carSetupRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const carParam = idParam('carId');

  router.post('/', validate({ params: carParam, body: createSetupInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    const { setup, created } = await createSetup(ds, currentUser(req), carId, parsed<CreateSetupInput>(res, 'body'));
    res.status(created ? 201 : 200).json(setup);
  });
  router.get('/', validate({ params: carParam }), async (req, res) => {
    res.json(list(await listSetups(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId)));
  });
  router.post('/quick-change', validate({ params: carParam, body: quickChangeInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    const { setup, created } = await quickChange(ds, currentUser(req), carId, parsed<QuickChangeInput>(res, 'body'));
    res.status(created ? 201 : 200).json(setup);
  });
  return router;
}

/** Routes under /api/setups. */
export function setupRoutes(ds: DataSource) {
  const router = Router();
  router.use(requireAuth);
  const setupParam = validate({ params: idParam('setupId') });

  router.get('/:setupId', setupParam, async (req, res) => {
    res.json(await getSetup(ds, currentUser(req), parsed<{ setupId: string }>(res, 'params').setupId));
  });
  router.patch('/:setupId', validate({ params: idParam('setupId'), body: updateSetupInputSchema }), async (req, res) => {
    const { setupId } = parsed<{ setupId: string }>(res, 'params');
    res.json(await updateSetup(ds, currentUser(req), setupId, parsed<UpdateSetupInput>(res, 'body')));
  });
  router.delete('/:setupId', setupParam, async (req, res) => {
    await deleteSetup(ds, currentUser(req), parsed<{ setupId: string }>(res, 'params').setupId);
    res.status(204).end();
  });
  router.get('/:setupId/runs', setupParam, async (req, res) => {
    res.json(list(await runsOfSetup(ds, currentUser(req), parsed<{ setupId: string }>(res, 'params').setupId)));
  });
  router.get('/:a/diff/:b', validate({ params: idParam('a', 'b') }), async (req, res) => {
    const { a, b } = parsed<{ a: string; b: string }>(res, 'params');
    res.json(await diff(ds, currentUser(req), a, b));
  });
  return router;
}

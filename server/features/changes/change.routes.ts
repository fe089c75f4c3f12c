import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createChangeInputSchema, type CreateChangeInput } from '@shared/season/change-log.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import { createChange, deleteChange, listChanges } from './change.service';

/** The change log, under /api/cars/:carId/changes. */
export function changeRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  router.post('/', validate({ params: idParam('carId'), body: createChangeInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    const { entry, created } = await createChange(ds, currentUser(req), carId, parsed<CreateChangeInput>(res, 'body'));
    res.status(created ? 201 : 200).json(entry);
  });
  router.get('/', validate({ params: idParam('carId') }), async (req, res) => {
    res.json(list(await listChanges(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId)));
  });
  router.delete('/:changeId', validate({ params: idParam('carId', 'changeId') }), async (req, res) => {
    const { carId, changeId } = parsed<{ carId: string; changeId: string }>(res, 'params');
    await deleteChange(ds, currentUser(req), carId, changeId);
    res.status(204).end();
  });
  return router;
}

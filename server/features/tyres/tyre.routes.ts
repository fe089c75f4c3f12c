import { Router } from 'express';
import type { DataSource } from 'typeorm';
import {
  createMountingInputSchema, createPressureReadingInputSchema, createTreadReadingInputSchema, createTyreSetInputSchema,
  type CreateMountingInput, type CreatePressureReadingInput, type CreateTreadReadingInput, type CreateTyreSetInput,
} from '@shared/season/tyre.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import { createPressureReading, listPressureReadings } from '../pressures/pressure.service';
import { addMounting, createTreadReading, createTyreSet, deleteTreadReading, listTreadReadings, listTyreSets } from './tyre.service';

/** Routes under /api/cars/:carId: tyre sets and pressure readings of one car. */
export function carTyreRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const carParam = idParam('carId');

  router.post('/tyre-sets', validate({ params: carParam, body: createTyreSetInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    const { tyreSet, created } = await createTyreSet(ds, currentUser(req), carId, parsed<CreateTyreSetInput>(res, 'body'));
    res.status(created ? 201 : 200).json(tyreSet);
  });
  router.get('/tyre-sets', validate({ params: carParam }), async (req, res) => {
    res.json(list(await listTyreSets(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId)));
  });
  router.post('/pressures', validate({ params: carParam, body: createPressureReadingInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    const { reading, created } = await createPressureReading(ds, currentUser(req), carId, parsed<CreatePressureReadingInput>(res, 'body'));
    res.status(created ? 201 : 200).json(reading);
  });
  router.get('/pressures', validate({ params: carParam }), async (req, res) => {
    res.json(list(await listPressureReadings(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId)));
  });
  return router;
}

/** Routes under /api/tyre-sets. */
export function tyreSetRoutes(ds: DataSource) {
  const router = Router();
  router.use(requireAuth);
  const setParam = idParam('tyreSetId');

  router.post('/:tyreSetId/readings', validate({ params: setParam, body: createTreadReadingInputSchema }), async (req, res) => {
    const { tyreSetId } = parsed<{ tyreSetId: string }>(res, 'params');
    const { reading, created } = await createTreadReading(ds, currentUser(req), tyreSetId, parsed<CreateTreadReadingInput>(res, 'body'));
    res.status(created ? 201 : 200).json(reading);
  });
  router.delete('/:tyreSetId/readings/:readingId', validate({ params: idParam('tyreSetId', 'readingId') }), async (req, res) => {
    const { tyreSetId, readingId } = parsed<{ tyreSetId: string; readingId: string }>(res, 'params');
    await deleteTreadReading(ds, currentUser(req), tyreSetId, readingId);
    res.status(204).end();
  });
  router.get('/:tyreSetId/readings', validate({ params: setParam }), async (req, res) => {
    res.json(list(await listTreadReadings(ds, currentUser(req), parsed<{ tyreSetId: string }>(res, 'params').tyreSetId)));
  });
  router.post('/:tyreSetId/mountings', validate({ params: setParam, body: createMountingInputSchema }), async (req, res) => {
    const { tyreSetId } = parsed<{ tyreSetId: string }>(res, 'params');
    const { mounting, created } = await addMounting(ds, currentUser(req), tyreSetId, parsed<CreateMountingInput>(res, 'body'));
    res.status(created ? 201 : 200).json(mounting);
  });
  return router;
}

import { Router } from 'express';
import type { DataSource } from 'typeorm';
import * as z from '@shared/zod';
import { createEventInputSchema, type CreateEventInput } from '@shared/season/event.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import { createEvent, eventSummary, getEvent, listEvents } from './event.service';

export function eventRoutes(ds: DataSource) {
  const router = Router();
  router.use(requireAuth);

  router.post('/', validate({ body: createEventInputSchema }), async (req, res) => {
    const { event, created } = await createEvent(ds, currentUser(req), parsed<CreateEventInput>(res, 'body'));
    res.status(created ? 201 : 200).json(event);
  });
  router.get('/', async (req, res) => {
    res.json(list(await listEvents(ds, currentUser(req))));
  });
  router.get('/:eventId', validate({ params: idParam('eventId') }), async (req, res) => {
    res.json(await getEvent(ds, currentUser(req), parsed<{ eventId: string }>(res, 'params').eventId));
  });
  router.get(
    '/:eventId/summary',
    validate({ params: idParam('eventId'), query: z.strictObject({ carId: z.optional(z.uuid()) }) }),
    async (req, res) => {
      const { eventId } = parsed<{ eventId: string }>(res, 'params');
      const { carId } = parsed<{ carId?: string }>(res, 'query');
      res.json(await eventSummary(ds, currentUser(req), eventId, carId));
    },
  );
  return router;
}

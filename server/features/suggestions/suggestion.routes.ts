import { Router } from 'express';
import type { DataSource } from 'typeorm';
import {
  acceptSuggestionInputSchema, createSuggestionInputSchema, declineSuggestionInputSchema,
  type AcceptSuggestionInput, type CreateSuggestionInput, type DeclineSuggestionInput,
} from '@shared/collab/suggestion.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import type { MailSettings } from '../../mail/mailer';
import { acceptSuggestion, createSuggestion, declineSuggestion, getSuggestion, listSuggestions, listWaitingSuggestions } from './suggestion.service';

/** Routes under /api/cars/:carId/suggestions. */
export function carSuggestionRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const carParam = idParam('carId');

  router.get('/', validate({ params: carParam }), async (req, res) => {
    res.json(list(await listSuggestions(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId)));
  });
  router.post('/', validate({ params: carParam, body: createSuggestionInputSchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    const { suggestion, created } = await createSuggestion(ds, mail, currentUser(req), carId, parsed<CreateSuggestionInput>(res, 'body'));
    res.status(created ? 201 : 200).json(suggestion);
  });
  return router;
}

/** Routes under /api/suggestions. */
export function suggestionRoutes(ds: DataSource, mail?: MailSettings) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const suggestionParam = idParam('suggestionId');

  // What waits for the caller's decision: open suggestions on the cars they drive.
  router.get('/waiting', async (req, res) => {
    res.json(list(await listWaitingSuggestions(ds, currentUser(req))));
  });
  router.get('/:suggestionId', validate({ params: suggestionParam }), async (req, res) => {
    res.json(await getSuggestion(ds, currentUser(req), parsed<{ suggestionId: string }>(res, 'params').suggestionId));
  });
  router.post('/:suggestionId/accept', validate({ params: suggestionParam, body: acceptSuggestionInputSchema }), async (req, res) => {
    const { suggestionId } = parsed<{ suggestionId: string }>(res, 'params');
    const { created, ...result } = await acceptSuggestion(ds, mail, currentUser(req), suggestionId, parsed<AcceptSuggestionInput>(res, 'body'));
    res.status(created ? 201 : 200).json(result);
  });
  router.post('/:suggestionId/decline', validate({ params: suggestionParam, body: declineSuggestionInputSchema }), async (req, res) => {
    const { suggestionId } = parsed<{ suggestionId: string }>(res, 'params');
    res.json(await declineSuggestion(ds, mail, currentUser(req), suggestionId, parsed<DeclineSuggestionInput>(res, 'body')));
  });
  return router;
}

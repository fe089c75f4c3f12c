import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { importResultsInputSchema, type ImportResultsInput } from '@shared/import/import.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam } from '../../lib/http';
import { importResults } from './import.service';

/** Mounted at /api/events/:eventId/imports. */
export function eventImportRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);

  /** 200 with what happened to each run: created, already there, or failed with a reason. */
  router.post('/', validate({ params: idParam('eventId'), body: importResultsInputSchema }), async (req, res) => {
    const { eventId } = parsed<{ eventId: string }>(res, 'params');
    res.json(await importResults(ds, currentUser(req), eventId, parsed<ImportResultsInput>(res, 'body')));
  });
  return router;
}

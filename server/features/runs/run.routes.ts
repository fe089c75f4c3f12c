import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { createRunInputSchema, listRunsQuerySchema, updateRunInputSchema, type CreateRunInput, type UpdateRunInput } from '@shared/season/run.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam, list } from '../../lib/http';
import { createRun, deleteRun, getRun, listRuns, updateRun } from './run.service';

export function runRoutes(ds: DataSource) {
  const router = Router();
  router.use(requireAuth);
  const runParam = validate({ params: idParam('runId') });

  /** 201 when created; 200 with the same body when this id was already saved with the same content. */
  router.post('/', validate({ body: createRunInputSchema }), async (req, res) => {
    const { run, created } = await createRun(ds, currentUser(req), parsed<CreateRunInput>(res, 'body'));
    res.status(created ? 201 : 200).json(run);
  });
  router.get('/', validate({ query: listRunsQuerySchema }), async (req, res) => {
    res.json(list(await listRuns(ds, currentUser(req), parsed<{ carId?: string; eventId?: string }>(res, 'query'))));
  });
  router.get('/:runId', runParam, async (req, res) => {
    res.json(await getRun(ds, currentUser(req), parsed<{ runId: string }>(res, 'params').runId));
  });
  router.patch('/:runId', validate({ params: idParam('runId'), body: updateRunInputSchema }), async (req, res) => {
    const { runId } = parsed<{ runId: string }>(res, 'params');
    res.json(await updateRun(ds, currentUser(req), runId, parsed<UpdateRunInput>(res, 'body')));
  });
  router.delete('/:runId', runParam, async (req, res) => {
    await deleteRun(ds, currentUser(req), parsed<{ runId: string }>(res, 'params').runId);
    res.status(204).end();
  });
  return router;
}

import { Router } from 'express';
import type { DataSource } from 'typeorm';
import {
  compareQuerySchema, scatterQuerySchema, seasonQuerySchema, type CompareQuery, type ScatterQuery,
} from '@shared/analysis/analysis.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam } from '../../lib/http';
import { compare, scatter, seasonSummary } from './analysis.service';

/** Routes under /api/cars/:carId: analysis of one car's season. */
export function analysisRoutes(ds: DataSource) {
  const router = Router({ mergeParams: true });
  router.use(requireAuth);
  const carParam = idParam('carId');

  router.get('/analysis/scatter', validate({ params: carParam, query: scatterQuerySchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    res.json(await scatter(ds, currentUser(req), carId, parsed<ScatterQuery>(res, 'query')));
  });
  router.get('/analysis/compare', validate({ params: carParam, query: compareQuerySchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    res.json(await compare(ds, currentUser(req), carId, parsed<CompareQuery>(res, 'query')));
  });
  router.get('/season', validate({ params: carParam, query: seasonQuerySchema }), async (req, res) => {
    const { carId } = parsed<{ carId: string }>(res, 'params');
    res.json(await seasonSummary(ds, currentUser(req), carId, parsed<{ minDepthMm: number }>(res, 'query').minDepthMm));
  });
  return router;
}

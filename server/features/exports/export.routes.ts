import express, { Router, type Request } from 'express';
import type { DataSource } from 'typeorm';
import { SEASON_FILE_MAX_BYTES } from '@shared/export/season-export.schema';
import { currentUser, requireAuth } from '../../auth/access';
import { parsed, validate } from '../../lib/validate';
import { idParam } from '../../lib/http';
import { exportSeason, importSeason, seasonFileName } from './export.service';
import { exportSeasonCsv } from './season-csv';

/** The path a season file is posted to. */
const SEASON_IMPORT_PATH = '/api/cars/import';

/**
 * A season file, which the app-wide JSON parser (limit 100 kB) leaves unread: it would read any body
 * that says application/json before sign-in and the CSRF token are checked. The route reads it after.
 */
export const isSeasonFile = (req: Request) => req.originalUrl.split('?')[0] === SEASON_IMPORT_PATH;

/** A season file may be up to 5 MB; every other API body keeps the app's small limit. */
const readSeasonFile = express.json({ limit: SEASON_FILE_MAX_BYTES });

/** The name is letters, digits and dashes only (seasonFileName), so it needs no escaping. */
const attachment = (fileName: string) => `attachment; filename="${fileName}"`;

/** Routes under /api/cars: a car's season as CSV or JSON, and a JSON file read back into a new car. */
export function exportRoutes(ds: DataSource) {
  const router = Router();
  const carParam = validate({ params: idParam('carId') });

  router.get('/:carId/export.csv', requireAuth, carParam, async (req, res) => {
    const { csv, fileName } = await exportSeasonCsv(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId);
    res.setHeader('Content-Disposition', attachment(fileName));
    res.type('text/csv; charset=utf-8');
    res.setHeader('Cache-Control', 'no-store');
    res.send(csv);
  });

  router.get('/:carId/export.json', requireAuth, carParam, async (req, res) => {
    const file = await exportSeason(ds, currentUser(req), parsed<{ carId: string }>(res, 'params').carId);
    res.setHeader('Content-Disposition', attachment(`${seasonFileName(file.car.name, file.events.map((e) => e.date))}.json`));
    res.setHeader('Cache-Control', 'no-store');
    res.type('application/json; charset=utf-8').send(JSON.stringify(file, null, 2));
  });

  router.post('/import', requireAuth, readSeasonFile, async (req, res) => {
    res.status(201).json(await importSeason(ds, currentUser(req), req.body));
  });

  return router;
}

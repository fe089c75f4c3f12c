import { Router } from 'express';
import type { DataSource } from 'typeorm';

/** Liveness with a real round trip to PostgreSQL. Mounted before sessions, so it never touches the store. */
export function healthRoutes(ds: DataSource) {
  const router = Router();
  router.get('/', async (_req, res) => {
    try {
      if (!ds.isInitialized) throw new Error('not initialised');
      await ds.query('SELECT 1');
      res.json({ ok: true, db: 'up' });
    } catch {
      res.status(503).json({ ok: false, db: 'down' });
    }
  });
  return router;
}

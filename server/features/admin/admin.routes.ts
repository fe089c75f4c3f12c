import { Router } from 'express';
import type { DataSource } from 'typeorm';
import { requireRole } from '../../auth/access';
import { listUsers } from '../users/user.service';

/** Administration: for now the list of accounts with their roles. */
export function adminRoutes(ds: DataSource) {
  const router = Router();
  router.use(requireRole('admin'));
  router.get('/users', async (_req, res) => {
    const items = await listUsers(ds);
    res.json({ items, count: items.length });
  });
  return router;
}

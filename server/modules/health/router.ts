import { Router } from 'express';
import { sequelize } from '../../db/sequelize';
import { unavailable } from '../../errors';
import { open } from '../../auth/authorize';

/** Public: one database round trip. 503 while the database cannot answer. */
export function healthRouter(): Router {
  const router = Router();
  router.get('/', open, async (_req, res) => {
    try {
      await sequelize().query('SELECT 1', { plain: true, raw: true });
    } catch {
      throw unavailable();
    }
    res.json({ status: 'ok', database: 'ok' });
  });
  return router;
}

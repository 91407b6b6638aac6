import { Router } from 'express';
import { unavailable } from '../../errors';
import { open } from '../../auth/authorize';
import { databaseAnswers } from './service';

/** Public: one database round trip. 503 while the database cannot answer. */
export function healthRouter(): Router {
  const router = Router();
  router.get('/', open, async (_req, res) => {
    if (!(await databaseAnswers())) throw unavailable();
    res.json({ status: 'ok', database: 'ok' });
  });
  return router;
}

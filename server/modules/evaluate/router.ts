import { Router } from 'express';
import { authorize } from '../../auth/authorize';
import { can } from '../../../shared/schemas/auth';
import { evaluateRequestSchema, pressureQuerySchema } from '../../../shared/schemas/evaluate';
import { parse } from '../../middleware/validate';
import { evaluateLoadCase, pressureAt } from './service';

export function evaluateRouter(): Router {
  const router = Router();
  router.post('/', authorize('evaluate'), async (req, res) => {
    const request = parse(evaluateRequestSchema, req.body, 'evaluation request');
    res.json(await evaluateLoadCase(request, { canDraft: can(req.user?.role, 'catalogue:draft') }));
  });
  return router;
}

export function pressureRouter(): Router {
  const router = Router();
  router.get('/', authorize('catalogue:read'), (req, res) => {
    const query = parse(pressureQuerySchema, req.query, 'query');
    const { pressure, method } = pressureAt(query);
    res.json({ pressure, method });
  });
  return router;
}

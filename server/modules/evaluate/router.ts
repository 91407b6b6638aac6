import { Router } from 'express';
import rateLimit from 'express-rate-limit';
import { env, workerCount } from '../../config/env';
import { AppError } from '../../errors';
import { authorize } from '../../auth/authorize';
import { can } from '../../../shared/schemas/auth';
import { evaluateRequestSchema, pressureQuerySchema } from '../../../shared/schemas/evaluate';
import { parse } from '../../middleware/validate';
import { evaluateLoadCase, pressureAt } from './service';
import { catalogueGeneration } from '../property-sets/snapshot';
import { cachedJson, jsonResponseCache, sendCached } from '../../services/response-cache';
import { packEvaluation } from '../../../shared/engine/lean';

export function evaluateRouter(): Router {
  const router = Router();
  // Engineers re-run the same load case often (reloads, ranking switches, shared links): the
  // serialized answer is kept per request until the catalogue changes, from the second time it is
  // asked for (most new load cases are asked once).
  const cache = jsonResponseCache(128 * 2 ** 20, { keepOnSecondRequest: true });
  // Per account, so one caller's loop cannot slow everyone else; kept in the worker (a shared
  // store would cost a database write per evaluation), each worker allowing its share.
  const config = env();
  const limiter = rateLimit({
    windowMs: 60_000,
    limit: Math.max(1, Math.ceil(config.EVALUATE_RATE_LIMIT / workerCount())),
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => `user:${req.user!.id}`,
    handler: (_req, _res, next) => next(new AppError(429, 'too_many_requests', 'Too many evaluations in a minute from this account. Wait a moment and evaluate again.')),
  });
  router.post('/', authorize('evaluate'), limiter, async (req, res) => {
    const request = parse(evaluateRequestSchema, req.body, 'evaluation request');
    const caller = { canDraft: can(req.user?.role, 'catalogue:draft') };
    // Drafts named by id resolve only for librarians, so they get their own entries.
    const key = `${catalogueGeneration()}|${caller.canDraft ? 'd' : 'p'}|${JSON.stringify(request)}`;
    await sendCached(
      req,
      res,
      await cachedJson(cache, key, async () => {
        const answer = await evaluateLoadCase(request, caller);
        if (request.form === 'full') return answer;
        const { excluded, ...result } = answer;
        return { ...packEvaluation(result), excluded };
      }),
    );
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

import { Router, type Express } from 'express';
import { open } from '../auth/authorize';
import { buildOpenApiDocument } from './document';

/** GET /api/openapi.json — public, built once from the mounted routes. */
export function openApiRouter(app: Express): Router {
  const router = Router();
  let cached: string | undefined;
  router.get('/', open, (_req, res) => {
    cached ??= JSON.stringify(buildOpenApiDocument(app));
    res.type('application/json').send(cached);
  });
  return router;
}

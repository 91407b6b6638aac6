import { Router } from 'express';
import { z } from 'zod';
import { authorize } from '../../auth/authorize';
import { bodyOf, draftViewerOf } from '../../auth/actor';
import { propertySetQuerySchema } from '../../../shared/schemas/catalogue';
import { materialCreateSchema } from '../../../shared/schemas/library';
import { parse, parseId } from '../../middleware/validate';
import { createMaterial, getMaterial, getPropertySet, listMaterials, listPropertySets } from './service';
import { catalogueGeneration, filterPublished } from './snapshot';
import { cachedJson, jsonResponseCache, sendCached } from '../../services/response-cache';

const pageSchema = z.object({
  limit: z.coerce.number().int().min(1).max(5000).default(1000),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
});

const listCache = jsonResponseCache(64 * 2 ** 20);

export function propertySetsRouter(): Router {
  const router = Router();
  router.get('/', authorize('catalogue:read'), async (req, res) => {
    const { limit, offset, ...rest } = req.query as Record<string, unknown>;
    const page = parse(pageSchema, { limit, offset }, 'query');
    const query = parse(propertySetQuerySchema, rest, 'query');
    if ((query.status ?? 'published') !== 'published') {
      res.json(await listPropertySets({ ...query, ...page }, draftViewerOf(req)));
      return;
    }
    // The published catalogue comes from the in-memory snapshot; the serialized answer is kept
    // per query until the catalogue changes.
    const key = `${catalogueGeneration()}|${JSON.stringify([query, page])}`;
    const body = await cachedJson(listCache, key, async () => {
      const all = await filterPublished(query);
      return { items: all.slice(page.offset, page.offset + page.limit), total: all.length };
    });
    await sendCached(req, res, body);
  });
  router.get('/:id', authorize('catalogue:read'), async (req, res) => {
    res.json(await getPropertySet(parseId(req.params.id), draftViewerOf(req)));
  });
  return router;
}

const noQuery = z.strictObject({});

export function materialsRouter(): Router {
  const router = Router();
  router.get('/', authorize('catalogue:read'), async (req, res) => {
    parse(noQuery, req.query, 'query');
    res.json(await listMaterials());
  });
  router.post('/', authorize('catalogue:draft'), async (req, res) => {
    const input = parse(materialCreateSchema, bodyOf(req), 'material');
    res.status(201).json(await createMaterial(input, req.user!.id));
  });
  router.get('/:id', authorize('catalogue:read'), async (req, res) => {
    res.json(await getMaterial(parseId(req.params.id), draftViewerOf(req)));
  });
  return router;
}

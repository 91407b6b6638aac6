import { Router } from 'express';

import { authorize } from '../../auth/authorize';
import { actorOf, bodyOf, draftViewerOf } from '../../auth/actor';
import { parse, parseId } from '../../middleware/validate';
import { singleFile } from '../../middleware/upload';
import {
  ratingTableCsvQuerySchema,
  ratingTableDraftSchema,
  ratingTableQuerySchema,
  ratingTableStepSchema,
  ratingTableUpdateSchema,
} from '../../../shared/schemas/rating-tables';
import { createRatingTableDraft, getRatingTable, listRatingTables, stepRatingTable, updateRatingTableDraft } from './service';
import { parseRatingTableCsv, RATING_CSV_MAX_BYTES, ratingTableTemplate } from './csv';

const actor = actorOf;

/** Rating tables: read by everyone signed in (published), drafted and reviewed on the library desk. */
export function ratingTablesRouter(): Router {
  const router = Router();
  router.get('/', authorize('catalogue:read'), async (req, res) => {
    res.json(await listRatingTables(parse(ratingTableQuerySchema, req.query, 'query'), draftViewerOf(req)));
  });
  router.get('/csv-template', authorize('catalogue:draft'), (req, res) => {
    const { form } = parse(ratingTableCsvQuerySchema, req.query, 'query');
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', `attachment; filename="isobath-rating-table-${form}.csv"`);
    res.send(ratingTableTemplate(form));
  });
  router.post('/csv', authorize('catalogue:draft'), singleFile('file', RATING_CSV_MAX_BYTES), (req, res) => {
    const { form } = parse(ratingTableCsvQuerySchema, req.query, 'query');
    res.json(parseRatingTableCsv(req.file!, form));
  });
  router.get('/:id', authorize('catalogue:read'), async (req, res) => {
    res.json(await getRatingTable(parseId(req.params.id), draftViewerOf(req)));
  });
  router.post('/', authorize('catalogue:draft'), async (req, res) => {
    res.status(201).json(await createRatingTableDraft(parse(ratingTableDraftSchema, bodyOf(req), 'draft'), actor(req)));
  });
  router.put('/:id', authorize('catalogue:draft'), async (req, res) => {
    const id = parseId(req.params.id);
    const { lockVersion, draft } = parse(ratingTableUpdateSchema, bodyOf(req), 'draft');
    res.json(await updateRatingTableDraft(id, lockVersion, draft, actor(req)));
  });
  // One route for every review step; the workflow table says which role and person may take each.
  router.post('/:id/steps', authorize('catalogue:draft'), async (req, res) => {
    const id = parseId(req.params.id);
    const input = parse(ratingTableStepSchema, bodyOf(req), 'step');
    res.status(input.step === 'revise' ? 201 : 200).json(await stepRatingTable(id, input, actor(req)));
  });
  return router;
}


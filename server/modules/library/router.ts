import { Router } from 'express';
import { z } from 'zod';
import { authorize } from '../../auth/authorize';
import { actorOf } from '../../auth/actor';
import { parse, parseId } from '../../middleware/validate';
import { singleFile } from '../../middleware/upload';
import {
  draftInputSchema,
  draftUpdateSchema,
  IMPORT_MAX_BYTES,
  libraryQueueQuerySchema,
  referenceVersionQuerySchema,
  retireSchema,
  returnSchema,
  transitionSchema,
} from '../../../shared/schemas/library';
import { createDraft, getChanges, getLibrarySet, listQueue, stepSet, updateDraft } from './service';
import { previewImport, runImport, templateCsv } from './import';
import { listConfirmations, proposeConfirmation, stepConfirmation } from './confirmations';
import { listProposedVersions } from '../references/versions';
import { confirmationProposalSchema, confirmationQuerySchema, confirmationStepSchema } from '../../../shared/schemas/provenance';

const actor = actorOf;
const body = (req: Express.Request & { body?: unknown }) => req.body ?? {};
const noQuery = z.strictObject({});

/** The library desk: /api/library/sets… and /api/library/import… */
export function libraryRouter(): Router {
  const router = Router();

  router.get('/sets', authorize('catalogue:draft'), async (req, res) => {
    res.json(await listQueue(parse(libraryQueueQuerySchema, req.query, 'query'), actor(req)));
  });
  router.get('/sets/:id', authorize('catalogue:draft'), async (req, res) => {
    res.json(await getLibrarySet(parseId(req.params.id)));
  });
  router.get('/sets/:id/changes', authorize('catalogue:draft'), async (req, res) => {
    res.json(await getChanges(parseId(req.params.id)));
  });
  router.post('/sets', authorize('catalogue:draft'), async (req, res) => {
    res.status(201).json(await createDraft(parse(draftInputSchema, body(req), 'draft'), actor(req)));
  });
  router.put('/sets/:id', authorize('catalogue:draft'), async (req, res) => {
    const id = parseId(req.params.id);
    const { lockVersion, draft } = parse(draftUpdateSchema, body(req), 'draft');
    res.json(await updateDraft(id, lockVersion, draft, actor(req)));
  });
  // The review steps, one route each, all run by the shared workflow table.
  const steps = [
    { step: 'submit', permission: 'catalogue:draft', schema: transitionSchema, status: 200 },
    { step: 'approve', permission: 'catalogue:approve', schema: transitionSchema, status: 200 },
    { step: 'return', permission: 'catalogue:approve', schema: returnSchema, status: 200 },
    { step: 'revise', permission: 'catalogue:draft', schema: transitionSchema, status: 201 },
    { step: 'retire', permission: 'catalogue:approve', schema: retireSchema, status: 200 },
  ] as const;
  for (const { step, permission, schema, status } of steps) {
    router.post(`/sets/:id/${step}`, authorize(permission), async (req, res) => {
      const id = parseId(req.params.id);
      const input = parse(schema, body(req)) as { lockVersion: number; comment?: string; reason?: string };
      res.status(status).json(await stepSet(id, step, { lockVersion: input.lockVersion, comment: input.comment ?? input.reason }, actor(req)));
    });
  }
  // Confirming a published set's values, one reviewed step per value.
  router.get('/confirmations', authorize('catalogue:draft'), async (req, res) => {
    res.json({ items: await listConfirmations(parse(confirmationQuerySchema, req.query, 'query')) });
  });
  router.post('/sets/:id/confirmations', authorize('catalogue:draft'), async (req, res) => {
    res.status(201).json(await proposeConfirmation(parseId(req.params.id), parse(confirmationProposalSchema, body(req), 'confirmation'), actor(req)));
  });
  router.post('/confirmations/:id/steps', authorize('catalogue:approve'), async (req, res) => {
    res.json(await stepConfirmation(parseId(req.params.id), parse(confirmationStepSchema, body(req), 'step'), actor(req)));
  });
  // Proposed changes to references in use, for the desk's review queue.
  router.get('/reference-versions', authorize('catalogue:draft'), async (req, res) => {
    res.json({ items: await listProposedVersions(parse(referenceVersionQuerySchema, req.query, 'query')) });
  });
  router.get('/import/template.csv', authorize('catalogue:draft'), (req, res) => {
    parse(noQuery, req.query, 'query');
    res.setHeader('Content-Type', 'text/csv; charset=utf-8');
    res.setHeader('Content-Disposition', 'attachment; filename="isobath-property-sets-template.csv"');
    res.send(templateCsv());
  });
  router.post('/import/preview', authorize('catalogue:draft'), singleFile('file', IMPORT_MAX_BYTES), async (req, res) => {
    res.json(await previewImport(req.file!));
  });
  router.post('/import', authorize('catalogue:draft'), singleFile('file', IMPORT_MAX_BYTES), async (req, res) => {
    res.status(201).json(await runImport(req.file!, actor(req)));
  });

  return router;
}

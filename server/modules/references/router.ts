import { Router, type RequestHandler } from 'express';
import { pipeline } from 'node:stream/promises';
import { authorize } from '../../auth/authorize';
import { parse, parseId } from '../../middleware/validate';
import { singleFile } from '../../middleware/upload';
import {
  DOCUMENT_MAX_BYTES,
  referenceCreateSchema,
  referenceQuerySchema,
  referenceUpdateSchema,
} from '../../../shared/schemas/library';
import { createReference, getReference, listReferences, openDocument, updateReference, uploadDocument } from './service';

const actor = (req: Express.Request) => ({ id: req.user!.id });

/** /api/references: the sources cited by property sets, and their documents. */
export function referencesRouter(): Router {
  const router = Router();

  router.get('/', authorize('catalogue:read'), async (req, res) => {
    res.json(await listReferences(parse(referenceQuerySchema, req.query, 'query')));
  });
  router.get('/:id', authorize('catalogue:read'), async (req, res) => {
    res.json(await getReference(parseId(req.params.id)));
  });
  router.post('/', authorize('catalogue:draft'), async (req, res) => {
    res.status(201).json(await createReference(parse(referenceCreateSchema, req.body ?? {}, 'reference'), actor(req)));
  });
  router.put('/:id', authorize('catalogue:draft'), async (req, res) => {
    const id = parseId(req.params.id);
    const { lockVersion, reference } = parse(referenceUpdateSchema, req.body ?? {}, 'reference');
    res.json(await updateReference(id, lockVersion, reference, actor(req)));
  });

  // The id is checked before the body is read, so a bad address does not cost an upload.
  const validId: RequestHandler = (req, _res, next) => {
    parseId(req.params.id);
    next();
  };
  router.post('/:id/document', authorize('catalogue:draft'), validId, singleFile('file', DOCUMENT_MAX_BYTES), async (req, res) => {
    res.json(await uploadDocument(parseId(req.params.id), req.file!, actor(req)));
  });
  router.get('/:id/document', authorize('catalogue:read'), async (req, res) => {
    const doc = await openDocument(parseId(req.params.id));
    res.status(200);
    res.setHeader('Content-Type', 'application/pdf');
    // The stored name is already reduced to [A-Za-z0-9._-] (safeStoredName), so it needs no quoting rules.
    res.setHeader('Content-Disposition', `attachment; filename="${doc.name}"`);
    res.setHeader('Cache-Control', 'private, no-store');
    if (doc.size !== undefined) res.setHeader('Content-Length', String(doc.size));
    try {
      await pipeline(doc.stream, res);
    } catch (err) {
      // The caller went away or the store broke off mid-stream: headers are out, so just end.
      doc.stream.destroy();
      if (!res.headersSent) throw err;
      res.destroy();
    }
  });

  return router;
}

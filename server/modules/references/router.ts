import { Router, type RequestHandler, type Response } from 'express';
import { z } from 'zod';
import { pipeline } from 'node:stream/promises';
import { authorize } from '../../auth/authorize';
import { actorOf, bodyOf, draftViewerOf } from '../../auth/actor';
import { parse, parseId } from '../../middleware/validate';
import { singleFile } from '../../middleware/upload';
import {
  DOCUMENT_MAX_BYTES,
  referenceCreateSchema,
  referenceQuerySchema,
  referenceUpdateSchema,
  referenceVersionStepSchema,
} from '../../../shared/schemas/library';
import { createReference, getReference, listDocuments, listReferences, openDocument, updateReference, uploadDocument, type DocumentDownload } from './service';
import { stepReferenceVersion, updateProposedVersion } from './versions';

const actor = actorOf;
const noQuery = z.strictObject({});

/** Streams a document as a PDF attachment. */
async function sendDocument(res: Response, doc: DocumentDownload): Promise<void> {
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
}

/**
 * /api/references: the sources cited by property sets and rating tables, their versions and
 * documents. Readers see references in use (cited by something published); librarians and
 * administrators also those cited by drafts only.
 */
export function referencesRouter(): Router {
  const router = Router();

  router.get('/', authorize('catalogue:read'), async (req, res) => {
    res.json(await listReferences(parse(referenceQuerySchema, req.query, 'query'), draftViewerOf(req)));
  });
  router.get('/:id', authorize('catalogue:read'), async (req, res) => {
    res.json(await getReference(parseId(req.params.id), draftViewerOf(req)));
  });
  router.post('/', authorize('catalogue:draft'), async (req, res) => {
    res.status(201).json(await createReference(parse(referenceCreateSchema, bodyOf(req), 'reference'), actor(req)));
  });
  // In use: 202, the change is a proposed version waiting for review; otherwise 200, saved.
  router.put('/:id', authorize('catalogue:draft'), async (req, res) => {
    const id = parseId(req.params.id);
    const { lockVersion, reference } = parse(referenceUpdateSchema, bodyOf(req), 'reference');
    const result = await updateReference(id, lockVersion, reference, actor(req));
    res.status(result.proposed ? 202 : 200).json(result.reference);
  });
  router.put('/:id/versions/:version', authorize('catalogue:draft'), async (req, res) => {
    const id = parseId(req.params.id);
    const version = parseId(req.params.version, 'version');
    const { lockVersion, reference } = parse(referenceUpdateSchema, bodyOf(req), 'reference');
    await updateProposedVersion(id, version, lockVersion, reference, actor(req));
    res.json(await getReference(id, draftViewerOf(req)));
  });
  // One route for the review steps; the workflow table says which role and person may take each.
  router.post('/:id/versions/:version/steps', authorize('catalogue:draft'), async (req, res) => {
    const id = parseId(req.params.id);
    const version = parseId(req.params.version, 'version');
    await stepReferenceVersion(id, version, parse(referenceVersionStepSchema, bodyOf(req), 'step'), actor(req));
    res.json(await getReference(id, draftViewerOf(req)));
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
    await sendDocument(res, await openDocument(parseId(req.params.id), undefined, draftViewerOf(req)));
  });
  router.get('/:id/documents', authorize('catalogue:read'), async (req, res) => {
    parse(noQuery, req.query, 'query');
    res.json(await listDocuments(parseId(req.params.id), draftViewerOf(req)));
  });
  router.get('/:id/documents/:version', authorize('catalogue:read'), async (req, res) => {
    const id = parseId(req.params.id);
    await sendDocument(res, await openDocument(id, parseId(req.params.version, 'version'), draftViewerOf(req)));
  });

  return router;
}

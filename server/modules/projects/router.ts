import { Router, type Request } from 'express';
import { authorize } from '../../auth/authorize';
import { actorOf } from '../../auth/actor';
import { parse, parseId } from '../../middleware/validate';
import {
  loadCaseSaveSchema,
  loadCaseUpdateSchema,
  memberAddSchema,
  projectCreateSchema,
  projectUpdateSchema,
  shortlistCreateSchema,
  shortlistItemAddSchema,
  shortlistItemUpdateSchema,
  shortlistReorderSchema,
  shortlistReturnSchema,
  shortlistTransitionSchema,
} from '../../../shared/schemas/projects';
import * as projects from './service';
import * as shortlists from './shortlists';
import { getDesignRecord, listDesignRecords } from './design-records';
import { stepShortlist } from './shortlist-steps';
import { renderDesignRecordPdf } from './record-pdf';

const actor = actorOf;
const idParam = (req: Request, name = 'id') => parseId(req.params[name], name);

export function projectsRouter(): Router {
  const r = Router();
  r.get('/', authorize('project:read'), async (req, res) => res.json({ items: await projects.listProjects(actor(req)) }));
  r.post('/', authorize('project:write'), async (req, res) => res.status(201).json(await projects.createProject(actor(req), parse(projectCreateSchema, req.body, 'project'))));
  r.get('/:id', authorize('project:read'), async (req, res) => res.json(await projects.getProject(actor(req), idParam(req))));
  r.patch('/:id', authorize('project:write'), async (req, res) => res.json(await projects.updateProject(actor(req), idParam(req), parse(projectUpdateSchema, req.body, 'project'))));
  r.post('/:id/members', authorize('project:write'), async (req, res) => res.json(await projects.addMember(actor(req), idParam(req), parse(memberAddSchema, req.body, 'member').userId)));
  r.delete('/:id/members/:userId', authorize('project:write'), async (req, res) => res.json(await projects.removeMember(actor(req), idParam(req), idParam(req, 'userId'))));
  r.get('/:id/load-cases', authorize('project:read'), async (req, res) => res.json({ items: await projects.listLoadCases(actor(req), idParam(req)) }));
  r.post('/:id/load-cases', authorize('project:write'), async (req, res) => res.status(201).json(await projects.createLoadCase(actor(req), idParam(req), parse(loadCaseSaveSchema, req.body, 'load case'))));
  r.get('/:id/shortlists', authorize('project:read'), async (req, res) => res.json({ items: await shortlists.listShortlists(actor(req), idParam(req)) }));
  r.post('/:id/shortlists', authorize('project:write'), async (req, res) => res.status(201).json(await shortlists.createShortlist(actor(req), idParam(req), parse(shortlistCreateSchema, req.body, 'shortlist'))));
  r.get('/:id/records', authorize('project:read'), async (req, res) => res.json({ items: await listDesignRecords(actor(req), idParam(req)) }));
  return r;
}

export function peopleRouter(): Router {
  const r = Router();
  r.get('/', authorize('project:write'), async (_req, res) => res.json({ items: await projects.directory() }));
  return r;
}

export function loadCasesRouter(): Router {
  const r = Router();
  r.get('/:id', authorize('project:read'), async (req, res) => res.json(await projects.getLoadCase(actor(req), idParam(req))));
  r.put('/:id', authorize('project:write'), async (req, res) => res.json(await projects.updateLoadCase(actor(req), idParam(req), parse(loadCaseUpdateSchema, req.body, 'load case'))));
  return r;
}

export function shortlistsRouter(): Router {
  const r = Router();
  r.get('/awaiting-check', authorize('shortlist:check'), async (req, res) => res.json({ items: await shortlists.awaitingCheck(actor(req)) }));
  r.get('/:id', authorize('project:read'), async (req, res) => res.json(await shortlists.getShortlist(actor(req), idParam(req))));
  r.post('/:id/items', authorize('project:write'), async (req, res) => res.status(201).json(await shortlists.addItem(actor(req), idParam(req), parse(shortlistItemAddSchema, req.body, 'item'))));
  r.patch('/:id/items/:itemId', authorize('project:write'), async (req, res) =>
    res.json(await shortlists.updateItem(actor(req), idParam(req), idParam(req, 'itemId'), parse(shortlistItemUpdateSchema, req.body, 'item'))),
  );
  r.delete('/:id/items/:itemId', authorize('project:write'), async (req, res) => res.json(await shortlists.removeItem(actor(req), idParam(req), idParam(req, 'itemId'))));
  r.post('/:id/reorder', authorize('project:write'), async (req, res) => res.json(await shortlists.reorderItems(actor(req), idParam(req), parse(shortlistReorderSchema, req.body, 'order'))));
  r.post('/:id/submit', authorize('project:write'), async (req, res) =>
    res.json(await stepShortlist(actor(req), idParam(req), 'submit', { lockVersion: parse(shortlistTransitionSchema, req.body, 'request').lockVersion })),
  );
  r.post('/:id/check', authorize('shortlist:check'), async (req, res) => res.json(await stepShortlist(actor(req), idParam(req), 'check', parse(shortlistTransitionSchema, req.body, 'request'))));
  r.post('/:id/return', authorize('shortlist:check'), async (req, res) => res.json(await stepShortlist(actor(req), idParam(req), 'return', parse(shortlistReturnSchema, req.body, 'request'))));
  return r;
}

export function recordsRouter(): Router {
  const r = Router();
  r.get('/:id', authorize('project:read'), async (req, res) => res.json(await getDesignRecord(actor(req), idParam(req))));
  r.get('/:id/pdf', authorize('design-record:export'), async (req, res) => {
    const record = await getDesignRecord(actor(req), idParam(req));
    const pdf = await renderDesignRecordPdf(record.id, record.content);
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="isobath-design-record-${record.id}.pdf"`);
    res.setHeader('Cache-Control', 'private, no-store');
    res.send(pdf);
  });
  return r;
}

/**
 * Every API operation, called anonymously and as each role, with the exact expected outcome from
 * one declarative table. The table must name every operation of the OpenAPI document: a new route
 * without an entry here fails this test.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createHash, randomBytes } from 'node:crypto';
import { startTestApp } from '../helpers/app';
import { createAccount, draftBody, EXTRA_PASSWORD } from '../helpers/library';
import { ROLES, can, type Permission, type Role } from '../../shared/schemas/auth';
import { PropertySet, RatingTable, User } from '../../server/db/models';
import { createRatingTableDraft } from '../../server/modules/rating-tables/service';
import { ratingTableDraftSchema } from '../../shared/schemas/rating-tables';
import { Invitation, PasswordReset, Project } from '../../server/db/models/projects';
import { draftInputSchema } from '../../shared/schemas/library';
import { createDraft, stepSet } from '../../server/modules/library/service';
import { proposeConfirmation } from '../../server/modules/library/confirmations';
import { createReference, updateReference } from '../../server/modules/references/service';
import { stepReferenceVersion } from '../../server/modules/references/versions';
import { createLoadCase, createProject, addMember } from '../../server/modules/projects/service';
import { addItem, createShortlist } from '../../server/modules/projects/shortlists';
import { submitShortlist, checkShortlist } from '../../server/modules/projects/shortlist-steps';
import { requestPasswordReset } from '../../server/modules/users/service';
import { listCaughtMail } from '../../server/services/mail';
import { sendQueued } from '../../server/services/outbox';
import { sequelize } from '../../server/db/sequelize';
import type { LoadCase } from '../../shared/schemas/evaluate';

type Caller = 'anonymous' | Role;
const CALLERS: Caller[] = ['anonymous', ...ROLES];
type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

interface Req {
  method: Method;
  path: string;
  body?: unknown;
  /** Use this session instead of the caller's standing one (for calls that end or change it). */
  cookie?: string | null;
  attach?: { field: string; data: Buffer; filename: string; contentType: string };
}

interface Entry {
  /** Builds a request that would succeed for a caller who is allowed. */
  build: (caller: Caller) => Promise<Omit<Req, 'method' | 'path'> & { path: string }>;
  /** Status for allowed callers (default 200). */
  ok?: number;
  /** Exceptions, e.g. 404 for a librarian who is not a member of the project. */
  except?: Partial<Record<Caller, number>>;
}

let handle: Awaited<ReturnType<typeof startTestApp>>;
const cookies = {} as Record<Role, string>;
const actors = {} as Record<Role, { id: number; role: Role; name: string }>;
let seq = 0;
const unique = (prefix: string) => `${prefix}-${++seq}-${randomBytes(3).toString('hex')}`;

async function cookieFor(email: string, password: string): Promise<string> {
  const res = await request(handle.app).post('/api/auth/login').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email}: ${res.status}`);
  return String(res.headers['set-cookie']).split(';')[0];
}
/** A throwaway account of a role with its own session, for calls that change or end it. */
async function freshSession(role: Role): Promise<{ id: number; cookie: string }> {
  const email = `${unique('matrix')}@harrow.example`;
  const user = await createAccount(email, `Matrix ${role}`, role);
  return { id: user.id, cookie: await cookieFor(email, EXTRA_PASSWORD) };
}

// Fixtures in the Harrow Sound scenario.
const f = {} as {
  setId: number;
  materialId: number;
  referenceId: number;
  referenceWithDocId: number;
  draftId: number;
  projectId: number;
  loadCaseId: number;
  shortlistId: number;
  recordId: number;
  mailId: string;
  secondLibrarian: { id: number; name: string };
};
const PDF = Buffer.from('%PDF-1.4\n1 0 obj<</Type/Catalog/Pages 2 0 R>>endobj\n2 0 obj<</Type/Pages/Kids[]/Count 0>>endobj\ntrailer<</Root 1 0 R>>\n%%EOF\n');
const LOAD_CASE: LoadCase = {
  pressure: { value: 0.5e6 },
  temperature: { min: 15, max: 40 },
  sustainedHours: 100,
  cycles: 100,
  proofFactor: 1.25,
  component: { type: 'flat-disc', diameter: 0.25, thickness: 0.04, edge: 'clamped' },
};
const CSV_ROW =
  'material,family,transparent,condition,reference_title,reference_kind,basis,density_kg_m3,youngs_modulus_gpa,poissons_ratio,tensile_strength_mpa,compressive_strength_mpa,shear_strength_mpa,service_temp_min_c,service_temp_max_c\n';
const csvFile = () =>
  Buffer.from(`${CSV_ROW}Cast acrylic (PMMA),acrylic,yes,${unique('Harrow lot')},Harrow Sound lot tests,test-report,minimum,1190,3.1,0.37,70,110,60,0,60\n`);

const draftData = () => draftInputSchema.parse({ ...draftBody(f.materialId), condition: unique('Harrow lot draft'), reference: undefined, referenceId: f.referenceId });
async function draftBySecondLibrarian() {
  return createDraft(draftData(), { ...f.secondLibrarian, role: 'librarian' });
}
async function inReviewBySecondLibrarian() {
  const d = await draftBySecondLibrarian();
  return stepSet(d.id, 'submit', { lockVersion: d.lockVersion }, { ...f.secondLibrarian, role: 'librarian' });
}
async function freshPublishedSet(): Promise<{ id: number; lockVersion: number }> {
  const source = (await PropertySet.findByPk(f.setId))!.get({ plain: true });
  const row = await PropertySet.create({ ...source, id: undefined, condition: unique('Harrow bench variant'), lineageId: null, supersedesId: null, supersededById: null, lockVersion: 0 } as never);
  await row.update({ lineageId: row.id });
  await row.reload();
  return { id: row.id, lockVersion: row.lockVersion };
}
/** A reference in use (cited by a set the demo librarian approved) with a change proposed by the second librarian: version 2, in `state`. */
async function proposedChange(state: 'draft' | 'in-review') {
  const lib2 = { ...f.secondLibrarian, role: 'librarian' as const };
  const citation = { kind: 'test-report' as const, title: unique('Harrow Sound matrix report') };
  const ref = await createReference(citation, lib2);
  const draft = await createDraft(draftInputSchema.parse({ ...draftBody(f.materialId), condition: unique('Harrow lot cited'), reference: undefined, referenceId: ref.id }), lib2);
  const inReview = await stepSet(draft.id, 'submit', { lockVersion: draft.lockVersion }, lib2);
  await stepSet(draft.id, 'approve', { lockVersion: inReview.lockVersion }, actors.librarian);
  const { reference } = await updateReference(ref.id, ref.lockVersion, { ...citation, location: 'Table 2' }, lib2);
  let lockVersion = reference.pending!.lockVersion;
  if (state === 'in-review') {
    await stepReferenceVersion(ref.id, 2, { step: 'submit', lockVersion }, lib2);
    lockVersion += 1;
  }
  return { id: ref.id, citation, lockVersion };
}
const projectActor = (caller: Caller) => (caller === 'anonymous' || !can(caller, 'project:write') ? actors.engineer : actors[caller]);
async function shortlistOf(caller: Caller, items = 1) {
  const author = projectActor(caller);
  const sl = await createShortlist(author, f.projectId, { loadCaseId: f.loadCaseId, name: unique('Port shortlist') });
  let last = sl;
  const sets = (await PropertySet.findAll({ where: { status: 'published' }, limit: items, order: [['id', 'ASC']] })).map((s) => s.id);
  for (const id of sets) last = await addItem(author, sl.id, { propertySetId: id, note: '' });
  return last;
}
async function submittedByEngineer() {
  const sl = await shortlistOf('engineer');
  return submitShortlist(actors.engineer, sl.id, sl.lockVersion);
}

const liveInvitation = () =>
  Invitation.create({ email: `${unique('invited')}@harrow.example`, role: 'viewer', tokenHash: createHash('sha256').update(randomBytes(32)).digest('hex'), expiresAt: new Date(Date.now() + 3600_000), usedAt: null, invitedById: null });

const json = (path: string, body?: unknown) => async () => ({ path, body });
const ratingDraft = () => ({
  materialId: f.materialId,
  referenceId: f.referenceId,
  content: { name: unique('Harrow flat window trial grid'), geometry: 'flat-disc', grade: 'Harrow Sound test lot', data: { form: 'minimum-ratio', pressures: [5e5, 1e6], temperatures: [20], ratios: [[0.15], [0.18]] } },
});
const TABLE: Record<string, Entry> = {
  'POST /api/auth/login': { build: async () => ({ path: '/api/auth/login', body: { email: 'viewer@harrow.example', password: 'harrow-demo-2026' }, cookie: null }) },
  'POST /api/auth/logout': { ok: 204, build: async (c) => ({ path: '/api/auth/logout', cookie: c === 'anonymous' ? null : (await freshSession(c)).cookie }) },
  'GET /api/auth/me': { build: json('/api/auth/me'), except: { anonymous: 401 } },
  'POST /api/auth/invitations/accept': {
    ok: 201,
    build: async () => {
      const token = randomBytes(32).toString('base64url');
      await Invitation.create({ email: `${unique('invitee')}@harrow.example`, role: 'viewer', tokenHash: createHash('sha256').update(token).digest('hex'), expiresAt: new Date(Date.now() + 3600_000), usedAt: null, invitedById: null });
      return { path: '/api/auth/invitations/accept', body: { token, name: 'Ailsa Brodie', password: 'a-long-passphrase-0' }, cookie: null };
    },
  },
  'POST /api/auth/password-reset/request': { ok: 202, build: json('/api/auth/password-reset/request', { email: 'nobody@harrow.example' }) },
  'POST /api/auth/password-reset': {
    build: async () => {
      const user = await freshSession('viewer');
      const token = randomBytes(32).toString('base64url');
      await PasswordReset.create({ userId: user.id, tokenHash: createHash('sha256').update(token).digest('hex'), expiresAt: new Date(Date.now() + 3600_000), usedAt: null });
      return { path: '/api/auth/password-reset', body: { token, password: 'another-long-passphrase' }, cookie: null };
    },
  },
  'POST /api/auth/password': {
    build: async (c) => ({ path: '/api/auth/password', body: { currentPassword: EXTRA_PASSWORD, newPassword: 'a-new-long-passphrase' }, cookie: c === 'anonymous' ? null : (await freshSession(c)).cookie }),
    except: { anonymous: 401 },
  },
  'GET /api/health': { build: json('/api/health') },
  'GET /api/openapi.json': { build: json('/api/openapi.json') },

  'GET /api/property-sets': { build: json('/api/property-sets?family=acrylic') },
  'GET /api/property-sets/:id': { build: async () => ({ path: `/api/property-sets/${f.setId}` }) },
  'GET /api/materials': { build: json('/api/materials') },
  'POST /api/materials': { ok: 201, build: async () => ({ path: '/api/materials', body: { name: unique('Harrow trial resin'), family: 'acrylic', transparent: true } }) },
  'GET /api/materials/:id': { build: async () => ({ path: `/api/materials/${f.materialId}` }) },
  'POST /api/evaluate': { build: json('/api/evaluate', { loadCase: LOAD_CASE, limit: 3 }) },
  'GET /api/pressure': { build: json('/api/pressure?depth=1200&latitude=57&water=sea') },

  'GET /api/library/sets': { build: json('/api/library/sets') },
  'GET /api/library/sets/:id': { build: async () => ({ path: `/api/library/sets/${f.draftId}` }) },
  'GET /api/library/sets/:id/changes': { build: async () => ({ path: `/api/library/sets/${f.draftId}/changes` }) },
  'POST /api/library/sets': { ok: 201, build: async () => ({ path: '/api/library/sets', body: { ...draftBody(f.materialId), condition: unique('Harrow lot'), reference: undefined, referenceId: f.referenceId } }) },
  'PUT /api/library/sets/:id': {
    build: async () => {
      const d = await draftBySecondLibrarian();
      return { path: `/api/library/sets/${d.id}`, body: { lockVersion: d.lockVersion, draft: { ...draftBody(f.materialId), condition: unique('Harrow lot edited'), reference: undefined, referenceId: f.referenceId } } };
    },
  },
  'POST /api/library/sets/:id/submit': { build: async () => { const d = await draftBySecondLibrarian(); return { path: `/api/library/sets/${d.id}/submit`, body: { lockVersion: d.lockVersion } }; } },
  'POST /api/library/sets/:id/approve': { build: async () => { const d = await inReviewBySecondLibrarian(); return { path: `/api/library/sets/${d.id}/approve`, body: { lockVersion: d.lockVersion } }; } },
  'POST /api/library/sets/:id/return': { build: async () => { const d = await inReviewBySecondLibrarian(); return { path: `/api/library/sets/${d.id}/return`, body: { lockVersion: d.lockVersion, comment: 'Add the test temperature.' } }; } },
  'POST /api/library/sets/:id/revise': { ok: 201, build: async () => { const s = await freshPublishedSet(); return { path: `/api/library/sets/${s.id}/revise`, body: { lockVersion: s.lockVersion } }; } },
  'POST /api/library/sets/:id/retire': { build: async () => { const s = await freshPublishedSet(); return { path: `/api/library/sets/${s.id}/retire`, body: { lockVersion: s.lockVersion, reason: 'Superseded by lot tests.' } }; } },
  'GET /api/library/confirmations': { build: json('/api/library/confirmations?status=proposed') },
  'POST /api/library/sets/:id/confirmations': { ok: 201, build: async () => { const s = await freshPublishedSet(); return { path: `/api/library/sets/${s.id}/confirmations`, body: { key: 'density', location: 'Table 1, specific gravity' } }; } },
  'POST /api/library/confirmations/:id/steps': {
    build: async () => {
      const s = await freshPublishedSet();
      const c = await proposeConfirmation(s.id, { key: 'density', location: 'Table 1, specific gravity' }, { ...f.secondLibrarian, role: 'librarian' });
      return { path: `/api/library/confirmations/${c.id}/steps`, body: { step: 'approve', lockVersion: c.lockVersion } };
    },
  },
  'GET /api/library/import/template.csv': { build: json('/api/library/import/template.csv') },
  'POST /api/library/import/preview': { build: async () => ({ path: '/api/library/import/preview', attach: { field: 'file', data: csvFile(), filename: 'lots.csv', contentType: 'text/csv' } }) },
  'POST /api/library/import': { ok: 201, build: async () => ({ path: '/api/library/import', attach: { field: 'file', data: csvFile(), filename: 'lots.csv', contentType: 'text/csv' } }) },

  'GET /api/rating-tables': { build: json('/api/rating-tables') },
  'GET /api/rating-tables/:id': { build: async () => ({ path: `/api/rating-tables/${(await RatingTable.findOne({ where: { status: 'published' } }))!.id}` }) },
  'POST /api/rating-tables': { ok: 201, build: async () => ({ path: '/api/rating-tables', body: ratingDraft() }) },
  'PUT /api/rating-tables/:id': {
    build: async () => {
      const d = await createRatingTableDraft(ratingTableDraftSchema.parse(ratingDraft()), { ...f.secondLibrarian, role: 'librarian' });
      return { path: `/api/rating-tables/${d.id}`, body: { lockVersion: d.lockVersion, draft: ratingDraft() } };
    },
  },
  'POST /api/rating-tables/:id/steps': {
    build: async () => {
      const d = await createRatingTableDraft(ratingTableDraftSchema.parse(ratingDraft()), { ...f.secondLibrarian, role: 'librarian' });
      return { path: `/api/rating-tables/${d.id}/steps`, body: { step: 'submit', lockVersion: d.lockVersion } };
    },
  },
  'POST /api/rating-tables/csv': { build: async () => ({ path: '/api/rating-tables/csv', attach: { field: 'file', data: Buffer.from('design_pressure_bar,10,24\n5,0.15,0.16\n10,0.17,0.18\n'), filename: 'grid.csv', contentType: 'text/csv' } }) },
  'GET /api/rating-tables/csv-template': { build: json('/api/rating-tables/csv-template?form=minimum-ratio') },

  'GET /api/references': { build: json('/api/references') },
  'GET /api/references/:id': { build: async () => ({ path: `/api/references/${f.referenceId}` }) },
  'POST /api/references': { ok: 201, build: async () => ({ path: '/api/references', body: { kind: 'test-report', title: unique('Harrow Sound test report') } }) },
  'PUT /api/references/:id': {
    build: async () => {
      const r = await createReference({ kind: 'test-report', title: unique('Harrow report') }, f.secondLibrarian);
      return { path: `/api/references/${r.id}`, body: { lockVersion: r.lockVersion, reference: { kind: 'test-report', title: unique('Harrow report, revised') } } };
    },
  },
  'POST /api/references/:id/document': { build: async () => ({ path: `/api/references/${f.referenceId}/document`, attach: { field: 'file', data: PDF, filename: 'report.pdf', contentType: 'application/pdf' } }) },
  'GET /api/references/:id/document': { build: async () => ({ path: `/api/references/${f.referenceWithDocId}/document` }) },
  'GET /api/references/:id/documents': { build: async () => ({ path: `/api/references/${f.referenceWithDocId}/documents` }) },
  'GET /api/references/:id/documents/:version': { build: async () => ({ path: `/api/references/${f.referenceWithDocId}/documents/1` }) },
  'PUT /api/references/:id/versions/:version': {
    build: async () => {
      const c = await proposedChange('draft');
      return { path: `/api/references/${c.id}/versions/2`, body: { lockVersion: c.lockVersion, reference: { ...c.citation, location: 'Table 3' } } };
    },
  },
  'POST /api/references/:id/versions/:version/steps': {
    build: async () => {
      const c = await proposedChange('in-review');
      return { path: `/api/references/${c.id}/versions/2/steps`, body: { step: 'approve', lockVersion: c.lockVersion } };
    },
  },
  'GET /api/library/reference-versions': { build: json('/api/library/reference-versions?status=in-review') },

  'GET /api/admin/audit': { build: json('/api/admin/audit?limit=5') },
  'GET /api/admin/mail': { build: json('/api/admin/mail?limit=5') },
  'GET /api/admin/mail/:id': { build: async () => ({ path: `/api/admin/mail/${f.mailId}` }) },
  'GET /api/admin/users': { build: json('/api/admin/users') },
  'PATCH /api/admin/users/:id': { build: async () => ({ path: `/api/admin/users/${(await freshSession('viewer')).id}`, body: { role: 'engineer' } }) },
  'GET /api/admin/sign-in-locks': { build: json('/api/admin/sign-in-locks') },
  'DELETE /api/admin/sign-in-locks/:id': {
    ok: 204,
    build: async () => {
      const [rows] = await sequelize().query(`INSERT INTO sign_in_throttles (address, email, failures, last_failure_at) VALUES ('192.0.2.1', :email, 1, now()) RETURNING id`, { replacements: { email: `${unique('locked')}@harrow.example` } });
      return { path: `/api/admin/sign-in-locks/${(rows as { id: number }[])[0].id}` };
    },
  },
  'GET /api/admin/invitations': { build: json('/api/admin/invitations') },
  'POST /api/admin/invitations/:id/revoke': { build: async () => ({ path: `/api/admin/invitations/${(await liveInvitation()).id}/revoke` }) },
  'POST /api/admin/invitations/:id/resend': { build: async () => ({ path: `/api/admin/invitations/${(await liveInvitation()).id}/resend` }) },
  'GET /api/admin/outbox': { build: json('/api/admin/outbox?status=sent') },
  'POST /api/admin/invitations': { ok: 201, build: async () => ({ path: '/api/admin/invitations', body: { email: `${unique('new')}@harrow.example`, role: 'viewer' } }) },

  // The project: owned by the engineer, with the checker and the viewer as members; the librarian is not one.
  'GET /api/projects': { build: json('/api/projects') },
  'POST /api/projects': { ok: 201, build: async () => ({ path: '/api/projects', body: { name: unique('Harrow project') } }) },
  'GET /api/projects/:id': { build: async () => ({ path: `/api/projects/${f.projectId}` }), except: { librarian: 404 } },
  'PATCH /api/projects/:id': { build: async () => ({ path: `/api/projects/${f.projectId}`, body: { lockVersion: (await Project.findByPk(f.projectId))!.lockVersion, description: unique('HS-2 viewports') } }), except: { checker: 403 } },
  'POST /api/projects/:id/members': { build: async () => ({ path: `/api/projects/${f.projectId}/members`, body: { userId: (await freshSession('viewer')).id } }), except: { checker: 403 } },
  'DELETE /api/projects/:id/members/:userId': {
    build: async () => {
      const u = await freshSession('viewer');
      await addMember(actors.engineer, f.projectId, u.id);
      return { path: `/api/projects/${f.projectId}/members/${u.id}` };
    },
    except: { checker: 403 },
  },
  'GET /api/projects/:id/load-cases': { build: async () => ({ path: `/api/projects/${f.projectId}/load-cases` }), except: { librarian: 404 } },
  'POST /api/projects/:id/load-cases': { ok: 201, build: async () => ({ path: `/api/projects/${f.projectId}/load-cases`, body: { name: unique('Side port'), loadCase: LOAD_CASE } }) },
  'GET /api/projects/:id/shortlists': { build: async () => ({ path: `/api/projects/${f.projectId}/shortlists` }), except: { librarian: 404 } },
  'POST /api/projects/:id/shortlists': { ok: 201, build: async () => ({ path: `/api/projects/${f.projectId}/shortlists`, body: { loadCaseId: f.loadCaseId, name: unique('Port shortlist') } }) },
  'GET /api/projects/:id/records': { build: async () => ({ path: `/api/projects/${f.projectId}/records` }), except: { librarian: 404 } },
  'GET /api/people': { build: json('/api/people') },
  'GET /api/load-cases/:id': { build: async () => ({ path: `/api/load-cases/${f.loadCaseId}` }), except: { librarian: 404 } },
  'PUT /api/load-cases/:id': {
    build: async () => {
      const lc = await createLoadCase(actors.engineer, f.projectId, { name: unique('Side port'), loadCase: LOAD_CASE, notes: '' });
      return { path: `/api/load-cases/${lc.id}`, body: { lockVersion: lc.lockVersion, name: unique('Side port, revised'), loadCase: LOAD_CASE, notes: '' } };
    },
  },
  'GET /api/shortlists/awaiting-check': { build: async () => ({ path: '/api/shortlists/awaiting-check' }) },
  'GET /api/shortlists/:id': { build: async () => ({ path: `/api/shortlists/${f.shortlistId}` }), except: { librarian: 404 } },
  'POST /api/shortlists/:id/items': {
    ok: 201,
    build: async (c) => {
      const sl = await shortlistOf(c, 0);
      return { path: `/api/shortlists/${sl.id}/items`, body: { propertySetId: f.setId, note: 'Confirm the lot data' } };
    },
  },
  'PATCH /api/shortlists/:id/items/:itemId': { build: async (c) => { const sl = await shortlistOf(c); return { path: `/api/shortlists/${sl.id}/items/${sl.items[0].id}`, body: { note: 'Edge seal to confirm', lockVersion: sl.items[0].lockVersion } }; } },
  'DELETE /api/shortlists/:id/items/:itemId': { build: async (c) => { const sl = await shortlistOf(c); return { path: `/api/shortlists/${sl.id}/items/${sl.items[0].id}` }; } },
  'POST /api/shortlists/:id/reorder': { build: async (c) => { const sl = await shortlistOf(c, 2); return { path: `/api/shortlists/${sl.id}/reorder`, body: { lockVersion: sl.lockVersion, itemIds: [sl.items[1].id, sl.items[0].id] } }; } },
  'POST /api/shortlists/:id/submit': { build: async (c) => { const sl = await shortlistOf(c); return { path: `/api/shortlists/${sl.id}/submit`, body: { lockVersion: sl.lockVersion } }; } },
  'POST /api/shortlists/:id/check': { build: async () => { const sl = await submittedByEngineer(); return { path: `/api/shortlists/${sl.id}/check`, body: { lockVersion: sl.lockVersion } }; } },
  'POST /api/shortlists/:id/return': { build: async () => { const sl = await submittedByEngineer(); return { path: `/api/shortlists/${sl.id}/return`, body: { lockVersion: sl.lockVersion, comment: 'Add a second grade.' } }; } },
  'GET /api/records/:id': { build: async () => ({ path: `/api/records/${f.recordId}` }), except: { librarian: 404 } },
  'GET /api/records/:id/pdf': { build: async () => ({ path: `/api/records/${f.recordId}/pdf` }) },
};

/** Expected status: 401 anonymous, 403 without the permission, else the entry's own answer. */
function expected(entry: Entry, access: string, caller: Caller): number {
  if (entry.except?.[caller] !== undefined) return entry.except[caller]!;
  if (access === 'public') return entry.ok ?? 200;
  if (caller === 'anonymous') return 401;
  if (access === 'signed-in') return entry.ok ?? 200;
  return can(caller, access as Permission) ? (entry.ok ?? 200) : 403;
}

async function call(caller: Caller, method: Method, req: Awaited<ReturnType<Entry['build']>>) {
  let r = request(handle.app)[method](req.path);
  const cookie = req.cookie === undefined ? (caller === 'anonymous' ? null : cookies[caller]) : req.cookie;
  if (cookie) r = r.set('Cookie', cookie);
  if (req.attach) return r.attach(req.attach.field, req.attach.data, { filename: req.attach.filename, contentType: req.attach.contentType });
  return req.body === undefined ? r : r.send(req.body as object);
}

let operations: { key: string; method: Method; expressPath: string; access: string }[] = [];

beforeAll(async () => {
  handle = await startTestApp();
  for (const role of ROLES) {
    cookies[role] = await cookieFor(`${role}@harrow.example`, 'harrow-demo-2026');
    const u = (await User.findOne({ where: { email: `${role}@harrow.example` } }))!;
    actors[role] = { id: u.id, role, name: u.name };
  }
  const lib2 = await createAccount('second.librarian@harrow.example', 'Ines Marrack', 'librarian');
  f.secondLibrarian = { id: lib2.id, name: lib2.name };
  const set = (await PropertySet.findOne({ where: { status: 'published' }, order: [['id', 'ASC']] }))!;
  f.setId = set.id;
  f.materialId = set.materialId;
  f.referenceId = set.referenceId!;
  f.draftId = (await draftBySecondLibrarian()).id;
  const withDoc = await request(handle.app).post(`/api/references/${f.referenceId}/document`).set('Cookie', cookies.librarian).attach('file', PDF, { filename: 'source.pdf', contentType: 'application/pdf' });
  expect(withDoc.status).toBe(200);
  f.referenceWithDocId = f.referenceId;
  const project = await createProject(actors.engineer, { name: 'HS-2 matrix project', description: '' });
  f.projectId = project.id;
  await addMember(actors.engineer, project.id, actors.checker.id);
  await addMember(actors.engineer, project.id, actors.viewer.id);
  f.loadCaseId = (await createLoadCase(actors.engineer, project.id, { name: 'Side port', loadCase: LOAD_CASE, notes: '' })).id;
  f.shortlistId = (await shortlistOf('engineer')).id;
  const submitted = await submittedByEngineer();
  f.recordId = (await checkShortlist(actors.checker, submitted.id, submitted.lockVersion, undefined)).designRecordId!;
  await sendQueued([await requestPasswordReset('viewer@harrow.example')]);
  f.mailId = (await listCaughtMail({ limit: 1 }))[0].id;

  const doc = (await request(handle.app).get('/api/openapi.json')).body as { paths: Record<string, Record<string, { 'x-isobath-access': string }>> };
  operations = Object.entries(doc.paths).flatMap(([path, ops]) =>
    Object.entries(ops).map(([method, op]) => {
      const expressPath = path.replace(/\{([A-Za-z]+)\}/g, ':$1');
      return { key: `${method.toUpperCase()} ${expressPath}`, method: method as Method, expressPath, access: op['x-isobath-access'] };
    }),
  );
}, 120_000);

afterAll(async () => {
  await handle.stop();
});

describe('role matrix', () => {
  it('has one entry for every operation in the OpenAPI document, and none for routes that do not exist', () => {
    expect(operations.length).toBeGreaterThan(50);
    expect(operations.map((o) => o.key).filter((k) => !TABLE[k])).toEqual([]);
    expect(Object.keys(TABLE).filter((k) => !operations.some((o) => o.key === k))).toEqual([]);
  });

  it('answers every operation, for anonymous callers and each role, exactly as the table says', async () => {
    const mismatches: string[] = [];
    for (const op of operations) {
      const entry = TABLE[op.key];
      if (!entry) continue;
      for (const caller of CALLERS) {
        const req = await entry.build(caller);
        const res = await call(caller, op.method, req);
        const want = expected(entry, op.access, caller);
        if (res.status !== want) mismatches.push(`${op.key} as ${caller}: ${res.status} (expected ${want}) ${JSON.stringify(res.body).slice(0, 160)}`);
      }
    }
    expect(mismatches).toEqual([]);
  }, 240_000);
});

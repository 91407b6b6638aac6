// The library desk's property-set workflow: draft → in review → published (→ retired), with
// four-eyes review, optimistic locking, revisions that supersede, e-mails and the audit log.
import { createServer } from 'node:net';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, demoEmail, type Agent } from '../helpers/app';
import { caughtSince, createAccount, draftBody, materialId, signInAs } from '../helpers/library';
import { AuditEntry, Material, PropertySet, Reference } from '../../server/db/models';
import type { LibrarySetDto } from '../../shared/schemas/library';
import type { PropertySetDto } from '../../shared/schemas/catalogue';
import { resetEnvCache } from '../../server/config/env';
import { closeMail } from '../../server/services/mail';
import { appLink } from '../../server/services/app-link';
import { listOutbox } from '../../server/services/outbox';
import { sequelize } from '../../server/db/sequelize';

/** A loopback port nothing listens on. */
async function closedPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise<void>((resolve) => server.close(() => resolve()));
  return port;
}

let handle: Awaited<ReturnType<typeof startTestApp>>;
let librarian: Agent; // Tamsin, the demo librarian
let second: Agent; // a second librarian, created here
let admin: Agent;
let engineer: Agent;
let acrylicId: number;
let secondId: number;

const SECOND_EMAIL = 'reviewer.librarian@harrow.example';

beforeAll(async () => {
  handle = await startTestApp();
  const secondUser = await createAccount(SECOND_EMAIL, 'Ailsa Brennock', 'librarian');
  secondId = secondUser.id;
  librarian = await signIn(handle.app, 'librarian');
  second = await signInAs(handle.app, SECOND_EMAIL);
  admin = await signIn(handle.app, 'admin');
  engineer = await signIn(handle.app, 'engineer');
  acrylicId = await materialId(librarian, 'Cast acrylic (PMMA)');
});
afterAll(async () => {
  await handle.stop();
});

async function create(agent: Agent, overrides: Record<string, unknown> = {}): Promise<LibrarySetDto> {
  const res = await agent.post('/api/library/sets').send(draftBody(acrylicId, overrides));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body as LibrarySetDto;
}

async function step(agent: Agent, set: { id: number; lockVersion: number }, action: string, extra: Record<string, unknown> = {}) {
  return agent.post(`/api/library/sets/${set.id}/${action}`).send({ lockVersion: set.lockVersion, ...extra });
}

async function read(id: number): Promise<LibrarySetDto> {
  const res = await librarian.get(`/api/library/sets/${id}`);
  expect(res.status).toBe(200);
  return res.body as LibrarySetDto;
}

async function auditOf(entityId: number, entityType = 'property-set') {
  const res = await admin.get(`/api/admin/audit?entityType=${entityType}&entityId=${entityId}`);
  expect(res.status).toBe(200);
  return res.body.items as { action: string; actor: { id: number; name: string } | null; before: Record<string, unknown> | null; after: Record<string, unknown> | null }[];
}

/** A set taken to "in review" by the demo librarian. */
async function inReview(overrides: Record<string, unknown> = {}): Promise<LibrarySetDto> {
  const draft = await create(librarian, overrides);
  const res = await step(librarian, draft, 'submit');
  expect(res.status).toBe(200);
  return res.body as LibrarySetDto;
}

/** A set published by the second librarian (four-eyes). */
async function published(overrides: Record<string, unknown> = {}): Promise<LibrarySetDto> {
  const set = await inReview(overrides);
  const res = await step(second, set, 'approve');
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body as LibrarySetDto;
}

describe('who may use the desk', () => {
  let target: LibrarySetDto;
  beforeAll(async () => {
    target = await create(librarian);
  });

  const routes = (id: number): [string, string, Record<string, unknown> | undefined][] => [
    ['get', '/api/library/sets', undefined],
    ['get', `/api/library/sets/${id}`, undefined],
    ['get', `/api/library/sets/${id}/changes`, undefined],
    ['post', '/api/library/sets', draftBody(1)],
    ['put', `/api/library/sets/${id}`, { lockVersion: 0, draft: draftBody(1) }],
    ['post', `/api/library/sets/${id}/submit`, { lockVersion: 0 }],
    ['post', `/api/library/sets/${id}/approve`, { lockVersion: 0 }],
    ['post', `/api/library/sets/${id}/return`, { lockVersion: 0, comment: 'Cite the table.' }],
    ['post', `/api/library/sets/${id}/revise`, { lockVersion: 0 }],
    ['post', `/api/library/sets/${id}/retire`, { lockVersion: 0, reason: 'Superseded by lot 13.' }],
    ['get', '/api/library/import/template.csv', undefined],
  ];

  it('answers 401 to an anonymous caller on every desk route', async () => {
    for (const [method, path, body] of routes(target.id)) {
      const call = (request(handle.app) as unknown as Record<string, (p: string) => request.Test>)[method](path);
      const res = body ? await call.send(body) : await call;
      expect(res.status, `${method} ${path}`).toBe(401);
    }
  });

  it.each(['viewer', 'engineer', 'checker'] as const)('answers 403 to the %s on every desk route and changes nothing', async (role) => {
    const agent = await signIn(handle.app, role);
    const before = await PropertySet.count();
    for (const [method, path, body] of routes(target.id)) {
      const call = (agent as unknown as Record<string, (p: string) => request.Test>)[method](path);
      const res = body ? await call.send(body) : await call;
      expect(res.status, `${method} ${path}`).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
    expect(await PropertySet.count()).toBe(before);
    const after = await read(target.id);
    expect(after.status).toBe('draft');
    expect(after.lockVersion).toBe(target.lockVersion);
  });

  it('keeps drafts out of the public catalogue routes for an engineer', async () => {
    expect((await engineer.get(`/api/property-sets/${target.id}`)).status).toBe(404);
  });
});

describe('drafting', () => {
  it('creates a draft, version 1 of a new lineage, with its new reference, and audits both', async () => {
    const referencesBefore = await Reference.count();
    const set = await create(librarian);
    expect(set).toMatchObject({
      status: 'draft',
      version: 1,
      lineageId: set.id,
      supersedesId: null,
      supersededById: null,
      returnedComment: null,
      submittedAt: null,
      lockVersion: 0,
      draftedBy: { name: 'Tamsin Oyelaran' },
      lastEditedBy: { name: 'Tamsin Oyelaran' },
      tensileStrength: 70e6,
      serviceTemperature: { min: 10, max: 66 },
    });
    expect(set.reference?.title).toBe('Harrow Sound Marine Works acceptance tests, viewport sheet lot 12');
    expect(await Reference.count()).toBe(referencesBefore + 1);

    const entries = await auditOf(set.id);
    expect(entries.map((e) => e.action)).toEqual(['create']);
    expect(entries[0].before).toBeNull();
    expect(entries[0].after).toMatchObject({ status: 'draft', tensileStrength: 70e6, materialId: acrylicId });
    expect(entries[0].actor?.name).toBe('Tamsin Oyelaran');
    expect((await auditOf(set.reference!.id, 'reference')).map((e) => e.action)).toEqual(['create']);
  });

  it('creates a new material given inline, and refuses one whose name exists in another case (409, nothing written)', async () => {
    const set = await create(librarian, {
      materialId: undefined,
      material: { name: 'Harrow Sound trial glass-ceramic HS-3', family: 'glass-ceramic', transparent: true },
    });
    expect(set.material).toMatchObject({ name: 'Harrow Sound trial glass-ceramic HS-3', family: 'glass-ceramic' });

    const [sets, materials, references] = [await PropertySet.count(), await Material.count(), await Reference.count()];
    const dup = await librarian
      .post('/api/library/sets')
      .send(draftBody(acrylicId, { materialId: undefined, material: { name: 'CAST ACRYLIC (pmma)', family: 'acrylic', transparent: true } }));
    expect(dup.status).toBe(409);
    expect(dup.body.error.code).toBe('duplicate');
    expect([await PropertySet.count(), await Material.count(), await Reference.count()]).toEqual([sets, materials, references]);
  });

  it.each([
    ['tensile yield above tensile strength', { tensileYield: 80e6 }, 'tensileYield'],
    ['both an existing and a new material', { material: { name: 'X', family: 'acrylic', transparent: true } }, 'materialId'],
    ['a negative density', { density: -1190 }, 'density'],
    ['min temperature above max', { serviceTemperature: { min: 70, max: 10 } }, 'serviceTemperature.max'],
    ['an unknown field', { colour: 'clear' }, 'colour'],
    ['a material that does not exist', { materialId: 999_999 }, 'materialId'],
    ['a reference that does not exist', { reference: undefined, referenceId: 999_999 }, 'referenceId'],
    ['no condition', { condition: '   ' }, 'condition'],
  ])('refuses a draft with %s (400, field named, nothing written)', async (_label, overrides, field) => {
    const before = await PropertySet.count();
    const res = await librarian.post('/api/library/sets').send(draftBody(acrylicId, overrides));
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect(await PropertySet.count()).toBe(before);
  });

  it('writes nothing when a later part of the draft fails: a new material given with an unknown reference', async () => {
    const [sets, materials] = [await PropertySet.count(), await Material.count()];
    const res = await librarian.post('/api/library/sets').send(
      draftBody(acrylicId, {
        materialId: undefined,
        material: { name: 'Harrow Sound trial sapphire HS-Q1', family: 'sapphire-alumina', transparent: true },
        reference: undefined,
        referenceId: 999_999,
      }),
    );
    expect(res.status).toBe(400);
    expect([await PropertySet.count(), await Material.count()]).toEqual([sets, materials]);
  });

  it('saves an edit with the current lock version, bumps it and audits before/after', async () => {
    const set = await create(librarian);
    const res = await librarian
      .put(`/api/library/sets/${set.id}`)
      .send({ lockVersion: set.lockVersion, draft: draftBody(acrylicId, { tensileStrength: 72e6, referenceId: set.reference!.id, reference: undefined }) });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.tensileStrength).toBe(72e6);
    expect(res.body.lockVersion).toBe(set.lockVersion + 1);
    expect(res.body.reference.id).toBe(set.reference!.id);
    const edit = (await auditOf(set.id)).find((e) => e.action === 'edit');
    expect(edit?.before).toMatchObject({ tensileStrength: 70e6 });
    expect(edit?.after).toMatchObject({ tensileStrength: 72e6 });
  });

  it('answers 409 "stale" to a save with an old lock version and keeps the stored values', async () => {
    const set = await create(librarian);
    const first = await librarian.put(`/api/library/sets/${set.id}`).send({ lockVersion: 0, draft: draftBody(acrylicId, { shearStrength: 61e6 }) });
    expect(first.status).toBe(200);
    const late = await second.put(`/api/library/sets/${set.id}`).send({ lockVersion: 0, draft: draftBody(acrylicId, { shearStrength: 99e6 }) });
    expect(late.status).toBe(409);
    expect(late.body.error).toMatchObject({
      code: 'stale',
      message: 'Someone saved this set after you opened it. Reload to see their changes; your edits are still in the form.',
    });
    const stored = await read(set.id);
    expect(stored.shearStrength).toBe(61e6);
    expect(stored.lockVersion).toBe(1);
    expect(stored.lastEditedBy?.name).toBe('Tamsin Oyelaran');
  });

  it('lets exactly one of two simultaneous saves with the same lock version through; the other gets 409 and nothing is lost', async () => {
    const set = await create(librarian);
    const [a, b] = await Promise.all([
      librarian.put(`/api/library/sets/${set.id}`).send({ lockVersion: 0, draft: draftBody(acrylicId, { compressiveStrength: 111e6 }) }),
      second.put(`/api/library/sets/${set.id}`).send({ lockVersion: 0, draft: draftBody(acrylicId, { compressiveStrength: 122e6 }) }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const winner = a.status === 200 ? a : b;
    const loser = a.status === 200 ? b : a;
    expect(loser.body.error.code).toBe('stale');
    const stored = await read(set.id);
    // The stored set is exactly the winner's save, and the loser was told (their form keeps its edits).
    expect(stored.compressiveStrength).toBe(winner.body.compressiveStrength);
    expect(stored.lockVersion).toBe(1);
    expect((await auditOf(set.id)).filter((e) => e.action === 'edit')).toHaveLength(1);
  });

  it('refuses to edit a set that is in review (409 "wrong_status")', async () => {
    const set = await inReview();
    const res = await librarian.put(`/api/library/sets/${set.id}`).send({ lockVersion: set.lockVersion, draft: draftBody(acrylicId) });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('wrong_status');
  });
});

describe('review (four-eyes)', () => {
  it('submits a draft and e-mails every other active librarian and admin, not the submitter', async () => {
    const draft = await create(librarian, { condition: 'Harrow Sound lot 21 cast sheet, submit mail check' });
    const since = new Date().toISOString();
    const res = await step(librarian, draft, 'submit');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'in-review', lockVersion: draft.lockVersion + 1 });
    expect(res.body.submittedAt).toEqual(expect.any(String));

    const mails = await caughtSince(since, 'Harrow Sound lot 21 cast sheet, submit mail check');
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Property set waiting for review: Cast acrylic (PMMA) — Harrow Sound lot 21 cast sheet, submit mail check');
    expect(mails[0].to.sort()).toEqual([demoEmail('admin'), SECOND_EMAIL].sort());
    expect(mails[0].text).toContain(appLink(`/library/sets/${draft.id}`));
    expect((await auditOf(draft.id)).map((e) => e.action)).toEqual(['submit', 'create']);
  });

  it('still submits when the mail server is down: the e-mail waits in the outbox for another attempt, and the failure is logged', async () => {
    const draft = await create(librarian);
    const port = await closedPort();
    const saved = process.env.SMTP_PORT;
    const logged = vi.spyOn(console, 'error').mockImplementation(() => undefined);
    try {
      process.env.SMTP_PORT = String(port);
      resetEnvCache();
      closeMail();
      const res = await step(librarian, draft, 'submit');
      expect(res.status).toBe(200);
      expect(res.body.status).toBe('in-review');
      expect(logged.mock.calls.some((args) => String(args[0]).includes('Property set waiting for review'))).toBe(true);
    } finally {
      process.env.SMTP_PORT = saved;
      resetEnvCache();
      closeMail();
      logged.mockRestore();
    }
    expect((await read(draft.id)).status).toBe('in-review');
    const waiting = (await listOutbox({ status: 'pending' })).filter((m) => m.subject.startsWith('Property set waiting for review'));
    expect(waiting).toHaveLength(1);
    expect(waiting[0]).toMatchObject({ attempts: 1, lastError: expect.stringMatching(/ECONNREFUSED|ECONNECTION|ESOCKET/) });
    // Not left for a later kick to send into the other tests' mail counts.
    await sequelize().query(`DELETE FROM mail_outbox WHERE id = :id`, { replacements: { id: waiting[0].id } });
  });

  it('refuses the author approving or returning their own set (403 "own_work"), and leaves it in review', async () => {
    const set = await inReview();
    const approve = await step(librarian, set, 'approve');
    expect(approve.status).toBe(403);
    expect(approve.body.error.code).toBe('own_work');
    const ret = await step(librarian, set, 'return', { comment: 'Looks wrong to me.' });
    expect(ret.status).toBe(403);
    expect(ret.body.error.code).toBe('own_work');
    expect((await read(set.id)).status).toBe('in-review');
  });

  it('refuses approval by whoever last edited the set, even if someone else drafted it', async () => {
    const draft = await create(librarian);
    const edited = await admin.put(`/api/library/sets/${draft.id}`).send({ lockVersion: draft.lockVersion, draft: draftBody(acrylicId, { density: 1185 }) });
    expect(edited.status).toBe(200);
    expect(edited.body.lastEditedBy.name).toBe('Morven Tait (admin)');
    const submitted = await step(librarian, edited.body, 'submit');
    expect(submitted.status).toBe(200);
    const byAdmin = await step(admin, submitted.body, 'approve');
    expect(byAdmin.status).toBe(403);
    expect(byAdmin.body.error.code).toBe('own_work');
    expect((await step(second, submitted.body, 'approve')).status).toBe(200);
  });

  it('publishes on approval by another librarian, into the public catalogue, and e-mails the author', async () => {
    const set = await inReview({ condition: 'Harrow Sound lot 22 cast sheet, approval check' });
    const since = new Date().toISOString();
    const res = await step(second, set, 'approve');
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'published', approvedBy: { id: secondId, name: 'Ailsa Brennock' } });
    expect(res.body.publishedAt).toEqual(expect.any(String));

    const pub = await engineer.get(`/api/property-sets/${set.id}`);
    expect(pub.status).toBe(200);
    const list = await engineer.get('/api/property-sets?q=lot%2022');
    expect((list.body.items as PropertySetDto[]).map((i) => i.id)).toContain(set.id);

    const mails = await caughtSince(since, 'Harrow Sound lot 22 cast sheet, approval check');
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Property set published: Cast acrylic (PMMA) — Harrow Sound lot 22 cast sheet, approval check');
    expect(mails[0].to).toEqual([demoEmail('librarian')]);
    expect(mails[0].text).toContain('Ailsa Brennock');

    const approveEntry = (await auditOf(set.id)).find((e) => e.action === 'approve');
    expect(approveEntry?.before).toMatchObject({ status: 'in-review', approvedById: null });
    expect(approveEntry?.after).toMatchObject({ status: 'published', approvedById: secondId });
  });

  it('refuses to approve a set without a reference (400) and keeps it in review', async () => {
    const set = await inReview({ reference: undefined });
    expect(set.reference).toBeNull();
    const res = await step(second, set, 'approve');
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('referenceId');
    expect((await read(set.id)).status).toBe('in-review');
  });

  it('refuses to approve a draft that was never submitted (409 "wrong_status")', async () => {
    const draft = await create(librarian);
    const res = await step(second, draft, 'approve');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('wrong_status');
  });

  it('answers 409 "stale" to an approval with an old lock version', async () => {
    const set = await inReview();
    const res = await step(second, { id: set.id, lockVersion: set.lockVersion - 1 }, 'approve');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('stale');
    expect((await read(set.id)).status).toBe('in-review');
  });

  it('returns a set to draft with the comment, and e-mails the author the comment', async () => {
    const set = await inReview({ condition: 'Harrow Sound lot 23 cast sheet, return check' });
    const since = new Date().toISOString();
    const comment = 'Table 3 gives 68 MPa for the tensile minimum, not 70 MPa. Please check and cite the page.';
    const res = await step(second, set, 'return', { comment });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ status: 'draft', returnedComment: comment, submittedAt: null });

    const mails = await caughtSince(since, 'Harrow Sound lot 23 cast sheet, return check');
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Property set returned: Cast acrylic (PMMA) — Harrow Sound lot 23 cast sheet, return check');
    expect(mails[0].to).toEqual([demoEmail('librarian')]);
    expect(mails[0].text).toContain(comment);
    const entry = (await auditOf(set.id)).find((e) => e.action === 'return');
    expect(entry?.after).toMatchObject({ status: 'draft', comment });

    // The author fixes it and submits again; the comment stays until it is published.
    const fixed = await librarian.put(`/api/library/sets/${set.id}`).send({ lockVersion: res.body.lockVersion, draft: draftBody(acrylicId, { tensileStrength: 68e6, condition: 'Harrow Sound lot 23 cast sheet, return check' }) });
    expect(fixed.status).toBe(200);
    expect(fixed.body.returnedComment).toBe(comment);
    const again = await step(librarian, fixed.body, 'submit');
    const approved = await step(second, again.body, 'approve');
    expect(approved.status).toBe(200);
    expect(approved.body.returnedComment).toBeNull();
  });

  it('refuses a return without a real comment (400)', async () => {
    const set = await inReview();
    const res = await step(second, set, 'return', { comment: ' ' });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('comment');
  });
});

describe('revisions and retirement', () => {
  it('revises a published set; approval retires the old version, which points at its successor and stays readable', async () => {
    const v1 = await published({ condition: 'Harrow Sound lot 30 cast sheet, revision check' });
    const rev = await step(librarian, v1, 'revise');
    expect(rev.status).toBe(201);
    const v2 = rev.body as LibrarySetDto;
    expect(v2).toMatchObject({ status: 'draft', version: 2, lineageId: v1.lineageId, supersedesId: v1.id, tensileStrength: v1.tensileStrength });
    expect(v2.id).not.toBe(v1.id);

    // A second revision of the same lineage while one is open is refused.
    const again = await step(second, v1, 'revise');
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('revision_open');

    const edited = await librarian.put(`/api/library/sets/${v2.id}`).send({
      lockVersion: v2.lockVersion,
      draft: draftBody(acrylicId, { condition: v1.condition, tensileStrength: 74e6, referenceId: v1.reference!.id, reference: undefined }),
    });
    expect(edited.status).toBe(200);
    const changes = await librarian.get(`/api/library/sets/${v2.id}/changes`);
    expect(changes.status).toBe(200);
    expect(changes.body.previous.id).toBe(v1.id);
    expect(changes.body.changes).toEqual([{ field: 'tensileStrength', before: 70e6, after: 74e6 }]);

    const submitted = await step(librarian, edited.body, 'submit');
    const approved = await step(second, submitted.body, 'approve');
    expect(approved.status).toBe(200);
    expect(approved.body.status).toBe('published');

    const old = await engineer.get(`/api/property-sets/${v1.id}`);
    expect(old.status).toBe(200);
    expect(old.body).toMatchObject({ status: 'retired', supersededById: v2.id, tensileStrength: 70e6 });
    const list = await engineer.get('/api/property-sets?q=lot%2030');
    expect((list.body.items as PropertySetDto[]).map((i) => i.id)).toEqual([v2.id]);
    const supersede = (await auditOf(v1.id)).find((e) => e.action === 'supersede');
    expect(supersede?.before).toMatchObject({ status: 'published', supersededById: null });
    expect(supersede?.after).toMatchObject({ status: 'retired', supersededById: v2.id });
    expect((await auditOf(v2.id)).map((e) => e.action)).toEqual(['approve', 'submit', 'edit', 'revise']);
  });

  it('revises a seeded catalogue set', async () => {
    const { body } = await engineer.get('/api/property-sets?family=titanium-alloy');
    const seeded = body.items[0] as PropertySetDto;
    const full = await read(seeded.id);
    const rev = await step(librarian, full, 'revise');
    expect(rev.status).toBe(201);
    expect(rev.body).toMatchObject({ version: 2, lineageId: seeded.id, supersedesId: seeded.id, material: { id: seeded.material.id } });
  });

  it('keeps a revision on the material it revises (400)', async () => {
    const v1 = await published();
    const v2 = (await step(librarian, v1, 'revise')).body as LibrarySetDto;
    const other = await materialId(librarian, 'Extruded acrylic (PMMA)');
    const res = await librarian.put(`/api/library/sets/${v2.id}`).send({ lockVersion: v2.lockVersion, draft: draftBody(other) });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('materialId');
  });

  it('refuses to revise a draft (409 "wrong_status")', async () => {
    const draft = await create(librarian);
    const res = await step(librarian, draft, 'revise');
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('wrong_status');
  });

  it('retires a published set with a reason: out of the catalogue list, still readable, reason audited', async () => {
    const set = await published({ condition: 'Harrow Sound lot 31 cast sheet, retire check' });
    expect((await step(engineer, set, 'retire', { reason: 'Lot withdrawn after crazing was found.' })).status).toBe(403);
    expect((await step(second, set, 'retire', { reason: 'x' })).status).toBe(400);
    const res = await step(librarian, set, 'retire', { reason: 'Lot withdrawn after crazing was found.' });
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('retired');
    const list = await engineer.get('/api/property-sets?q=lot%2031');
    expect(list.body.total).toBe(0);
    expect((await engineer.get(`/api/property-sets/${set.id}`)).body.status).toBe('retired');
    const entry = (await auditOf(set.id)).find((e) => e.action === 'retire');
    expect(entry?.before).toMatchObject({ status: 'published' });
    expect(entry?.after).toMatchObject({ status: 'retired', reason: 'Lot withdrawn after crazing was found.' });
    // Nothing is hard-deleted.
    expect(await PropertySet.findByPk(set.id)).not.toBeNull();
  });

  it('refuses to retire a draft (409 "wrong_status")', async () => {
    const draft = await create(librarian);
    const res = await step(librarian, draft, 'retire', { reason: 'Not needed after all.' });
    expect(res.status).toBe(409);
    expect(res.body.error.code).toBe('wrong_status');
  });
});

describe('the queue', () => {
  it('lists drafts and sets in review by default, by status on request, and mine = drafted or last edited by me', async () => {
    const mine = await create(second, { condition: 'Harrow Sound lot 40, drafted by the second librarian' });
    const all = await librarian.get('/api/library/sets?limit=1000');
    expect(all.status).toBe(200);
    const items = all.body.items as LibrarySetDto[];
    expect(all.body.total).toBe(await PropertySet.count({ where: { status: ['draft', 'in-review'] } }));
    expect(new Set(items.map((i) => i.status))).toEqual(new Set(['draft', 'in-review']));

    const review = await librarian.get('/api/library/sets?status=in-review');
    expect((review.body.items as LibrarySetDto[]).every((i) => i.status === 'in-review')).toBe(true);
    expect(review.body.total).toBeGreaterThan(0);

    const secondsOwn = await second.get('/api/library/sets?mine=true');
    expect((secondsOwn.body.items as LibrarySetDto[]).map((i) => i.id)).toContain(mine.id);
    for (const i of secondsOwn.body.items as LibrarySetDto[]) {
      expect([i.draftedBy?.id, i.lastEditedBy?.id]).toContain(secondId);
    }
    const tamsins = await librarian.get('/api/library/sets?mine=true&limit=1000');
    expect((tamsins.body.items as LibrarySetDto[]).map((i) => i.id)).not.toContain(mine.id);

    const page = await librarian.get('/api/library/sets?limit=2&offset=1');
    expect(page.body.items).toHaveLength(2);
    expect(page.body.items[0].id).toBe(items[1].id);
  });

  it.each(['status=published', 'mine=yes', 'colour=blue', 'limit=0'])('answers 400 to ?%s', async (query) => {
    const res = await librarian.get(`/api/library/sets?${query}`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
  });

  it('answers 404 for a set that does not exist and 400 for a malformed id', async () => {
    expect((await librarian.get('/api/library/sets/999999')).status).toBe(404);
    expect((await librarian.get('/api/library/sets/abc')).status).toBe(400);
    expect((await step(second, { id: 999999, lockVersion: 0 }, 'approve')).status).toBe(404);
  });

  it('has written no audit entry without an actor', async () => {
    expect(await AuditEntry.count({ where: { actorId: null } })).toBe(0);
  });
});

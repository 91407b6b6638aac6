// The admin's audit log and caught mail: admins only, newest first, filters and paging.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, demoEmail, type Agent } from '../helpers/app';
import { draftBody, materialId } from '../helpers/library';
import type { AuditEntryDto, CaughtMailDto, LibrarySetDto } from '../../shared/schemas/library';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let admin: Agent;
let librarian: Agent;
let set: LibrarySetDto;

beforeAll(async () => {
  handle = await startTestApp();
  admin = await signIn(handle.app, 'admin');
  librarian = await signIn(handle.app, 'librarian');
  const acrylic = await materialId(librarian, 'Cast acrylic (PMMA)');
  const created = await librarian.post('/api/library/sets').send(draftBody(acrylic, { condition: 'Harrow Sound chamber port blank, admin view check' }));
  expect(created.status).toBe(201);
  const edited = await librarian.put(`/api/library/sets/${created.body.id}`).send({ lockVersion: 0, draft: draftBody(acrylic, { condition: 'Harrow Sound chamber port blank, admin view check', density: 1188 }) });
  expect(edited.status).toBe(200);
  const submitted = await librarian.post(`/api/library/sets/${created.body.id}/submit`).send({ lockVersion: 1 });
  expect(submitted.status).toBe(200);
  set = submitted.body as LibrarySetDto;
});
afterAll(async () => {
  await handle.stop();
});

const ROUTES = ['/api/admin/audit', '/api/admin/mail', '/api/admin/mail/20260101T000000000Z-00000000'];

describe('who may read the audit log and caught mail', () => {
  it('answers 401 to an anonymous caller', async () => {
    for (const path of ROUTES) expect((await request(handle.app).get(path)).status, path).toBe(401);
  });

  it.each(['viewer', 'engineer', 'checker', 'librarian'] as const)('answers 403 to the %s', async (role) => {
    const agent = await signIn(handle.app, role);
    for (const path of ROUTES) {
      const res = await agent.get(path);
      expect(res.status, path).toBe(403);
      expect(res.body.error.code).toBe('forbidden');
    }
  });
});

describe('GET /api/admin/audit', () => {
  it('lists entries newest first with actor, before and after', async () => {
    const res = await admin.get(`/api/admin/audit?entityType=property-set&entityId=${set.id}`);
    expect(res.status).toBe(200);
    const items = res.body.items as AuditEntryDto[];
    expect(items.map((e) => e.action)).toEqual(['submit', 'edit', 'create']);
    expect(items[0]).toMatchObject({ entityType: 'property-set', entityId: String(set.id), actor: { name: 'Tamsin Oyelaran' } });
    expect(items[0].id).toEqual(expect.any(Number));
    expect(Date.parse(items[0].at)).not.toBeNaN();
    expect(items[1].before).toMatchObject({ density: 1190 });
    expect(items[1].after).toMatchObject({ density: 1188 });
    expect(items[0].id).toBeGreaterThan(items[1].id);
  });

  it('pages with limit and before', async () => {
    const all = (await admin.get('/api/admin/audit?limit=500')).body.items as AuditEntryDto[];
    expect(all.length).toBeGreaterThanOrEqual(4);
    const first = (await admin.get('/api/admin/audit?limit=2')).body.items as AuditEntryDto[];
    expect(first.map((e) => e.id)).toEqual(all.slice(0, 2).map((e) => e.id));
    const next = (await admin.get(`/api/admin/audit?limit=2&before=${first[1].id}`)).body.items as AuditEntryDto[];
    expect(next.map((e) => e.id)).toEqual(all.slice(2, 4).map((e) => e.id));
  });

  it.each(['entityType=spaceship', 'limit=0', 'limit=501', 'before=-1', 'actor=1'])('answers 400 to ?%s', async (query) => {
    const res = await admin.get(`/api/admin/audit?${query}`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
  });
});

describe('GET /api/admin/mail', () => {
  it('lists the caught messages, including the review request sent on submit', async () => {
    const res = await admin.get('/api/admin/mail');
    expect(res.status).toBe(200);
    expect(res.body.enabled).toBe(true);
    const items = res.body.items as CaughtMailDto[];
    const review = items.find((m) => m.subject === 'Property set waiting for review: Cast acrylic (PMMA) — Harrow Sound chamber port blank, admin view check');
    expect(review).toBeDefined();
    expect(review!.to).toEqual([demoEmail('admin')]);
    expect(review!.from).toContain('@');
    const sorted = [...items].sort((a, b) => b.receivedAt.localeCompare(a.receivedAt));
    expect(items.map((m) => m.id)).toEqual(sorted.map((m) => m.id));

    const one = await admin.get(`/api/admin/mail/${review!.id}`);
    expect(one.status).toBe(200);
    expect(one.body).toEqual(review);
    expect(one.body.text).toContain(`/library/sets/${set.id}`);
  });

  it('answers 404 for a message that does not exist and 400 for an id that is not one', async () => {
    expect((await admin.get('/api/admin/mail/20200101T000000000Z-deadbeef')).status).toBe(404);
    const bad = await admin.get('/api/admin/mail/..%2F..%2Fetc%2Fpasswd');
    expect(bad.status).toBe(400);
    expect((await admin.get('/api/admin/mail?limit=0')).status).toBe(400);
  });
});

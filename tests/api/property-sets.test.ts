import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { FAMILIES, type PropertySetDto } from '../../shared/schemas/catalogue';
import { PropertySet } from '../../server/db/models';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let engineer: Agent;
beforeAll(async () => {
  handle = await startTestApp();
  engineer = await signIn(handle.app, 'engineer');
});
afterAll(async () => {
  await handle.stop();
});

const list = async (agent: Agent, query = '') => {
  const res = await agent.get(`/api/property-sets${query}`);
  expect(res.status).toBe(200);
  return res.body as { items: PropertySetDto[]; total: number };
};

describe('GET /api/property-sets', () => {
  it('returns 401 to an anonymous caller', async () => {
    const res = await request(handle.app).get('/api/property-sets');
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('unauthenticated');
  });

  it('lists the seeded catalogue: at least 40 published, cited sets across at least 10 families', async () => {
    const body = await list(engineer);
    expect(body.total).toBe(body.items.length);
    expect(body.total).toBeGreaterThanOrEqual(40);
    expect(new Set(body.items.map((i) => i.material.family)).size).toBeGreaterThanOrEqual(10);
    for (const item of body.items) {
      expect(item.status).toBe('published');
      expect(item.reference?.title).toBeTruthy();
      expect(item.material).toEqual(expect.objectContaining({ id: expect.any(Number), name: expect.any(String), family: expect.any(String), transparent: expect.any(Boolean) }));
      expect(item.youngsModulus).toBeGreaterThan(0);
    }
  });

  it.each(['viewer', 'checker', 'librarian', 'admin'] as const)('lets the %s read the catalogue', async (role) => {
    const agent = await signIn(handle.app, role);
    expect((await agent.get('/api/property-sets')).status).toBe(200);
  });

  it('filters by family', async () => {
    const body = await list(engineer, '?family=acrylic');
    expect(body.total).toBeGreaterThanOrEqual(3);
    expect(body.items.every((i) => i.material.family === 'acrylic')).toBe(true);
  });

  it('filters by transparency', async () => {
    const clear = await list(engineer, '?transparent=true');
    const opaque = await list(engineer, '?transparent=false');
    const all = await list(engineer);
    expect(clear.items.every((i) => i.material.transparent)).toBe(true);
    expect(opaque.items.every((i) => !i.material.transparent)).toBe(true);
    expect(clear.total + opaque.total).toBe(all.total);
  });

  it('keeps only sets whose service temperature covers tmin..tmax', async () => {
    const body = await list(engineer, '?tmin=-20&tmax=80');
    const all = await list(engineer);
    expect(body.total).toBeGreaterThan(0);
    expect(body.total).toBeLessThan(all.total);
    for (const i of body.items) {
      expect(i.serviceTemperature.min).toBeLessThanOrEqual(-20);
      expect(i.serviceTemperature.max).toBeGreaterThanOrEqual(80);
    }
  });

  it('matches a text query against material, condition and reference', async () => {
    const body = await list(engineer, '?q=titanium');
    expect(body.total).toBeGreaterThan(0);
    for (const i of body.items) {
      expect(`${i.material.name} ${i.material.family} ${i.condition} ${i.reference?.title}`.toLowerCase()).toContain('titanium');
    }
    expect((await list(engineer, '?q=%25%25%25')).total).toBe(0);
  });

  it.each([
    ['family=unobtainium', 'family'],
    ['transparent=maybe', 'transparent'],
    ['tmin=cold', 'tmin'],
    ['tmin=50&tmax=10', 'tmax'],
    ['tmin=Infinity', 'tmin'],
    ['colour=blue', 'colour'],
    ['family=acrylic&family=glass', 'family'],
    ['limit=0', 'limit'],
  ])('returns 400 with a field error for ?%s', async (query, field) => {
    const res = await engineer.get(`/api/property-sets?${query}`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('refuses drafts to an engineer but lists them for a librarian', async () => {
    const res = await engineer.get('/api/property-sets?status=draft');
    expect(res.status).toBe(403);
    const librarian = await signIn(handle.app, 'librarian');
    expect((await librarian.get('/api/property-sets?status=draft')).status).toBe(200);
  });
});

describe('GET /api/property-sets/:id', () => {
  it('returns one set with its full reference and value details', async () => {
    const { items } = await list(engineer, '?family=acrylic');
    const res = await engineer.get(`/api/property-sets/${items[0].id}`);
    expect(res.status).toBe(200);
    expect(res.body.id).toBe(items[0].id);
    expect(res.body.reference).toEqual(expect.objectContaining({ kind: expect.any(String), title: expect.any(String) }));
    expect(res.body.valueDetails.tensileStrength.basis).toMatch(/minimum|typical|statistical-allowable/);
  });

  it('returns 404 for a missing id, 400 for a malformed one', async () => {
    expect((await engineer.get('/api/property-sets/999999')).status).toBe(404);
    const bad = await engineer.get('/api/property-sets/abc');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('id');
    expect((await engineer.get('/api/property-sets/99999999999999')).status).toBe(400);
  });

  it('hides a draft from an engineer (404) but shows it to a librarian', async () => {
    const { items } = await list(engineer);
    const source = await PropertySet.findByPk(items[0].id);
    const draft = await PropertySet.create({ ...source!.get({ plain: true }), id: undefined, status: 'draft', version: 2, publishedAt: null, lockVersion: 0 } as never);
    expect((await engineer.get(`/api/property-sets/${draft.id}`)).status).toBe(404);
    const librarian = await signIn(handle.app, 'librarian');
    const res = await librarian.get(`/api/property-sets/${draft.id}`);
    expect(res.status).toBe(200);
    expect(res.body.status).toBe('draft');
    await draft.destroy();
  });
});

describe('GET /api/materials/:id', () => {
  it('returns the material with its published property sets', async () => {
    const { items } = await list(engineer, '?family=titanium-alloy');
    const res = await engineer.get(`/api/materials/${items[0].material.id}`);
    expect(res.status).toBe(200);
    expect(res.body.family).toBe('titanium-alloy');
    expect(res.body.propertySets.length).toBeGreaterThan(0);
    expect(FAMILIES).toContain(res.body.family);
  });
});

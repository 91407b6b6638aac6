// Rating tables: seeded from public sources, drafted and reviewed on the library desk through the
// shared workflow (four-eyes, lock versions, audit), and used by POST /api/evaluate to size the
// windows they cover.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { createAccount, materialId, signInAs } from '../helpers/library';
import { AuditEntry, PropertySet, RatingTable } from '../../server/db/models';
import type { RatingTableDto, RatingTableListDto } from '../../shared/schemas/rating-tables';
import type { EvaluateResult } from '../../shared/engine';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let librarian: Agent;
let second: Agent;
let viewer: Agent;
let engineer: Agent;
let acrylicId: number;
let referenceId: number;

const SECOND = 'rating.reviewer@harrow.example';

beforeAll(async () => {
  handle = await startTestApp();
  await createAccount(SECOND, 'Morven Tallach', 'librarian');
  librarian = await signIn(handle.app, 'librarian');
  second = await signInAs(handle.app, SECOND);
  viewer = await signIn(handle.app, 'viewer');
  engineer = await signIn(handle.app, 'engineer');
  acrylicId = await materialId(librarian, 'Cast acrylic (PMMA)');
  referenceId = (await librarian.post('/api/references').send({ kind: 'test-report', title: 'Harrow Sound flat window trials', year: 2026 })).body.id as number;
});
afterAll(async () => {
  await handle.stop();
});

/** An invented Harrow Sound grid (demo only). */
const draft = (overrides: Record<string, unknown> = {}) => ({
  materialId: acrylicId,
  referenceId,
  coversLineageIds: [],
  content: {
    name: 'Harrow Sound chamber viewports, minimum t/Di',
    geometry: 'flat-disc',
    grade: 'Harrow Sound test lot 12',
    data: { form: 'minimum-ratio', pressures: [2e5, 6e5], temperatures: [20, 40], ratios: [[0.3, 0.32], [0.4, 0.45]] },
  },
  ...overrides,
});

const step = (agent: Agent, t: { id: number; lockVersion: number }, name: string, extra: Record<string, unknown> = {}) =>
  agent.post(`/api/rating-tables/${t.id}/steps`).send({ step: name, lockVersion: t.lockVersion, ...extra });

const chamber = (thickness: number, temperature = 24, bar = 10) => ({
  loadCase: {
    pressure: { value: bar * 1e5 },
    temperature: { min: temperature, max: temperature },
    sustainedHours: 2000,
    cycles: 3000,
    component: { type: 'flat-disc', diameter: 0.25, thickness, edge: 'simply-supported' },
  },
  filters: { family: 'acrylic' },
  // The full form: every candidate as the engine returns it (the default is the lean form).
  form: 'full',
});

describe('seeded rating tables', () => {
  it('lists the published tables from public sources to every signed-in role, with citation and covered sets', async () => {
    const res = await viewer.get(`/api/rating-tables?materialId=${acrylicId}`);
    expect(res.status).toBe(200);
    const list = res.body as RatingTableListDto;
    expect(list.items.map((t) => t.content.name).sort()).toEqual([
      'Conical acrylic windows 60-89°, t/Di for general service (Stachiw 1972)',
      'Conical acrylic windows 90-150°, t/Di for general service (Stachiw 1972)',
      'Flat acrylic windows, minimum t/Di (classification rules, Table 1.5.2)',
    ]);
    for (const t of list.items) {
      expect(t.status).toBe('published');
      expect(t.reference).not.toBeNull();
      expect(t.covers.map((c) => c.condition).every((c) => c.startsWith('PVHO-grade'))).toBe(true);
    }
    expect((await request(handle.app).get('/api/rating-tables')).status).toBe(401);
  });

  it('POST /api/evaluate sizes the covered acrylic set by the flat-window table: t/Di 0.173 at 10 bar and 24 °C (classification rules, Table 1.5.2 [pub])', async () => {
    const res = await engineer.post('/api/evaluate').send(chamber(0.04));
    expect(res.status).toBe(200);
    const out = res.body as EvaluateResult;
    const lotMinimum = out.results.find((r) => r.name.includes('lot-certified minimums'))!;
    expect(lotMinimum.sizedBy).toMatchObject({ kind: 'rating-table' });
    expect(lotMinimum.requiredThickness! / 0.25).toBeCloseTo(0.173, 9);
    expect(lotMinimum.rating!.source).toMatch(/Classification of Underwater Vehicles/);
    // a general-purpose grade the table does not cover is sized analytically, and says so
    const general = out.results.find((r) => r.name.includes('General-purpose cast'))!;
    expect(general.sizedBy).toMatchObject({ kind: 'mode' });
    expect(general.warnings.some((w) => /No published rating table covers/.test(w))).toBe(true);
  });
});

describe('drafting and review', () => {
  it('a draft is visible on the desk only: 404 to a viewer, listed for librarians', async () => {
    const created = await librarian.post('/api/rating-tables').send(draft());
    expect(created.status, JSON.stringify(created.body)).toBe(201);
    const t = created.body as RatingTableDto;
    expect(t).toMatchObject({ status: 'draft', version: 1, lockVersion: expect.any(Number) });
    expect((await viewer.get(`/api/rating-tables/${t.id}`)).status).toBe(404);
    expect((await viewer.get('/api/rating-tables?status=draft')).body.items).toEqual([]);
    expect(((await librarian.get('/api/rating-tables?status=open')).body as RatingTableListDto).items.some((x) => x.id === t.id)).toBe(true);
  });

  it('four-eyes: the author cannot approve; another librarian publishes it; then Evaluate uses it at once', async () => {
    const t = (await librarian.post('/api/rating-tables').send(draft({ coversLineageIds: [] }))).body as RatingTableDto;
    const submitted = await step(librarian, t, 'submit');
    expect(submitted.status).toBe(200);
    const own = await step(librarian, submitted.body, 'approve');
    expect(own.status).toBe(403);
    expect(own.body.error.code).toBe('own_work');
    const before = (await engineer.post('/api/evaluate').send(chamber(0.05, 20, 3))).body as EvaluateResult;
    const approved = await step(second, submitted.body, 'approve');
    expect(approved.status, JSON.stringify(approved.body)).toBe(200);
    expect(approved.body).toMatchObject({ status: 'published', approvedBy: { name: 'Morven Tallach' } });
    // every cast-acrylic set is covered now (coversLineageIds empty); at 3 bar, 20 °C the invented grid asks 0.3
    const after = (await engineer.post('/api/evaluate').send(chamber(0.05, 20, 3))).body as EvaluateResult;
    const general = after.results.find((r) => r.name.includes('General-purpose cast'))!;
    expect(general.sizedBy).toMatchObject({ kind: 'rating-table', ratingTableId: t.id });
    expect(before.results.find((r) => r.name.includes('General-purpose cast'))!.sizedBy).toMatchObject({ kind: 'mode' });
    const actions = (await AuditEntry.findAll({ where: { entityType: 'rating-table', entityId: String(t.id) }, order: [['id', 'ASC']] })).map((a) => a.action);
    expect(actions).toEqual(['create', 'submit', 'approve']);
    // retiring it stops its use
    const retired = await step(second, approved.body, 'retire', { comment: 'Superseded by lot 13 trials.' });
    expect(retired.status).toBe(200);
    const gone = (await engineer.post('/api/evaluate').send(chamber(0.05, 20, 3))).body as EvaluateResult;
    expect(gone.results.find((r) => r.name.includes('General-purpose cast'))!.sizedBy).toMatchObject({ kind: 'mode' });
  });

  it('a stale save gets 409 and changes nothing; a return needs a comment and reaches the author', async () => {
    const t = (await librarian.post('/api/rating-tables').send(draft())).body as RatingTableDto;
    const saved = await librarian.put(`/api/rating-tables/${t.id}`).send({ lockVersion: t.lockVersion, draft: draft({ content: { ...draft().content, name: 'Harrow grid, second go' } }) });
    expect(saved.status).toBe(200);
    const stale = await librarian.put(`/api/rating-tables/${t.id}`).send({ lockVersion: t.lockVersion, draft: draft() });
    expect(stale.status).toBe(409);
    expect(stale.body.error.code).toBe('stale');
    expect((await RatingTable.findByPk(t.id))!.name).toBe('Harrow grid, second go');
    const submitted = (await step(librarian, saved.body, 'submit')).body as RatingTableDto;
    expect((await step(second, submitted, 'return')).status).toBe(400);
    const returned = await step(second, submitted, 'return', { comment: 'Cite the trial report table.' });
    expect(returned.status).toBe(200);
    expect(returned.body).toMatchObject({ status: 'draft', returnedComment: 'Cite the trial report table.' });
  });

  it('a revision supersedes the published version, which stays readable', async () => {
    const seeded = ((await librarian.get(`/api/rating-tables?materialId=${acrylicId}&status=published`)).body as RatingTableListDto).items[0];
    const revised = await step(librarian, seeded, 'revise');
    expect(revised.status).toBe(201);
    expect(revised.body).toMatchObject({ status: 'draft', version: 2, supersedesId: seeded.id, lineageId: seeded.lineageId });
    // one open revision per lineage
    const again = await step(librarian, seeded, 'revise');
    expect(again.status).toBe(409);
    expect(again.body.error.code).toBe('revision_open');
    expect((await viewer.get(`/api/rating-tables/${seeded.id}`)).body).toMatchObject({ status: 'published', version: 1 });
  });

  it('refuses bad drafts with field errors and writes nothing', async () => {
    const count = await RatingTable.count();
    const cases: [Record<string, unknown>, string][] = [
      [draft({ content: { ...draft().content, data: { form: 'minimum-ratio', pressures: [6e5, 2e5], temperatures: [20], ratios: [[0.3], [0.4]] } } }), 'content.data.pressures'],
      [draft({ content: { ...draft().content, data: { form: 'minimum-ratio', pressures: [2e5, 6e5], temperatures: [20], ratios: [[0.4], [0.3]] } } }), 'content.data.ratios.1.0'],
      [draft({ content: { ...draft().content, geometry: 'conical-frustum' } }), 'content.includedAngle'],
      [draft({ materialId: 999999 }), 'materialId'],
      [draft({ coversLineageIds: [(await PropertySet.findOne({ where: { status: 'published' }, order: [['id', 'DESC']] }))!.lineageId] }), 'coversLineageIds.0'],
    ];
    for (const [body, field] of cases) {
      const res = await librarian.post('/api/rating-tables').send(body);
      expect(res.status, field).toBe(400);
      expect(Object.keys(res.body.error.fields), field).toContain(field);
    }
    expect(await RatingTable.count()).toBe(count);
  });
});

describe('CSV grid for the editor', () => {
  const upload = (text: string, form = 'minimum-ratio') =>
    librarian.post(`/api/rating-tables/csv?form=${form}`).attach('file', Buffer.from(text), { filename: 'grid.csv', contentType: 'text/csv' });

  it('reads a grid in bar into SI, with empty cells as no value', async () => {
    const res = await upload('design_pressure_bar,10,24\n5,0.134,0.146\n10,0.154,\n');
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body.data).toEqual({ form: 'minimum-ratio', pressures: [5e5, 1e6], temperatures: [10, 24], ratios: [[0.134, 0.146], [0.154, null]] });
  });

  it('names every bad cell by row and column, and the grid rules too', async () => {
    const res = await upload('design_pressure_bar,10,24\n5,0.134,abc\n-1,0.1,0.2\n');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('import_invalid');
    expect(res.body.error.fields).toMatchObject({ 'rows.1.24': expect.any(String), 'rows.2.design_pressure_bar': expect.any(String) });
    const falling = await upload('design_pressure_bar,10\n5,0.2\n10,0.1\n');
    expect(falling.status).toBe(400);
    expect(falling.body.error.fields['rows.2.10']).toMatch(/may not fall/);
    expect((await upload('pressure,10\n5,0.2\n')).status).toBe(400);
  });

  it('offers the header as a template; other roles are refused', async () => {
    const res = await librarian.get('/api/rating-tables/csv-template?form=critical-pressure');
    expect(res.status).toBe(200);
    expect(res.text).toMatch(/^thickness_ratio,critical_pressure_mpa/);
    expect((await engineer.get('/api/rating-tables/csv-template')).status).toBe(403);
  });
});

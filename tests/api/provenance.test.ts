// The status of each value: a draft's claims round-trip, approval stamps who confirmed and who
// approved, an edit keeps an approval only where nothing changed, and Evaluate can rank on
// confirmed inputs only or without demo data.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import { createAccount, draftBody, materialId, signInAs } from '../helpers/library';
import type { LibrarySetDto } from '../../shared/schemas/library';
import type { EvaluateResult } from '../../shared/engine';

let handle: Awaited<ReturnType<typeof startTestApp>>;
let librarian: Agent;
let second: Agent;
let engineer: Agent;
let acrylicId: number;

beforeAll(async () => {
  handle = await startTestApp();
  await createAccount('status.reviewer@harrow.example', 'Kerensa Pascoe', 'librarian');
  librarian = await signIn(handle.app, 'librarian');
  second = await signInAs(handle.app, 'status.reviewer@harrow.example');
  engineer = await signIn(handle.app, 'engineer');
  acrylicId = await materialId(librarian, 'Cast acrylic (PMMA)');
});
afterAll(async () => {
  await handle.stop();
});

const claims = {
  tensileStrength: { status: 'confirmed', location: 'Table 3, row 2 (tensile, lot mean of five)' },
  compressiveStrength: { status: 'derived', rule: 'taken as the compressive-yield minimum (none tabulated)' },
  density: { status: 'demo' },
};

async function published(condition: string, provenance: Record<string, unknown>): Promise<LibrarySetDto> {
  const draft = await librarian.post('/api/library/sets').send(draftBody(acrylicId, { condition, provenance }));
  expect(draft.status, JSON.stringify(draft.body)).toBe(201);
  const sub = await librarian.post(`/api/library/sets/${draft.body.id}/submit`).send({ lockVersion: draft.body.lockVersion });
  const ok = await second.post(`/api/library/sets/${draft.body.id}/approve`).send({ lockVersion: sub.body.lockVersion });
  expect(ok.status, JSON.stringify(ok.body)).toBe(200);
  return ok.body as LibrarySetDto;
}

describe('value status', () => {
  it('keeps each claim with its value; approval names who confirmed it and who approved it', async () => {
    const set = await published('Harrow Sound lot 31 cast sheet, status round trip', claims);
    expect(set.provenance?.tensileStrength).toMatchObject({ status: 'confirmed', location: claims.tensileStrength.location, confirmedBy: { name: 'Tamsin Oyelaran' }, approvedBy: { name: 'Kerensa Pascoe' } });
    expect(set.provenance?.tensileStrength?.confirmedAt).toEqual(expect.any(String));
    expect(set.provenance?.compressiveStrength).toEqual(claims.compressiveStrength);
    expect(set.provenance?.density).toEqual({ status: 'demo' });
    // The catalogue shows the same.
    const pub = await engineer.get(`/api/property-sets/${set.id}`);
    expect(pub.body.provenance.tensileStrength.approvedBy.name).toBe('Kerensa Pascoe');
  });

  it('refuses a confirmed value without its location, and a derived one without its rule (400, field named)', async () => {
    const res = await librarian.post('/api/library/sets').send(draftBody(acrylicId, { condition: 'Harrow Sound lot 32, no location', provenance: { tensileStrength: { status: 'confirmed' } } }));
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('provenance.tensileStrength.location');
    const forged = await librarian.post('/api/library/sets').send(draftBody(acrylicId, { condition: 'Harrow Sound lot 32, forged', provenance: { tensileStrength: { status: 'confirmed', location: 'p. 4', approvedBy: { id: 1, name: 'Someone' } } } }));
    expect(forged.status).toBe(400);
  });

  it('keeps an approval through a revision only for a value and a claim that did not change', async () => {
    const set = await published('Harrow Sound lot 33 cast sheet, revision check', { tensileStrength: claims.tensileStrength, shearStrength: { status: 'confirmed', location: 'Table 3, row 5' } });
    const rev = await librarian.post(`/api/library/sets/${set.id}/revise`).send({ lockVersion: set.lockVersion });
    expect(rev.status).toBe(201);
    expect(rev.body.provenance.tensileStrength.approvedBy.name).toBe('Kerensa Pascoe');
    // The editor sends the claims back without the server's stamps; shear strength changes value.
    const sent = { tensileStrength: claims.tensileStrength, shearStrength: { status: 'confirmed', location: 'Table 3, row 5' } };
    const edit = await librarian.put(`/api/library/sets/${rev.body.id}`).send({
      lockVersion: rev.body.lockVersion,
      draft: draftBody(acrylicId, { condition: 'Harrow Sound lot 33 cast sheet, revision check', shearStrength: 58e6, provenance: sent }),
    });
    expect(edit.status, JSON.stringify(edit.body)).toBe(200);
    expect(edit.body.provenance.tensileStrength.approvedBy?.name).toBe('Kerensa Pascoe');
    expect(edit.body.provenance.shearStrength).toEqual(sent.shearStrength);
  });
});

describe('Evaluate on value status', () => {
  const loadCase = {
    pressure: { value: 2e6 },
    temperature: { min: 10, max: 25 },
    sustainedHours: 100,
    cycles: 100,
    component: { type: 'flat-disc', diameter: 0.15, thickness: 0.03, edge: 'simply-supported' },
  };
  const ids = (r: EvaluateResult) => r.results.map((x) => x.propertySetId);

  it('marks every catalogue candidate with its inputs, and narrows to confirmed inputs only or leaves out demo data', async () => {
    const demo = await published('Harrow Sound lot 34 cast sheet, demo set', { density: { status: 'demo' } });
    const all = (await engineer.post('/api/evaluate').send({ loadCase, limit: 5000, form: 'full' })).body as EvaluateResult;
    expect(ids(all)).toContain(demo.id);
    for (const r of all.results) expect(r.inputs?.total).toBeGreaterThan(5);
    expect(all.results.find((r) => r.propertySetId === demo.id)?.inputs?.demo).toBe(true);

    const noDemo = (await engineer.post('/api/evaluate').send({ loadCase, limit: 5000, filters: { excludeDemo: true }, form: 'full' })).body as EvaluateResult;
    expect(ids(noDemo)).not.toContain(demo.id);
    expect(noDemo.results.every((r) => !r.inputs?.demo)).toBe(true);
    expect(noDemo.results.length).toBeLessThan(all.results.length);

    const confirmed = (await engineer.post('/api/evaluate').send({ loadCase, limit: 5000, filters: { confirmedOnly: true }, form: 'full' })).body as EvaluateResult;
    expect(confirmed.results.every((r) => r.inputs!.confirmed === r.inputs!.total)).toBe(true);
    expect(confirmed.results.length).toBeLessThan(all.results.length);
  });

  it('refuses a filter that is not true or false (400)', async () => {
    const res = await engineer.post('/api/evaluate').send({ loadCase, filters: { confirmedOnly: 'yes' } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('filters.confirmedOnly');
  });
});

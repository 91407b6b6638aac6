import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { startTestApp, signIn, type Agent } from '../helpers/app';
import type { PropertySetDto } from '../../shared/schemas/catalogue';
import { LEAN_FORMAT, roundedLikeLean, unpackEvaluation } from '../../shared/engine/lean';
import type { EvaluateResult } from '../../shared/engine';

/** The full answer from the lean one the API sends by default (shared/engine/lean.ts). */
const full = (res: { body: unknown }) => unpackEvaluation(res.body as Parameters<typeof unpackEvaluation>[0]);

let handle: Awaited<ReturnType<typeof startTestApp>>;
let engineer: Agent;
let catalogue: PropertySetDto[];
beforeAll(async () => {
  handle = await startTestApp();
  engineer = await signIn(handle.app, 'engineer');
  catalogue = (await engineer.get('/api/property-sets')).body.items;
});
afterAll(async () => {
  await handle.stop();
});

// The Harrow Sound two-person submersible: a 90° conical viewport at 1,200 m.
const viewport = {
  pressure: { depth: 1200, latitude: 57, water: 'sea' },
  temperature: { min: 2, max: 25 },
  sustainedHours: 1000,
  cycles: 2000,
  component: { type: 'conical-frustum', minorDiameter: 0.15, thickness: 0.1, includedAngle: 90 },
};

describe('POST /api/evaluate', () => {
  it('returns 401 anonymously and 403 to a viewer', async () => {
    expect((await request(handle.app).post('/api/evaluate').send({ loadCase: viewport })).status).toBe(401);
    const viewer = await signIn(handle.app, 'viewer');
    expect((await viewer.post('/api/evaluate').send({ loadCase: viewport })).status).toBe(403);
  });

  it.each(['engineer', 'checker', 'librarian', 'admin'] as const)('lets the %s evaluate', async (role) => {
    const agent = await signIn(handle.app, role);
    expect((await agent.post('/api/evaluate').send({ loadCase: viewport })).status).toBe(200);
  });

  it('says which published sets the filters left out and why, with counts that add up to the catalogue', async () => {
    const res = await engineer.post('/api/evaluate').send({ loadCase: viewport, filters: { transparent: true, coversTemperature: true } });
    expect(res.status).toBe(200);
    const excluded = res.body.excluded as { reason: string; count: number; names: string[] }[];
    const left = excluded.reduce((n, x) => n + x.count, 0);
    expect(res.body.total + left).toBe(catalogue.length);
    const opaque = catalogue.filter((s) => !s.material.transparent).length;
    expect(excluded.find((x) => x.reason === 'transparency')?.count).toBe(opaque);
    // Transparent sets whose service range does not reach down to 2 °C or up to 25 °C are named.
    const outOfRange = catalogue.filter((s) => s.material.transparent && (s.serviceTemperature.min > 2 || s.serviceTemperature.max < 25));
    expect(outOfRange.length).toBeGreaterThan(0);
    const range = excluded.find((x) => x.reason === 'service-range');
    expect(range?.count).toBe(outOfRange.length);
    expect([...range!.names].sort()).toEqual(outOfRange.map((s) => `${s.material.name} (${s.condition})`).sort());
    // Named candidates are never "excluded".
    const named = await engineer.post('/api/evaluate').send({ loadCase: viewport, candidates: [{ propertySetId: catalogue[0].id }] });
    expect(named.body.excluded).toEqual([]);
  });

  it('evaluates the whole published catalogue, best first, with every mode named and sourced', async () => {
    const res = await engineer.post('/api/evaluate').send({ loadCase: viewport });
    expect(res.status).toBe(200);
    expect(res.body.format).toBe(LEAN_FORMAT);
    // The full form, for scripts, is the same answer with every text in place and every digit;
    // the lean form unpacks to it but for the rounding to 6 significant digits.
    const fullForm = await engineer.post('/api/evaluate').send({ loadCase: viewport, form: 'full' });
    const { pressure, results, total } = fullForm.body as EvaluateResult;
    const { excluded, ...fullResult } = fullForm.body as EvaluateResult & { excluded: unknown[] };
    expect(full(res)).toEqual(roundedLikeLean(fullResult));
    // Both forms say what the filters left out, in the same words.
    expect(res.body.excluded).toEqual(excluded);
    expect(JSON.stringify(fullForm.body).length).toBeGreaterThan(2 * JSON.stringify(res.body).length);
    // Sea pressure at 1,200 m must exceed plain ρgh with 1025 kg/m³ and g = 9.80665 (compressibility; common practice).
    expect(pressure).toBeGreaterThan(1025 * 9.80665 * 1200);
    expect(pressure).toBeLessThan(1.02 * 1025 * 9.80665 * 1200);
    expect(total).toBe(catalogue.length);
    expect(results.length).toBe(Math.min(100, total));
    for (let i = 1; i < results.length; i++) expect(results[i - 1].margin).toBeGreaterThanOrEqual(results[i].margin);
    for (const r of results) {
      expect(['tension', 'compression', 'shear', 'buckling']).toContain(r.governingMode);
      expect(Number.isFinite(r.safetyFactor)).toBe(true);
      const governing = r.modes.find((m: { mode: string }) => m.mode === r.governingMode)!;
      expect(governing.safetyFactor).toBeCloseTo(r.safetyFactor, 10);
      for (const m of r.modes) {
        expect(m.stress).toBeGreaterThan(0);
        expect(m.model.length).toBeGreaterThan(10);
        expect(m.margin).toBeCloseTo(m.safetyFactor / r.targetSafetyFactor - 1, 10);
      }
    }
  });

  it('honours limit and narrows the catalogue by family', async () => {
    const limited = await engineer.post('/api/evaluate').send({ loadCase: viewport, limit: 3 });
    expect(limited.body.results).toHaveLength(3);
    const acrylic = await engineer.post('/api/evaluate').send({ loadCase: viewport, filters: { family: 'acrylic' } });
    const acrylicIds = catalogue.filter((s) => s.material.family === 'acrylic').map((s) => s.id).sort();
    expect(full(acrylic).results.map((r) => r.propertySetId).sort()).toEqual(acrylicIds);
  });

  it('keeps only sets whose service temperature covers the design range when asked', async () => {
    const hot = { ...viewport, temperature: { min: -40, max: 90 } };
    const res = await engineer.post('/api/evaluate').send({ loadCase: hot, filters: { coversTemperature: true } });
    const expected = catalogue.filter((s) => s.serviceTemperature.min <= -40 && s.serviceTemperature.max >= 90).length;
    expect(res.body.total).toBe(expected);
    expect(expected).toBeLessThan(catalogue.length);
  });

  it('evaluates named property sets and inline materials together', async () => {
    const acrylic = catalogue.find((s) => s.material.family === 'acrylic')!;
    const res = await engineer.post('/api/evaluate').send({
      loadCase: { ...viewport, pressure: { value: 12e6 }, targetSafetyFactor: 4 },
      candidates: [
        { propertySetId: acrylic.id },
        { inline: { name: 'Harrow trial resin', density: 1200, youngsModulus: 3e9, poissonsRatio: 0.37, tensileStrength: 60e6, compressiveStrength: 100e6, shearStrength: 50e6 } },
      ],
    });
    expect(res.status).toBe(200);
    expect(res.body.pressure).toBe(12e6);
    expect(res.body.total).toBe(2);
    const { results } = full(res);
    expect(results.map((r) => r.name)).toContain('Harrow trial resin');
    expect(results.find((r) => r.propertySetId === acrylic.id)).toBeTruthy();
    for (const r of results) expect(r.targetSafetyFactor).toBe(4);
  });

  it('returns 400 naming the candidate whose property set does not exist', async () => {
    const res = await engineer.post('/api/evaluate').send({ loadCase: viewport, candidates: [{ propertySetId: catalogue[0].id }, { propertySetId: 999999 }] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields).toHaveProperty(['candidates.1.propertySetId']);
  });

  it.each([
    ['a negative thickness', { component: { ...viewport.component, thickness: -0.01 } }, 'loadCase.component.thickness'],
    ['a zero diameter', { component: { ...viewport.component, minorDiameter: 0 } }, 'loadCase.component.minorDiameter'],
    ['an included angle of 20°', { component: { ...viewport.component, includedAngle: 20 } }, 'loadCase.component.includedAngle'],
    ['an included angle of 200°', { component: { ...viewport.component, includedAngle: 200 } }, 'loadCase.component.includedAngle'],
    ['an unknown component type', { component: { type: 'torus', thickness: 0.1 } }, 'loadCase.component.type'],
    ['a reversed temperature range', { temperature: { min: 30, max: 10 } }, 'loadCase.temperature.max'],
    ['a string for hours', { sustainedHours: 'long' }, 'loadCase.sustainedHours'],
    ['fractional cycles', { cycles: 2.5 }, 'loadCase.cycles'],
  ])('returns 400 with a field error for %s', async (_label, patch, field) => {
    const res = await engineer.post('/api/evaluate').send({ loadCase: { ...viewport, ...patch } });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_input');
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('returns 400 for non-finite numbers sent as JSON text', async () => {
    const body = JSON.stringify({ loadCase: viewport }).replace('"thickness":0.1', '"thickness":1e999');
    const res = await engineer.post('/api/evaluate').set('content-type', 'application/json').send(body);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain('loadCase.component.thickness');
  });

  it('returns 400 for unknown top-level fields and a missing load case', async () => {
    const res = await engineer.post('/api/evaluate').send({ loadcase: viewport });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toEqual(expect.arrayContaining(['loadCase']));
  });
});

// The Harrow Sound submersible's pressure-hull section (invented): HY-80 shell with internal tee frames.
const hullSection = {
  pressure: { depth: 1200, latitude: 57, water: 'sea' },
  temperature: { min: 2, max: 25 },
  sustainedHours: 1000,
  cycles: 2000,
  targetSafetyFactor: 1.5,
  component: {
    type: 'ring-stiffened-cylinder',
    innerRadius: 1.0,
    thickness: 0.0165,
    frameSpacing: 0.5,
    frame: { shape: 'tee', webHeight: 0.1, webThickness: 0.01, flangeWidth: 0.08, flangeThickness: 0.015 },
    framePosition: 'internal',
    length: 6,
    outOfRoundness: 0.005,
  },
};

describe('POST /api/evaluate: ring-stiffened cylinders', () => {
  it('ranks the steels and titanium by their four hull checks, each with its collapse pressures', async () => {
    const res = await engineer.post('/api/evaluate').send({ loadCase: hullSection, filters: { family: 'steel' }, form: 'full' });
    expect(res.status).toBe(200);
    for (const r of res.body.results) {
      expect(r.modes.map((m: { check: string }) => m.check)).toEqual(['interframe shell yield', 'interframe collapse', 'overall collapse', 'frame yield']);
      for (const m of r.modes.slice(1)) expect(m.collapse.collapse).toBeLessThanOrEqual(Math.min(m.collapse.yield, m.collapse.elastic) * (1 + 1e-9));
      expect(r.weightToDisplacement === null || r.weightToDisplacement > 0).toBe(true);
    }
  });

  it.each([
    ['a frame wider than the bay', { frame: { ...hullSection.component.frame, flangeWidth: 0.6 } }, 'loadCase.component.frame.flangeWidth'],
    ['a negative out-of-roundness', { outOfRoundness: -0.002 }, 'loadCase.component.outOfRoundness'],
    ['a section that cannot exist', { frame: { shape: 'section', area: 0.002, secondMoment: 1, depth: 0.1, centroidHeight: 0.05, contactWidth: 0.01 } }, 'loadCase.component.frame.secondMoment'],
    ['frames further apart than the bulkheads', { frameSpacing: 7 }, 'loadCase.component.frameSpacing'],
  ])('returns 400 for %s, naming the field', async (_what, change, field) => {
    const res = await engineer.post('/api/evaluate').send({ loadCase: { ...hullSection, component: { ...hullSection.component, ...change } } });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });
});

describe('GET /api/pressure', () => {
  it('returns gauge pressure and the method for seawater and fresh water', async () => {
    const sea = await engineer.get('/api/pressure?depth=1000&latitude=30&water=sea');
    expect(sea.status).toBe(200);
    // TEOS-10 gsw.p_from_z(-1000, 30) = 1009.299 dbar (REFERENCES.md, [calc] via Debian's python3-gsw): 0.1 % here.
    expect(Math.abs(sea.body.pressure / 1e4 - 1009.299) / 1009.299).toBeLessThan(0.001);
    expect(sea.body.method).toMatch(/UNESCO|Saunders|Fofonoff/);
    const fresh = await engineer.get('/api/pressure?depth=1000&latitude=30&water=fresh');
    expect(fresh.body.pressure).toBeLessThan(sea.body.pressure);
  });

  it('lets a viewer convert depth, but not anonymously', async () => {
    const viewer = await signIn(handle.app, 'viewer');
    expect((await viewer.get('/api/pressure?depth=10&latitude=0&water=fresh')).status).toBe(200);
    expect((await request(handle.app).get('/api/pressure?depth=10&latitude=0&water=fresh')).status).toBe(401);
  });

  it.each([
    ['depth=-5&latitude=0&water=sea', 'depth'],
    ['depth=100&latitude=95&water=sea', 'latitude'],
    ['depth=100&latitude=0&water=brine', 'water'],
    ['depth=abc&latitude=0&water=sea', 'depth'],
    ['latitude=0&water=sea', 'depth'],
  ])('returns 400 for ?%s', async (query, field) => {
    const res = await engineer.get(`/api/pressure?${query}`);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });
});

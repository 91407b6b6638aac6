import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { FAMILIES } from '../schemas/catalogue';
import { loadCaseSchema, type Component, type LoadCaseInput } from '../schemas/evaluate';
import { modelFor } from './components/index';
import { DEFAULT_TARGET_SAFETY_FACTORS, FALLBACK_TARGET_SAFETY_FACTOR } from './defaults';
import { evaluate, evaluateCandidate, prepareLoadCase } from './evaluate';
import { pressureFromDepth } from './pressure';
import { jsonSafe } from './test-support';
import type { CandidateMaterial } from './types';

// ---------------------------------------------------------------------------------------------
// Harrow Sound demo materials (values as in REFERENCES.md "Typical properties"; demo only)
// ---------------------------------------------------------------------------------------------
const acrylic: CandidateMaterial = {
  name: 'Cast acrylic, PVHO-1 minimum properties',
  family: 'acrylic',
  density: 1190,
  youngsModulus: 2.76e9,
  poissonsRatio: 0.37,
  tensileStrength: 62e6,
  compressiveStrength: 103e6,
  compressiveYield: 103e6,
  shearStrength: 55e6,
  serviceTemperature: { min: -18, max: 66 },
  temperatureFactors: [
    { temperature: 0, factor: 1.15 },
    { temperature: 21, factor: 1 },
    { temperature: 32, factor: 0.85 },
    { temperature: 66, factor: 0.5 },
  ],
  sustainedLoadFactors: [
    { hours: 0.1, factor: 1 },
    { hours: 1000, factor: 0.6 },
    { hours: 100000, factor: 0.45 },
  ],
  cyclicFactors: [
    { cycles: 1, factor: 1 },
    { cycles: 10000, factor: 0.75 },
  ],
};
const titanium: CandidateMaterial = {
  name: 'Titanium alloy, annealed plate',
  propertySetId: 7,
  family: 'titanium-alloy',
  density: 4430,
  youngsModulus: 114e9,
  poissonsRatio: 0.31,
  tensileStrength: 896e6,
  tensileYield: 827e6,
  compressiveStrength: 896e6,
  compressiveYield: 827e6,
  shearStrength: 550e6,
};
const aluminium: CandidateMaterial = {
  name: 'Aluminium alloy 7075-T6, typical',
  propertySetId: 3,
  family: 'aluminium-alloy',
  density: 2810,
  youngsModulus: 71.7e9,
  poissonsRatio: 0.33,
  tensileStrength: 572e6,
  tensileYield: 503e6,
  compressiveStrength: 572e6,
  compressiveYield: 503e6,
  shearStrength: 331e6,
};
const sapphire: CandidateMaterial = {
  name: 'Sapphire, c-plane window grade',
  family: 'sapphire-alumina',
  density: 3980,
  youngsModulus: 345e9,
  poissonsRatio: 0.29,
  tensileStrength: 400e6,
  compressiveStrength: 2000e6,
  shearStrength: 300e6,
};
const glass: CandidateMaterial = {
  name: 'Borosilicate glass',
  family: 'glass',
  density: 2230,
  youngsModulus: 64e9,
  poissonsRatio: 0.2,
  tensileStrength: 40e6,
  compressiveStrength: 1000e6,
  shearStrength: 40e6,
};
const demo = [acrylic, titanium, aluminium, sapphire, glass];

const chamberViewport: LoadCaseInput = {
  pressure: { value: 5e5 }, // 5 bar hyperbaric treatment chamber
  temperature: { min: 15, max: 40 },
  sustainedHours: 2000,
  cycles: 3000,
  component: { type: 'flat-disc', diameter: 0.25, thickness: 0.03, edge: 'simply-supported' },
};
const cameraCone: LoadCaseInput = {
  pressure: { depth: 4000, latitude: 42, water: 'sea' }, // 4,000 m survey vehicle camera housing
  temperature: { min: 1, max: 25 },
  sustainedHours: 500,
  cycles: 400,
  component: { type: 'conical-frustum', minorDiameter: 0.05, thickness: 0.06, includedAngle: 90 },
};
const hullSphere: LoadCaseInput = {
  pressure: { depth: 1200, latitude: 56, water: 'sea' }, // two-person submersible rated to 1,200 m
  temperature: { min: 0, max: 30 },
  sustainedHours: 1000,
  cycles: 1000,
  targetSafetyFactor: 1.5,
  component: { type: 'sphere', innerRadius: 0.8, thickness: 0.03 },
};
const hullBay: LoadCaseInput = {
  pressure: { depth: 1200, latitude: 56, water: 'sea' },
  temperature: { min: 0, max: 30 },
  sustainedHours: 1000,
  cycles: 1000,
  targetSafetyFactor: 1.5,
  component: { type: 'cylinder', innerRadius: 0.8, thickness: 0.025, length: 0.7 },
};
const loadCases = { chamberViewport, cameraCone, hullSphere, hullBay };

const withThickness = (lc: LoadCaseInput, thickness: number): LoadCaseInput => ({
  ...lc,
  component: { ...lc.component, thickness } as Component,
});

describe('evaluate: result shape', () => {
  it.each(Object.entries(loadCases))('%s: finite, JSON-safe, governing mode is the lowest safety factor', (_name, lc) => {
    expect(loadCaseSchema.safeParse(lc).success).toBe(true);
    const out = evaluate({ loadCase: lc, candidates: demo });
    expect(out.total).toBe(demo.length);
    expect(out.results).toHaveLength(demo.length);
    expect(jsonSafe(out)).toBe(true);
    for (const r of out.results) {
      const lowest = r.modes.reduce((a, b) => (b.safetyFactor < a.safetyFactor ? b : a));
      expect(r.governingMode).toBe(lowest.mode);
      expect(r.safetyFactor).toBe(lowest.safetyFactor);
      expect(r.margin).toBeCloseTo(r.safetyFactor / r.targetSafetyFactor - 1, 12);
      for (const m of r.modes) {
        expect(m.stress).toBeGreaterThan(0);
        expect(m.allowable).toBeGreaterThan(0);
        expect(m.safetyFactor).toBeCloseTo(m.allowable / m.stress, 12);
        expect(m.margin).toBeCloseTo(m.safetyFactor / r.targetSafetyFactor - 1, 12);
        expect(m.model.length).toBeGreaterThan(20);
      }
      const req = r.modes.map((m) => m.requiredThickness);
      if (req.includes(null)) expect(r.requiredThickness).toBeNull();
      else expect(r.requiredThickness).toBe(Math.max(...(req as number[])));
      expect(r.massPerArea).toBe(r.requiredThickness === null ? null : r.requiredThickness * (demo.find((d) => d.name === r.name)!.density));
      const hull = lc.component.type === 'sphere' || lc.component.type === 'cylinder';
      if (!hull || r.requiredThickness === null) expect(r.weightToDisplacement).toBeNull();
      else expect(r.weightToDisplacement).toBeGreaterThan(0);
      expect(r.deflection === undefined).toBe(lc.component.type !== 'flat-disc');
    }
  });

  it('design pressure from depth, proof test pressure = design × proof factor (default 1.25)', () => {
    const out = evaluate({ loadCase: hullSphere, candidates: [titanium] });
    const p = pressureFromDepth(1200, 56, 'sea');
    expect(out.pressure).toBe(p.pressure);
    expect(out.pressureMethod).toBe(p.method);
    expect(out.proofTestPressure).toBeCloseTo(1.25 * p.pressure, 6);
    const out15 = evaluate({ loadCase: { ...hullSphere, proofFactor: 1.5 }, candidates: [titanium] });
    expect(out15.proofTestPressure).toBeCloseTo(1.5 * p.pressure, 6);
    expect(evaluate({ loadCase: chamberViewport, candidates: [] }).pressure).toBe(5e5);
  });

  it('modes per component', () => {
    const modes = (lc: LoadCaseInput) => evaluate({ loadCase: lc, candidates: [titanium] }).results[0].modes.map((m) => m.mode);
    expect(modes(chamberViewport)).toEqual(['tension', 'compression', 'shear']);
    expect(modes(cameraCone)).toEqual(['tension', 'compression', 'shear']);
    expect(modes(hullSphere)).toEqual(['compression', 'buckling']);
    expect(modes(hullBay)).toEqual(['compression', 'buckling']);
  });

  it('names which base strength each allowable used', () => {
    const r = evaluateCandidate(prepareLoadCase(chamberViewport), titanium);
    expect(r.modes[0].model).toMatch(/tensile yield/);
    expect(r.modes[1].model).toMatch(/compressive yield/);
    const g = evaluateCandidate(prepareLoadCase(chamberViewport), glass);
    expect(g.modes[0].model).toMatch(/tensile strength/);
    expect(g.modes[1].model).toMatch(/compressive strength/);
    expect(g.modes[2].model).toMatch(/shear strength/);
  });

  it('rejects non-positive pressure or sizes instead of returning non-finite numbers', () => {
    expect(() => evaluate({ loadCase: { ...chamberViewport, pressure: { value: 0 } }, candidates: [glass] })).toThrow(RangeError);
    expect(() => evaluate({ loadCase: withThickness(chamberViewport, 0), candidates: [glass] })).toThrow(RangeError);
  });
});

describe('target safety factors (common practice defaults)', () => {
  const noTarget = { ...hullSphere, targetSafetyFactor: undefined };
  it.each(demo.map((d) => [d.family!, d] as const))('%s uses its family default', (family, m) => {
    expect(evaluate({ loadCase: noTarget, candidates: [m] }).results[0].targetSafetyFactor).toBe(DEFAULT_TARGET_SAFETY_FACTORS[family]);
  });
  it('the load case target overrides the family default', () => {
    expect(evaluate({ loadCase: { ...noTarget, targetSafetyFactor: 3 }, candidates: [acrylic] }).results[0].targetSafetyFactor).toBe(3);
  });
  it('an inline candidate without family gets the most cautious default, with a warning', () => {
    const r = evaluate({ loadCase: noTarget, candidates: [{ ...titanium, family: undefined }] }).results[0];
    expect(FALLBACK_TARGET_SAFETY_FACTOR).toBe(Math.max(...Object.values(DEFAULT_TARGET_SAFETY_FACTORS)));
    expect(r.targetSafetyFactor).toBe(FALLBACK_TARGET_SAFETY_FACTOR);
    expect(r.warnings.some((w) => /No family given/.test(w))).toBe(true);
    expect(r.family).toBeUndefined();
  });
  it('every family has a positive default', () => {
    for (const f of FAMILIES) expect(DEFAULT_TARGET_SAFETY_FACTORS[f]).toBeGreaterThan(0);
  });
});

describe('required thickness', () => {
  const cases = Object.entries(loadCases).flatMap(([name, lc]) => demo.map((m) => [name, m.name, lc, m] as const));
  it.each(cases)('%s, %s: evaluating at the required thickness meets the target within 0.5 %', (_n, _m, lc, m) => {
    const r = evaluate({ loadCase: lc, candidates: [m] }).results[0];
    if (r.requiredThickness === null) {
      expect(r.modes.some((x) => x.requiredThickness === null)).toBe(true);
      expect(r.warnings.some((w) => /No thickness of this material meets the target/.test(w))).toBe(true);
      return;
    }
    const again = evaluateCandidate(prepareLoadCase(withThickness(lc, r.requiredThickness)), m);
    expect(Math.abs(again.safetyFactor / r.targetSafetyFactor - 1)).toBeLessThan(0.005);
    // and each mode at its own required thickness meets the target for that mode
    r.modes.forEach((mode, i) => {
      if (mode.requiredThickness === null) return;
      const at = evaluateCandidate(prepareLoadCase(withThickness(lc, mode.requiredThickness)), m);
      expect(Math.abs(at.modes[i].safetyFactor / r.targetSafetyFactor - 1)).toBeLessThan(0.005);
    });
  });

  it('acrylic cone at 4,000 m: the seat no longer caps the pressure, a thickness is found (Stachiw: 20,000 psi cones are built)', () => {
    const r = evaluate({ loadCase: cameraCone, candidates: [acrylic] }).results[0];
    expect(r.requiredThickness).not.toBeNull();
    expect(r.sizedBy).toEqual({ kind: 'mode', mode: r.modes.reduce((a, b) => ((b.requiredThickness ?? 0) > (a.requiredThickness ?? 0) ? b : a)).mode });
  });

  it('a sphere whose allowable cannot reach 1.5·p at the target has no thickness: null with a warning', () => {
    const weak = { ...aluminium, name: 'Weak alloy', compressiveYield: 10e6, compressiveStrength: 10e6 };
    const r = evaluate({ loadCase: hullSphere, candidates: [weak] }).results[0];
    expect(r.requiredThickness).toBeNull();
    expect(r.sizedBy).toBeNull();
    expect(r.massPerArea).toBeNull();
  });
});

// ---------------------------------------------------------------------------------------------
// Properties
// ---------------------------------------------------------------------------------------------
const dbl = (min: number, max: number) => fc.double({ min, max, noNaN: true, noDefaultInfinity: true });
const componentArb: fc.Arbitrary<Component> = fc.oneof(
  fc.record({
    type: fc.constant('flat-disc' as const),
    diameter: dbl(0.005, 5),
    thickness: dbl(0.0005, 1),
    edge: fc.constantFrom('simply-supported' as const, 'clamped' as const),
  }),
  fc.record({
    type: fc.constant('conical-frustum' as const),
    minorDiameter: dbl(0.005, 2),
    thickness: dbl(0.0005, 2),
    includedAngle: dbl(30, 180),
  }),
  fc.record({ type: fc.constant('spherical-sector' as const), innerRadius: dbl(0.01, 2), thickness: dbl(0.0005, 1), includedAngle: dbl(30, 180) }),
  fc
    .record({ minorDiameter: dbl(0.005, 2), thickness: dbl(0.0005, 2), seat: dbl(1.01, 3) })
    .map(({ minorDiameter, thickness, seat }) => ({ type: 'conical-frustum' as const, minorDiameter, thickness, includedAngle: 180, seatOuterDiameter: minorDiameter * seat })),
  fc.record({
    type: fc.constant('sphere' as const),
    innerRadius: dbl(0.02, 10),
    thickness: dbl(0.0002, 2),
    fabrication: fc.constantFrom('fabricated' as const, 'machined' as const),
    localRadiusRatio: fc.option(dbl(1, 3), { nil: undefined }),
  }),
  fc.record({ type: fc.constant('cylinder' as const), innerRadius: dbl(0.02, 10), thickness: dbl(0.0002, 2), length: dbl(0.02, 50), outOfRoundness: fc.option(dbl(0, 0.05), { nil: undefined }) }),
  fc
    .record({ ri: dbl(0.2, 5), tOverR: dbl(0.005, 0.1), spacing: dbl(0.05, 2), web: dbl(0.02, 0.5), bays: fc.integer({ min: 1, max: 40 }), oor: dbl(0, 0.02), outside: fc.boolean() })
    .map(({ ri, tOverR, spacing, web, bays, oor, outside }) => ({
      type: 'ring-stiffened-cylinder' as const,
      innerRadius: ri,
      thickness: ri * tOverR,
      frameSpacing: spacing,
      frame: { shape: 'tee' as const, webHeight: Math.min(web, 0.25 * ri), webThickness: spacing / 10, flangeWidth: spacing / 4, flangeThickness: Math.min(spacing / 20, 0.1 * ri) },
      framePosition: outside ? ('external' as const) : ('internal' as const),
      length: spacing * bays,
      outOfRoundness: oor,
    })),
);
const curveArb = <K extends string>(key: K, lo: number, hi: number) =>
  fc.array(fc.record({ [key]: dbl(lo, hi), factor: dbl(0.05, 2) } as Record<K | 'factor', fc.Arbitrary<number>>), { maxLength: 6 });
const materialArb: fc.Arbitrary<CandidateMaterial> = fc.record({
  name: fc.string({ minLength: 1, maxLength: 12 }),
  family: fc.option(fc.constantFrom(...FAMILIES), { nil: undefined }),
  density: dbl(50, 25000),
  youngsModulus: dbl(1e7, 1e12),
  poissonsRatio: dbl(-0.5, 0.499),
  tensileStrength: dbl(1e5, 5e9),
  tensileYield: fc.option(dbl(1e5, 5e9), { nil: undefined }),
  compressiveStrength: dbl(1e5, 5e9),
  compressiveYield: fc.option(dbl(1e5, 5e9), { nil: undefined }),
  shearStrength: dbl(1e5, 5e9),
  temperatureFactors: curveArb('temperature', -60, 200) as fc.Arbitrary<{ temperature: number; factor: number }[]>,
  sustainedLoadFactors: curveArb('hours', 0, 1e6) as fc.Arbitrary<{ hours: number; factor: number }[]>,
  cyclicFactors: curveArb('cycles', 0, 1e7) as fc.Arbitrary<{ cycles: number; factor: number }[]>,
});
const loadCaseArb: fc.Arbitrary<LoadCaseInput> = fc
  .record({
    pressure: fc.oneof(
      fc.record({ value: dbl(1, 2e9) }),
      fc.record({ depth: dbl(0.01, 12000), latitude: dbl(-90, 90), water: fc.constantFrom('sea' as const, 'fresh' as const) }),
    ),
    tMin: dbl(-50, 100),
    tSpan: dbl(0, 80),
    sustainedHours: dbl(0, 1e6),
    cycles: fc.integer({ min: 0, max: 1e9 }),
    targetSafetyFactor: fc.option(dbl(0.5, 20), { nil: undefined }),
    component: componentArb,
  })
  .map(({ tMin, tSpan, ...rest }) => ({ ...rest, temperature: { min: tMin, max: tMin + tSpan } }));

describe('properties (fast-check)', () => {
  it('random valid load cases give finite, positive, JSON-safe results', () => {
    fc.assert(
      fc.property(loadCaseArb, fc.array(materialArb, { minLength: 1, maxLength: 4 }), (lc, mats) => {
        expect(loadCaseSchema.safeParse(lc).success).toBe(true);
        const out = evaluate({ loadCase: lc, candidates: mats });
        expect(jsonSafe(out)).toBe(true);
        expect(out.pressure).toBeGreaterThan(0);
        for (const r of out.results) {
          expect(r.safetyFactor).toBeGreaterThan(0);
          expect(r.requiredThickness === null || r.requiredThickness > 0).toBe(true);
          for (const m of r.modes) {
            expect(m.stress).toBeGreaterThan(0);
            expect(m.allowable).toBeGreaterThan(0);
            expect(m.requiredThickness === null || m.requiredThickness > 0).toBe(true);
          }
        }
      }),
      { numRuns: 300 },
    );
  });

  it('thicker is never weaker: every component, every mode', () => {
    const stress = new Float64Array(4);
    const allowable = new Float64Array(4);
    fc.assert(
      fc.property(componentArb, materialArb, dbl(1e3, 2e8), dbl(1, 50), (component, mat, p, growth) => {
        const model = modelFor(component);
        const mm = {
          E: mat.youngsModulus,
          nu: mat.poissonsRatio,
          tension: mat.tensileStrength,
          compression: mat.compressiveStrength,
          shear: mat.shearStrength,
          tensionOnYield: false,
          compressionOnYield: false,
        };
        const t = component.thickness;
        model.fill(component, t, p, mm, stress, allowable);
        const before = model.modes.map((_, i) => allowable[i] / stress[i]);
        model.fill(component, t * growth, p, mm, stress, allowable);
        // Bryant's frame term (n² − 1)·E·Ie/(R³·Lf) takes the mean radius, which grows with the shell: for frames far
        // stiffer than the plating a thicker shell can lower the overall pressure by parts in a million — noise, not weakness.
        const slack = component.type === 'ring-stiffened-cylinder' ? 1e-5 : 1e-9;
        model.modes.forEach((mode, i) => {
          expect(allowable[i] / stress[i], `${component.type} ${mode}`).toBeGreaterThanOrEqual(before[i] * (1 - slack));
        });
      }),
      { numRuns: 2000 },
    );
  });

  it('re-evaluating at the reported required thickness meets the target within 0.5 %', () => {
    fc.assert(
      fc.property(loadCaseArb, materialArb, (lc, mat) => {
        const r = evaluateCandidate(prepareLoadCase(lc), mat);
        if (r.requiredThickness === null) return;
        const again = evaluateCandidate(prepareLoadCase(withThickness(lc, r.requiredThickness)), mat);
        expect(Math.abs(again.safetyFactor / r.targetSafetyFactor - 1)).toBeLessThan(0.005);
      }),
      { numRuns: 500 },
    );
  });

  it('hotter, longer and more cycles are never stronger for a polymer with decreasing factor data', () => {
    fc.assert(
      fc.property(componentArb, dbl(-20, 60), dbl(0, 30), dbl(0, 1e5), fc.integer({ min: 0, max: 1e6 }), (component, t0, dt, h, n) => {
        const lc = (tMin: number, hours: number, cycles: number): LoadCaseInput => ({
          pressure: { value: 2e6 },
          temperature: { min: tMin, max: tMin + 5 },
          sustainedHours: hours,
          cycles,
          component,
        });
        const a = evaluate({ loadCase: lc(t0, h, n), candidates: [acrylic] }).results[0];
        const b = evaluate({ loadCase: lc(t0 + dt, h * 3 + 1, n * 2 + 1), candidates: [acrylic] }).results[0];
        expect(b.safetyFactor).toBeLessThanOrEqual(a.safetyFactor * (1 + 1e-12));
      }),
      { numRuns: 300 },
    );
  });
});

describe('ranking and limit', () => {
  const names = (out: ReturnType<typeof evaluate>) => out.results.map((r) => r.name);
  it.each(['margin', 'requiredThickness', 'massPerArea', 'weightToDisplacement'] as const)('sortBy %s orders best first', (sortBy) => {
    const out = evaluate({ loadCase: hullSphere, candidates: demo, sortBy });
    const key = (r: (typeof out.results)[number]) =>
      sortBy === 'margin' ? -r.margin : (r[sortBy] ?? Number.POSITIVE_INFINITY);
    for (let i = 1; i < out.results.length; i++) expect(key(out.results[i - 1])).toBeLessThanOrEqual(key(out.results[i]));
  });

  it('nulls sort last for ascending keys; flat discs have no weight-to-displacement', () => {
    const weak = { ...aluminium, name: 'Weak alloy', compressiveYield: 10e6, compressiveStrength: 10e6 };
    const out = evaluate({ loadCase: hullSphere, candidates: [...demo, weak], sortBy: 'requiredThickness' });
    const firstNull = out.results.findIndex((r) => r.requiredThickness === null);
    expect(firstNull).toBeGreaterThan(-1);
    expect(out.results.slice(firstNull).every((r) => r.requiredThickness === null)).toBe(true);
    const byWtd = evaluate({ loadCase: chamberViewport, candidates: demo, sortBy: 'weightToDisplacement' });
    expect(byWtd.results.every((r) => r.weightToDisplacement === null)).toBe(true);
    expect(names(byWtd)).toEqual([...names(byWtd)].sort()); // all null: by name
  });

  it('ties break by name, then property set id, deterministically', () => {
    const twins = [
      { ...titanium, name: 'B', propertySetId: 2 },
      { ...titanium, name: 'A', propertySetId: 9 },
      { ...titanium, name: 'B', propertySetId: 1 },
      { ...titanium, name: 'A', propertySetId: undefined },
    ];
    const out = evaluate({ loadCase: hullSphere, candidates: twins });
    expect(out.results.map((r) => `${r.name}${r.propertySetId ?? ''}`)).toEqual(['A9', 'A', 'B1', 'B2']);
  });

  it('limit caps the results; total counts all evaluated; the kept ones are the best', () => {
    const many: CandidateMaterial[] = Array.from({ length: 300 }, (_, i) => ({
      ...aluminium,
      name: `Aluminium lot ${String(i).padStart(3, '0')}`,
      propertySetId: i + 1,
      tensileYield: 300e6 + ((i * 7919) % 300) * 1e6,
      compressiveYield: 300e6 + ((i * 104729) % 300) * 1e6,
    }));
    for (const sortBy of ['margin', 'requiredThickness', 'massPerArea', 'weightToDisplacement'] as const) {
      const all = evaluate({ loadCase: hullBay, candidates: many, sortBy, limit: 5000 });
      const top = evaluate({ loadCase: hullBay, candidates: many, sortBy, limit: 17 });
      expect(all.total).toBe(300);
      expect(top.total).toBe(300);
      expect(top.results).toHaveLength(17);
      expect(names(top)).toEqual(names(all).slice(0, 17));
    }
    expect(evaluate({ loadCase: hullBay, candidates: many }).results).toHaveLength(100); // default limit
  });

  it('ranking by margin builds full results only for the kept candidates, identical to ranking them all', () => {
    const many: CandidateMaterial[] = Array.from({ length: 200 }, (_, i) => ({
      ...[acrylic, titanium, aluminium][i % 3],
      name: `Harrow lot ${String(i).padStart(3, '0')}`,
      propertySetId: i + 1,
      youngsModulus: [acrylic, titanium, aluminium][i % 3].youngsModulus * (0.9 + (i % 20) / 100),
      shearStrength: [acrylic, titanium, aluminium][i % 3].shearStrength * (0.9 + (i % 13) / 60),
    }));
    for (const loadCase of [chamberViewport, cameraCone, hullSphere, hullBay]) {
      const fast = evaluate({ loadCase, candidates: many, limit: 25 });
      const reference = evaluate({ loadCase, candidates: many, limit: 1000 }).results.slice(0, 25);
      expect(fast.total).toBe(200);
      expect(fast.results).toEqual(reference);
    }
  });
});

describe('life factors combined once, and the proof test', () => {
  it('the allowable carries the lower of the sustained-load and cyclic factors, not their product', () => {
    // acrylic demo curves: 1000 h → 0.6 (sustained), 2000 cycles → between 1 and 0.75 in log10 (cyclic)
    const lc: LoadCaseInput = { ...chamberViewport, temperature: { min: 21, max: 21 }, sustainedHours: 1000, cycles: 2000 };
    const r = evaluate({ loadCase: lc, candidates: [acrylic] }).results[0];
    expect(r.factors.life).toBeCloseTo(Math.min(r.factors.sustainedLoad, r.factors.cyclic), 12);
    expect(r.factors.lifeBasis).toBe('sustained-load');
    expect(r.modes[0].allowable).toBeCloseTo(62e6 * r.factors.temperature * r.factors.life, 0);
    expect(r.modes[0].allowable).toBeGreaterThan(62e6 * r.factors.temperature * r.factors.sustainedLoad * r.factors.cyclic);
    expect(r.modes[0].model).toMatch(/lower of the sustained-load and cyclic factors, not their product/);
  });

  it('every mode is reported at the proof-test pressure against short-term strength (no life factor)', () => {
    for (const lc of Object.values(loadCases)) {
      const out = evaluate({ loadCase: lc, candidates: [acrylic, titanium] });
      for (const r of out.results) {
        for (const m of r.modes) {
          expect(m.proof.safetyFactor).toBeCloseTo(m.proof.allowable / m.proof.stress, 12);
          expect(m.proof.allowable).toBeGreaterThanOrEqual(m.allowable * (1 - 1e-12));
        }
        expect(r.proofSafetyFactor).toBe(Math.min(...r.modes.map((m) => m.proof.safetyFactor)));
      }
    }
    // linear models: proof stress = design stress × proof factor
    const r = evaluate({ loadCase: { ...chamberViewport, proofFactor: 1.5 }, candidates: [titanium] }).results[0];
    r.modes.forEach((m) => expect(m.proof.stress).toBeCloseTo(1.5 * m.stress, 3));
  });

  it('warns when the proof test itself would fail the part', () => {
    const thin = evaluate({ loadCase: withThickness(chamberViewport, 0.003), candidates: [acrylic] }).results[0];
    expect(thin.proofSafetyFactor).toBeLessThan(1);
    expect(thin.warnings.some((w) => /proof-test pressure/.test(w) && /below 1/.test(w))).toBe(true);
    const fine = evaluate({ loadCase: chamberViewport, candidates: [titanium] }).results[0];
    expect(fine.warnings.some((w) => /proof-test pressure/.test(w))).toBe(false);
  });

  it('says what sets the thickness: the mode with the largest required thickness', () => {
    const r = evaluate({ loadCase: hullBay, candidates: [aluminium] }).results[0];
    const largest = r.modes.reduce((a, b) => (b.requiredThickness! > a.requiredThickness! ? b : a));
    expect(r.sizedBy).toEqual({ kind: 'mode', mode: largest.mode });
  });
});

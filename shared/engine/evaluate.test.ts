import { describe, expect, it } from 'vitest';
import { FAMILIES } from '../schemas/catalogue';
import { loadCaseSchema, type LoadCaseInput } from '../schemas/evaluate';
import { DEFAULT_TARGET_SAFETY_FACTORS, FALLBACK_TARGET_SAFETY_FACTOR } from './defaults';
import { evaluate, evaluateCandidate, prepareLoadCase } from './evaluate';
import { cameraCone, chamberViewport, hullBay, hullSphere, loadCases, withThickness } from './evaluate-fixtures';
import { pressureFromDepth } from './pressure';
import { aluminium, demo, glass, pvhoAcrylic as acrylic, titanium } from './test-materials';
import { jsonSafe } from './test-support';
import type { CandidateMaterial } from './types';

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

describe('evaluate: targets by family', () => {
  const noTarget: LoadCaseInput = { ...chamberViewport, targetSafetyFactor: undefined };

  it('holds a family to the load case’s own target and the others to their common-practice default', () => {
    const out = evaluate({ loadCase: { ...noTarget, familyTargets: { acrylic: 6 } }, candidates: [acrylic, glass] });
    const byName = new Map(out.results.map((r) => [r.name, r]));
    expect(byName.get(acrylic.name)!.targetSafetyFactor).toBe(6);
    expect(byName.get(acrylic.name)!.margin).toBeCloseTo(byName.get(acrylic.name)!.safetyFactor / 6 - 1, 12);
    expect(byName.get(glass.name)!.targetSafetyFactor).toBe(DEFAULT_TARGET_SAFETY_FACTORS.glass);
  });

  it('lets the one target of the load case win over family targets', () => {
    const out = evaluate({ loadCase: { ...noTarget, targetSafetyFactor: 3, familyTargets: { acrylic: 6 } }, candidates: [acrylic] });
    expect(out.results[0].targetSafetyFactor).toBe(3);
  });

  it('refuses a family target that is not a positive number, and warns below 1', () => {
    expect(loadCaseSchema.safeParse({ ...noTarget, familyTargets: { acrylic: 0 } }).success).toBe(false);
    expect(loadCaseSchema.safeParse({ ...noTarget, familyTargets: { wood: 2 } }).success).toBe(false);
    const out = evaluate({ loadCase: { ...noTarget, familyTargets: { acrylic: 0.8 } }, candidates: [acrylic] });
    expect(out.results[0].warnings.some((w) => /0\.8 set for acrylic is below 1/.test(w))).toBe(true);
  });
});

import { describe, expect, it } from 'vitest';
import type { LoadCaseInput } from '../schemas/evaluate';
import { flatDiscBendingCoefficient } from './components/flat-disc';
import { evaluateCandidate, prepareLoadCase } from './evaluate';
import { sweepThickness } from './sweep';
import type { CandidateMaterial } from './types';

const viewport: LoadCaseInput = {
  pressure: { value: 5e5 }, // Harrow Sound 5 bar chamber viewport
  temperature: { min: 15, max: 35 },
  sustainedHours: 0,
  cycles: 0,
  component: { type: 'flat-disc', diameter: 0.2, thickness: 0.03, edge: 'clamped' },
};
const material: CandidateMaterial = {
  name: 'Harrow Sound test disc material',
  family: 'polycarbonate',
  density: 1200,
  youngsModulus: 2.4e9,
  poissonsRatio: 0.37,
  tensileStrength: 62e6,
  compressiveStrength: 86e6,
  shearStrength: 10e6,
  temperatureFactors: [{ temperature: 20, factor: 1 }],
};

describe('sweepThickness', () => {
  it('gives every mode at every thickness, consistent with evaluateCandidate', () => {
    const s = sweepThickness(viewport, material, { from: 0.005, to: 0.2, steps: 40 });
    expect(s.thickness).toHaveLength(41);
    expect(s.thickness[0]).toBe(0.005);
    expect(s.thickness[40]).toBe(0.2);
    expect(s.series.map((x) => x.mode)).toEqual(['tension', 'compression', 'shear']);
    for (const k of [0, 17, 40]) {
      const lc = { ...viewport, component: { ...viewport.component, thickness: s.thickness[k] } } as LoadCaseInput;
      const r = evaluateCandidate(prepareLoadCase(lc), material);
      s.series.forEach((series, i) => expect(series.safetyFactor[k]).toBeCloseTo(r.modes[i].safetyFactor, 10));
      expect(s.governing[k]).toBe(r.governingMode);
    }
    expect(s.targetSafetyFactor).toBe(4);
  });

  it('finds where shear takes over from bending, at the analytical cross-over', () => {
    // common practice: bending ∝ 1/t², shear ∝ 1/t; equal at t* = k·D·Ss/St (see flat-disc tests)
    const tStar = flatDiscBendingCoefficient('clamped', 0.37) * 0.2 * (10e6 / 62e6);
    for (const spacing of ['linear', 'log'] as const) {
      const s = sweepThickness(viewport, material, { from: 0.005, to: 0.2, steps: 25, spacing });
      expect(s.governingTransitions).toHaveLength(1);
      const [tr] = s.governingTransitions;
      expect(tr.from).toBe('tension');
      expect(tr.to).toBe('shear');
      expect(Math.abs(tr.thickness / tStar - 1)).toBeLessThan(1e-9);
    }
  });

  it('a hull sphere is governed by its collapse at every thickness (collapse includes yield), and marks where thin-shell buckling stops holding', () => {
    const s = sweepThickness(
      {
        pressure: { depth: 1200, latitude: 56, water: 'sea' },
        temperature: { min: 0, max: 30 },
        sustainedHours: 0,
        cycles: 0,
        component: { type: 'sphere', innerRadius: 0.8, thickness: 0.03 },
      },
      { ...material, name: 'Titanium alloy (demo)', family: 'titanium-alloy', youngsModulus: 114e9, poissonsRatio: 0.31, compressiveStrength: 827e6 },
      { from: 0.002, to: 0.3, steps: 60, spacing: 'log' },
    );
    expect(s.governing.every((g) => g === 'buckling')).toBe(true);
    expect(s.governingTransitions).toHaveLength(0);
    const buckling = s.series[1];
    // t/R > 0.1 (common practice): the buckling curve is marked outside its range there
    s.thickness.forEach((t, k) => expect(buckling.valid[k]).toBe(t / (0.8 + t / 2) <= 0.1));
    expect(buckling.invalidReason).toMatch(/thin-shell/);
    expect(s.series[0].valid.every(Boolean)).toBe(true);
  });

  it.each([
    [{ from: 0, to: 1, steps: 10 }],
    [{ from: 0.1, to: 0.1, steps: 10 }],
    [{ from: 0.1, to: 1, steps: 0 }],
    [{ from: 0.1, to: 1, steps: 5000 }],
    [{ from: 0.1, to: Number.POSITIVE_INFINITY, steps: 10 }],
  ])('rejects a bad range %j', (opts) => {
    expect(() => sweepThickness(viewport, material, opts)).toThrow(RangeError);
  });
});

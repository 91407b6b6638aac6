import { describe, expect, it } from 'vitest';
import { evaluate } from '../evaluate';
import { shortTerm } from '../evaluate-fixtures';
import { PSI } from '../test-support';
import { acrylicLotMinimums } from '../test-materials';
import type { CandidateMaterial } from '../types';
import { edgeShearStress, flatDiscBendingCoefficient, flatDiscBendingStress, flatDiscDeflection, flatDiscModel } from './flat-disc';

const IN = 0.0254; // m per inch (exact)

describe("Roark's Table 11.2 worked example (steel plate, SI)", () => {
  // Source: Roark's Formulas for Stress and Strain, 7th ed. (Young & Budynas 2002), Table 11.2,
  // uniform load on a solid circular plate; worked values computed from the published formulas
  // (REFERENCES.md [calc]): a = 10 in, t = 0.5 in, q = 100 psi, E = 30e6 psi, ν = 0.3.
  const a = 10 * IN;
  const t = 0.5 * IN;
  const q = 100 * PSI;
  const E = 30e6 * PSI;
  it.each([
    { edge: 'simply-supported' as const, stressPsi: 49500, deflectionIn: 0.1855 },
    { edge: 'clamped' as const, stressPsi: 30000, deflectionIn: 0.0455 },
  ])('$edge: $stressPsi psi, $deflectionIn in', ({ edge, stressPsi, deflectionIn }) => {
    const s = flatDiscBendingStress(edge, q, a, t, 0.3);
    const y = flatDiscDeflection(edge, q, a, t, E, 0.3);
    expect(Math.abs(s / (stressPsi * PSI) - 1)).toBeLessThan(0.01);
    // deflections are given to 3–4 figures: 1 % tolerance
    expect(Math.abs(y / (deflectionIn * IN) - 1)).toBeLessThan(0.01);
  });
});

describe('edge shear', () => {
  it('10 MPa over D = 100 mm with t = 20 mm → 12.5 MPa', () => {
    // Source: force balance q·πD²/4 = τ·πD·t (REFERENCES.md [calc]).
    expect(edgeShearStress(10e6, 0.1, 0.02)).toBeCloseTo(12.5e6, 6);
  });
});

describe('scaling (common practice)', () => {
  const stress = new Float64Array(4);
  const allowable = new Float64Array(4);
  const m = { E: 3e9, nu: 0.37, tension: 60e6, compression: 100e6, shear: 50e6, tensionOnYield: false, compressionOnYield: false };
  it.each(['simply-supported', 'clamped'] as const)('%s: double the thickness → bending ¼, shear ½', (edge) => {
    const g = { type: 'flat-disc' as const, diameter: 0.3, thickness: 0.02, edge };
    flatDiscModel.fill(g, 0.02, 1e6, m, stress, allowable);
    const [b1, , s1] = stress;
    flatDiscModel.fill(g, 0.04, 1e6, m, stress, allowable);
    expect(stress[0] / b1).toBeCloseTo(0.25, 12);
    expect(stress[1] / b1).toBeCloseTo(0.25, 12);
    expect(stress[2] / s1).toBeCloseTo(0.5, 12);
  });
});

describe('past the thickness set by the shear-to-tensile strength ratio, shear governs', () => {
  // Common practice (PRODUCT.md): bending ∝ 1/t², shear ∝ 1/t. Equal safety factors where
  // St·t²/(k·q·a²) = Ss·4t/(q·D), i.e. t* = k·D·Ss/St with a = D/2.
  const material: CandidateMaterial = {
    name: 'Harrow Sound test disc material',
    density: 1200,
    youngsModulus: 3e9,
    poissonsRatio: 0.35,
    tensileStrength: 60e6,
    compressiveStrength: 200e6, // strong in compression so bending governs as tension
    shearStrength: 12e6,
  };
  it.each(['simply-supported', 'clamped'] as const)('%s edge', (edge) => {
    const D = 0.2;
    const tStar = flatDiscBendingCoefficient(edge, 0.35) * D * (12e6 / 60e6);
    const at = (t: number) =>
      evaluate({
        loadCase: {
          pressure: { value: 5e5 },
          temperature: { min: 10, max: 30 },
          sustainedHours: 0,
          cycles: 0,
          targetSafetyFactor: 4,
          component: { type: 'flat-disc', diameter: D, thickness: t, edge },
        },
        candidates: [material],
      }).results[0];
    expect(at(0.9 * tStar).governingMode).toBe('tension');
    expect(at(1.1 * tStar).governingMode).toBe('shear');
    const r = at(tStar);
    const [tension, , shear] = r.modes;
    expect(tension.safetyFactor / shear.safetyFactor).toBeCloseTo(1, 10);
  });
});

describe('validity warnings', () => {
  // The lot-minimum acrylic (test-materials.ts) with its compressive value as a strength only and a
  // flat temperature curve at 20 °C.
  const acrylic: CandidateMaterial = { ...acrylicLotMinimums, compressiveYield: undefined, temperatureFactors: [{ temperature: 20, factor: 1 }] };
  const run = (diameter: number, thickness: number, pressure: number) =>
    evaluate({
      loadCase: shortTerm(pressure, { type: 'flat-disc', diameter, thickness, edge: 'simply-supported' }, 20),
      candidates: [acrylic],
    }).results[0];

  it('reports the centre deflection and warns when it exceeds half the thickness', () => {
    const thin = run(0.5, 0.01, 5e5); // 5 bar chamber viewport, far too thin
    expect(thin.deflection).toBeCloseTo(flatDiscDeflection('simply-supported', 5e5, 0.25, 0.01, 2.76e9, 0.37), 12);
    expect(thin.deflection!).toBeGreaterThan(0.005);
    expect(thin.warnings.some((w) => /more than half the thickness/.test(w))).toBe(true);
    const stiff = run(0.2, 0.04, 5e5);
    expect(stiff.deflection!).toBeLessThan(0.02);
    expect(stiff.warnings.some((w) => /half the thickness/.test(w))).toBe(false);
  });

  it('warns for a thick plate (t > D/4) and not below it', () => {
    expect(run(0.1, 0.03, 5e5).warnings.some((w) => /thick plate/.test(w))).toBe(true);
    expect(run(0.1, 0.02, 5e5).warnings.some((w) => /thick plate/.test(w))).toBe(false);
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { evaluate } from '../evaluate';
import { everyNumberFinite } from '../test-support';
import type { CandidateMaterial } from '../types';
import { conicalFrustumModel, CONICAL_FRUSTUM_WARNING, majorDiameter, seatBearingStress } from './conical-frustum';

/**
 * Acrylic at ASME PVHO-1 minimum properties as transcribed in UFC 4-159-01 Tables 3-1, 3-2:
 * tensile 62 MPa, compressive yield 103 MPa, shear 55 MPa, modulus 2,760 MPa, specific gravity
 * 1.19 [pub]. Poisson's ratio 0.37 is a typical value [memory].
 */
const pvhoAcrylic: CandidateMaterial = {
  name: 'Cast acrylic, PVHO-1 minimum properties',
  family: 'acrylic',
  density: 1190,
  youngsModulus: 2.76e9,
  poissonsRatio: 0.37,
  tensileStrength: 62e6,
  compressiveStrength: 103e6,
  compressiveYield: 103e6,
  shearStrength: 55e6,
  temperatureFactors: [{ temperature: 21, factor: 1 }],
};
const PSI = 6894.757293168;

function cone(minorDiameter: number, thickness: number, includedAngle: number, pressure: number, m = pvhoAcrylic) {
  return evaluate({
    loadCase: {
      pressure: { value: pressure },
      temperature: { min: 21, max: 21 },
      sustainedHours: 0,
      cycles: 0,
      component: { type: 'conical-frustum', minorDiameter, thickness, includedAngle },
    },
    candidates: [m],
  }).results[0];
}

describe('conical frustum geometry and bearing', () => {
  it('major diameter Do = Di + 2t·tan(α/2)', () => {
    expect(majorDiameter(0.1, 0.05, 90)).toBeCloseTo(0.2, 12);
    expect(majorDiameter(0.1, 0.05, 60)).toBeCloseTo(0.1 + 0.1 * Math.tan(Math.PI / 6), 12);
  });

  it('seat bearing p·Do²/(Do² − Di²) from the force balance', () => {
    // Do = 0.2, Di = 0.1 → 4/3 of p
    expect(seatBearingStress(9e6, 0.1, 0.05, 90)).toBeCloseTo(12e6, 3);
  });

  it('handles 180° (flat seat) without NaN: bearing tends to p', () => {
    expect(seatBearingStress(9e6, 0.1, 0.05, 180)).toBe(9e6);
    const r = cone(0.1, 0.05, 180, 5e6);
    for (const m of r.modes) {
      expect(Number.isFinite(m.stress)).toBe(true);
      expect(Number.isFinite(m.safetyFactor)).toBe(true);
      expect(m.requiredThickness === null || Number.isFinite(m.requiredThickness)).toBe(true);
    }
    expect(everyNumberFinite(r)).toBe(true);
  });

  it('always carries the approximation warning', () => {
    expect(cone(0.1, 0.05, 90, 5e6).warnings).toContain(CONICAL_FRUSTUM_WARNING);
  });
});

describe('thicker cones carry more pressure (trend of Stachiw 1972, J. Eng. Ind. 94)', () => {
  it('every mode’s safety factor is non-decreasing in thickness (fast-check)', () => {
    const stress = new Float64Array(4);
    const allowable = new Float64Array(4);
    fc.assert(
      fc.property(
        fc.double({ min: 0.005, max: 2, noNaN: true }),
        fc.double({ min: 30, max: 180, noNaN: true }),
        fc.double({ min: 1e-4, max: 3, noNaN: true }),
        fc.double({ min: 1, max: 20, noNaN: true }),
        fc.double({ min: 1e4, max: 2e8, noNaN: true }),
        fc.double({ min: 0, max: 0.49, noNaN: true }),
        (Di, angle, tOverD, growth, p, nu) => {
          const g = { type: 'conical-frustum' as const, minorDiameter: Di, thickness: Di * tOverD, includedAngle: angle };
          const m = { E: 3e9, nu, tension: 60e6, compression: 100e6, shear: 50e6, tensionOnYield: false, compressionOnYield: false };
          const t1 = Di * tOverD;
          conicalFrustumModel.fill(g, t1, p, m, stress, allowable);
          const sf1 = [0, 1, 2].map((i) => allowable[i] / stress[i]);
          conicalFrustumModel.fill(g, t1 * growth, p, m, stress, allowable);
          [0, 1, 2].forEach((i) => {
            expect(allowable[i] / stress[i]).toBeGreaterThanOrEqual(sf1[i] * (1 - 1e-12));
          });
        },
      ),
    );
  });

  it("ranks sensibly against Stachiw's long-term guidance for 90° acrylic cones", () => {
    // Source: Stachiw, J. Eng. Ind. 94 (1972), as summarised in REFERENCES.md [pub]:
    // t/Di ≥ 0.625 for 5,000 psi and t/Di ≥ 1.0 for 10,000 psi general (long-term) service.
    // Honest check, no constant fitted: at PVHO-1 minimum properties the model gives short-term
    // safety factors of about 2.2 (5,000 psi, t/Di = 0.625; minor-face bending governs) and about
    // 1.3 (10,000 psi, t/Di = 1.0; seat bearing governs). So the model does not call the
    // guidance points failures (SF > 1), nor absurdly strong (SF < 10), but it IS more cautious
    // than the guidance: at the family default target of 4 it would demand thicker cones, and near
    // 10,000 psi the uniaxial compressive yield caps seat bearing (the real seat is triaxially
    // confined). Hence the approximation warning and the deferral to the standard's tables.
    const at5k = cone(0.1, 0.0625, 90, 5000 * PSI);
    const at10k = cone(0.1, 0.1, 90, 10000 * PSI);
    for (const r of [at5k, at10k]) {
      expect(r.safetyFactor).toBeGreaterThan(1);
      expect(r.safetyFactor).toBeLessThan(10);
    }
    expect(at5k.governingMode).toBe('tension');
    expect(at10k.governingMode).toBe('compression');
    // Thinner than the guidance at the same pressure ranks lower; thicker ranks higher.
    expect(cone(0.1, 0.04, 90, 5000 * PSI).safetyFactor).toBeLessThan(at5k.safetyFactor);
    expect(cone(0.1, 0.08, 90, 5000 * PSI).safetyFactor).toBeGreaterThan(at5k.safetyFactor);
  });
});

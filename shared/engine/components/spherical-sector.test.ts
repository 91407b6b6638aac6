import { describe, expect, it } from 'vitest';
import { evaluate } from '../evaluate';
import { shortTerm } from '../evaluate-fixtures';
import { PSI } from '../test-support';
import { acrylicAt21C } from '../test-materials';
import { sphereLameStress } from './sphere';
import { SPHERICAL_SECTOR_WARNING, sectorSeatStress } from './spherical-sector';

// The window: acrylic at the pressure-window standard's lot minimums (UFC 4-159-01 Tables 3-1, 3-2
// [pub]) with a flat temperature curve at 21 °C (test-materials.ts).
const sector = (innerRadius: number, thickness: number, includedAngle: number, pressure: number, target?: number) =>
  evaluate({
    loadCase: shortTerm(pressure, { type: 'spherical-sector', innerRadius, thickness, includedAngle }, 21, target ? { targetSafetyFactor: target } : {}),
    candidates: [acrylicAt21C],
  }).results[0];

describe('spherical sector window in a conical seat', () => {
  it('membrane compression: Lamé at the concave face, at least the seat stress p·Ro²/(Ro² − Ri²) from the force balance', () => {
    // Force balance p·π(Ro sin θ)² = σn·π(Ro² − Ri²)·sin²θ [calc]: the angle cancels.
    expect(sectorSeatStress(1e6, 1, 0.1)).toBeCloseTo(1e6 * 1.21 / 0.21, 0);
    const r = sector(0.1, 0.0364, 120, 10e6);
    expect(r.modes.map((m) => m.mode)).toEqual(['compression', 'buckling']);
    expect(r.modes[0].stress).toBeCloseTo(sphereLameStress(10e6, 0.1, 0.0364), 0);
    expect(r.modes[0].stress).toBeGreaterThan(sectorSeatStress(10e6, 0.1, 0.0364));
    expect(r.warnings).toContain(SPHERICAL_SECTOR_WARNING);
  });

  it('is conservative against the flanged hemisphere tests at t/Ri 0.364 (Stachiw & Sletten, J. Eng. Ind. 100(2):249, 1978)', () => {
    // Source [pub, abstract]: short-term critical pressure 14,500 psi; working pressure 1,000 psi
    // (O-ring groove in the flange) to 2,000 psi (thin gasket), 65–75 °F.
    const shortTerm = sector(0.1, 0.0364, 180, 14500 * PSI);
    expect(shortTerm.safetyFactor).toBeLessThan(1); // the model fails it before the test did (conservative)
    // at the family target of 4 the model rates it between the two published working pressures
    const ratedAt4 = (14500 * PSI * shortTerm.safetyFactor) / 4 / PSI;
    expect(ratedAt4).toBeGreaterThan(1000);
    expect(ratedAt4).toBeLessThan(2000);
  });

  it('thicker is never weaker and the required thickness meets the target', () => {
    const thin = sector(0.1, 0.02, 90, 8e6);
    const thick = sector(0.1, 0.04, 90, 8e6);
    thin.modes.forEach((m, i) => expect(thick.modes[i].safetyFactor).toBeGreaterThanOrEqual(m.safetyFactor));
    const again = sector(0.1, thin.requiredThickness!, 90, 8e6);
    expect(Math.abs(again.safetyFactor / again.targetSafetyFactor - 1)).toBeLessThan(0.005);
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { collapsePressure, johnsonOstenfeld, outOfRoundYield, reducedSlenderness } from './collapse';

describe('yield–buckling interaction', () => {
  it.each([
    [0.25, 0.25],
    [0.5, 0.5],
    [1, 0.75],
    [2, 0.875],
    [4, 0.9375],
  ])('Johnson–Ostenfeld at pe/py %d → pc/py %d (Johnson 1893, the parabola tangent at half the yield [calc])', (ratio, expected) => {
    expect(johnsonOstenfeld(1, ratio)).toBeCloseTo(expected, 12);
  });

  it.each([
    [4, 0.97014],
    [1, 0.70711],
    [1 / 2.25, 0.40614],
    [0.25, 0.24254],
  ])('reduced slenderness at pe/py %d → pc/py %d (DNV-RP-C202 §3.2 form [memory], values [calc])', (ratio, expected) => {
    expect(reducedSlenderness(1, ratio)).toBeCloseTo(expected, 5);
  });

  it('reduces capacity where elastic ≈ yield, stays near yield when elastic ≫ yield, near elastic when elastic ≪ yield', () => {
    expect(collapsePressure(1, 1)).toBeCloseTo(0.7071, 4);
    expect(collapsePressure(1, 50)).toBeGreaterThan(0.99);
    expect(collapsePressure(1, 0.02) / 0.02).toBeGreaterThan(0.99);
    fc.assert(
      fc.property(fc.double({ min: 1e3, max: 1e9, noNaN: true }), fc.double({ min: 1e3, max: 1e9, noNaN: true }), (py, pe) => {
        const pc = collapsePressure(py, pe);
        expect(pc).toBeLessThanOrEqual(Math.min(py, pe) * (1 + 1e-12));
        expect(pc).toBeGreaterThan(0);
        // more yield or more elastic strength is never weaker
        expect(collapsePressure(py * 1.1, pe)).toBeGreaterThanOrEqual(pc * (1 - 1e-12));
        expect(collapsePressure(py, pe * 1.1)).toBeGreaterThanOrEqual(pc * (1 - 1e-12));
      }),
    );
  });

  it('first yield of an out-of-round shell: min(py, pe) for a round one, lower with the deviation (Timoshenko & Gere)', () => {
    expect(outOfRoundYield(10, 4, 0, 0.01)).toBeCloseTo(4, 9);
    expect(outOfRoundYield(3, 40, 0, 0.01)).toBeCloseTo(3, 9);
    const a = outOfRoundYield(10, 12, 0.001, 0.01);
    const b = outOfRoundYield(10, 12, 0.003, 0.01);
    expect(b).toBeLessThan(a);
    expect(a).toBeLessThan(10);
    // the root satisfies p² − p(py + (1 + 6w0/t)pe) + py·pe = 0
    expect(a * a - a * (10 + (1 + 0.6) * 12) + 120).toBeCloseTo(0, 9);
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { allowablesFor, computeAllowables, fmt, sustainedLoadFactor, worstTemperatureFactor, type Conditions } from './allowables';
import { pvhoAcrylic } from './test-materials';
import type { CandidateMaterial } from './types';

// A Harrow Sound test lot of the PVHO-style acrylic (test-materials.ts): its own compressive
// strength (110 MPa), service range and temperature and cyclic curves; the sustained-load curve is
// the fixture's.
const base: CandidateMaterial = {
  ...pvhoAcrylic,
  name: 'Cast acrylic, Harrow Sound test lot',
  compressiveStrength: 110e6,
  serviceTemperature: { min: -20, max: 66 },
  temperatureFactors: [
    { temperature: -10, factor: 1.2 },
    { temperature: 21, factor: 1 },
    { temperature: 32, factor: 0.85 },
    { temperature: 66, factor: 0.55 },
  ],
  cyclicFactors: [
    { cycles: 1, factor: 1 },
    { cycles: 10000, factor: 0.7 },
  ],
};
const room: Conditions = { temperature: { min: 21, max: 21 }, sustainedHours: 0, cycles: 0 };

describe('interpolation', () => {
  const temps = [
    { temperature: 0, factor: 1 },
    { temperature: 10, factor: 0.8 },
    { temperature: 20, factor: 0.9 },
  ];
  it.each([
    [-5, 1],
    [0, 1],
    [5, 0.9],
    [10, 0.8],
    [15, 0.85],
    [25, 0.9],
  ])('linear in temperature at %d °C → %d', (t, f) => {
    expect(worstTemperatureFactor(temps, t, t).factor).toBeCloseTo(f, 12);
  });

  it.each([
    [0.05, 1], // below the first point → first factor
    [1, 0.9], // one decade of two: halfway in log10
    [10, 0.8],
    [1e6, 0.8], // beyond the data → last factor
  ])('linear in log10(hours) at %d h → %d', (h, f) => {
    const pts = [
      { hours: 0.1, factor: 1 },
      { hours: 10, factor: 0.8 },
    ];
    expect(sustainedLoadFactor(pts, h)).toBeCloseTo(f, 12);
  });

  it('a segment starting at 0 h is interpolated linearly in hours', () => {
    const pts = [
      { hours: 0, factor: 1 },
      { hours: 100, factor: 0.5 },
    ];
    expect(sustainedLoadFactor(pts, 50)).toBeCloseTo(0.75, 12);
  });

  it.each([
    // [min, max, worst factor, at]: the worst is found at range ends or data points inside
    [0, 20, 0.8, 10],
    [12, 20, 0.82, 12],
    [15, 15, 0.85, 15],
    [-30, 40, 0.8, 10],
  ])('worst temperature factor over %d..%d °C is %d at %d °C', (lo, hi, f, at) => {
    const w = worstTemperatureFactor(temps, lo, hi);
    expect(w.factor).toBeCloseTo(f, 12);
    expect(w.at).toBe(at);
  });

  it('unsorted data give the same result as sorted data', () => {
    const shuffled = [temps[2], temps[0], temps[1]];
    expect(worstTemperatureFactor(shuffled, 0, 20)).toEqual(worstTemperatureFactor(temps, 0, 20));
  });
});

describe('computeAllowables', () => {
  it('bases tension on the tensile yield when given, else the tensile strength; compression likewise', () => {
    const w: string[] = [];
    const a = computeAllowables(base, room, w);
    expect(a.tension).toBeCloseTo(62e6, 0);
    expect(a.tensionOnYield).toBe(false);
    expect(a.compression).toBeCloseTo(103e6, 0);
    expect(a.compressionOnYield).toBe(true);
    expect(a.shear).toBeCloseTo(55e6, 0);
    const b = computeAllowables({ ...base, tensileYield: 50e6, compressiveYield: null }, room, []);
    expect(b.tension).toBeCloseTo(50e6, 0);
    expect(b.tensionOnYield).toBe(true);
    expect(b.compression).toBeCloseTo(110e6, 0);
    expect(w).toEqual([]);
  });

  it('applies the worst temperature factor and ONE life factor, the lower of sustained-load and cyclic (never their product)', () => {
    const c: Conditions = { temperature: { min: 0, max: 32 }, sustainedHours: 1000, cycles: 100 };
    const a = computeAllowables(base, c, []);
    // worst over 0..32 °C is at 32 °C (0.85); 1000 h → 0.6; 100 cycles → halfway in log10 between 1 and 0.7
    expect(a.factors.temperature).toBeCloseTo(0.85, 12);
    expect(a.factors.worstTemperature).toBe(32);
    expect(a.factors.temperatureSource).toBe('set');
    expect(a.factors.sustainedLoad).toBeCloseTo(0.6, 12);
    expect(a.factors.cyclic).toBeCloseTo(0.85, 12);
    expect(a.factors.life).toBeCloseTo(0.6, 12);
    expect(a.factors.lifeBasis).toBe('sustained-load');
    expect(a.tension).toBeCloseTo(62e6 * 0.85 * 0.6, 0);
    expect(a.shortTerm.tension).toBeCloseTo(62e6 * 0.85, 0);
    // many cycles and few hours: the cyclic factor governs instead
    const b = computeAllowables(base, { temperature: { min: 21, max: 21 }, sustainedHours: 1, cycles: 10000 }, []);
    expect(b.factors.lifeBasis).toBe('cyclic');
    expect(b.factors.life).toBeCloseTo(0.7, 12);
    expect(b.shear).toBeCloseTo(55e6 * 0.7, 0);
    // no time at load: no life factor
    expect(computeAllowables(base, room, []).factors).toMatchObject({ life: 1, lifeBasis: 'none' });
  });

  it('uses the acrylic family temperature curve when the set has none, and says so (NCEL R-773; classification-rule flat-window table)', () => {
    const bare: CandidateMaterial = { ...base, temperatureFactors: [] };
    const w: string[] = [];
    // 66 °C: 0.38, from the ratio of rated pressures between the 24 °C and 66 °C columns of the flat-window table [calc]
    const hot = computeAllowables(bare, { ...room, temperature: { min: 10, max: 66 } }, w);
    expect(hot.factors.temperature).toBeCloseTo(0.38, 12);
    expect(hot.factors.temperatureSource).toBe('family');
    expect(w.some((s) => /acrylic family default/.test(s))).toBe(true);
    // 32 °C: 0.80, the larger loss R-773 measured at 90 °F (10–20 % below 70 °F) [pub, abstract]
    expect(computeAllowables(bare, { ...room, temperature: { min: 32, max: 32 } }, []).factors.temperature).toBeCloseTo(0.8, 12);
    // 0 °C: 1.15, the smaller gain R-773 measured at 32 °F (15–25 % above) [pub, abstract]
    expect(computeAllowables(bare, { ...room, temperature: { min: 0, max: 0 } }, []).factors.temperature).toBeCloseTo(1.15, 12);
    // other families have no default: glass stays at 1 without data
    expect(computeAllowables({ ...bare, family: 'glass' }, { ...room, temperature: { min: 60, max: 60 } }, []).factors).toMatchObject({
      temperature: 1,
      temperatureSource: 'none',
    });
  });

  it('clamps outside the temperature data and says so', () => {
    const w: string[] = [];
    const a = computeAllowables(base, { ...room, temperature: { min: 0, max: 80 } }, w);
    expect(a.factors.temperature).toBeCloseTo(0.55, 12);
    expect(w.some((s) => /clamped/.test(s))).toBe(true);
    expect(w.some((s) => /outside this property set's service range/.test(s))).toBe(true);
  });

  it('warns, and does not reduce silently, when sustained-load, cyclic or temperature data are missing', () => {
    const bare: CandidateMaterial = { ...base, family: 'polycarbonate', temperatureFactors: [], sustainedLoadFactors: null, cyclicFactors: undefined };
    const w: string[] = [];
    const a = computeAllowables({ ...bare, family: 'acrylic' }, { temperature: { min: 5, max: 30 }, sustainedHours: 10000, cycles: 500 }, w);
    expect(a.factors).toMatchObject({ sustainedLoad: 1, cyclic: 1, life: 1, temperatureSource: 'family' });
    const pc: string[] = [];
    expect(computeAllowables(bare, { temperature: { min: 5, max: 30 }, sustainedHours: 0, cycles: 0 }, pc).factors.temperature).toBe(1);
    expect(pc.some((s) => /No temperature-dependence data/.test(s))).toBe(true);
    expect(w.find((s) => /No sustained-load \(creep\) data/.test(s))).toMatch(/Acrylic loses strength/);
    expect(w.some((s) => /No cyclic \(fatigue\) data/.test(s))).toBe(true);
    expect(w.some((s) => /No temperature-dependence data/.test(s))).toBe(false);
  });

  it.each([
    ['polycarbonate', /Polycarbonate loses strength/],
    ['fibre-composite', /Fibre composite loses strength/],
    ['glass', /static fatigue/],
    ['steel', /factor 1\.0 assumed/],
  ] as const)('no creep data for %s: warning names the risk', (family, re) => {
    const w: string[] = [];
    computeAllowables({ ...base, family, sustainedLoadFactors: [] }, { ...room, sustainedHours: 24 }, w);
    expect(w.some((s) => re.test(s))).toBe(true);
  });

  it('no warning about missing time data when the load case has none to apply', () => {
    const w: string[] = [];
    computeAllowables({ ...base, family: 'steel', sustainedLoadFactors: [], cyclicFactors: [] }, { ...room, cycles: 1 }, w);
    expect(w).toEqual([]);
  });

  it('warns when the hours or cycles go past the data', () => {
    const w: string[] = [];
    computeAllowables(base, { ...room, sustainedHours: 1e6, cycles: 1e5 }, w);
    expect(w.some((s) => /Sustained-load data end at 1e\+05 h|Sustained-load data end at 100000 h/.test(s))).toBe(true);
    expect(w.some((s) => /Cyclic data end at 10000 cycles/.test(s))).toBe(true);
  });
});

describe('monotonic behaviour (fast-check)', () => {
  /** A factor curve that never increases with its abscissa. */
  const decreasingCurve = (xs: fc.Arbitrary<number>) =>
    fc
      .array(fc.tuple(xs, fc.double({ min: 0.01, max: 1, noNaN: true })), { minLength: 1, maxLength: 8 })
      .map((pts) => {
        const x = [...new Set(pts.map((p) => p[0]))].sort((a, b) => a - b);
        const f = pts.map((p) => p[1]).sort((a, b) => b - a);
        return x.map((v, i) => ({ x: v, f: f[Math.min(i, f.length - 1)] }));
      });

  it('hotter is never stronger when the temperature factors decrease with temperature', () => {
    fc.assert(
      fc.property(
        decreasingCurve(fc.double({ min: -50, max: 150, noNaN: true })),
        fc.double({ min: -60, max: 160, noNaN: true }),
        fc.double({ min: 0, max: 50, noNaN: true }),
        fc.double({ min: 0, max: 50, noNaN: true }),
        (curve, tMin, width, shift) => {
          const m = { ...base, temperatureFactors: curve.map((p) => ({ temperature: p.x, factor: p.f })) };
          const cool = computeAllowables(m, { ...room, temperature: { min: tMin, max: tMin + width } }, []);
          const warm = computeAllowables(m, { ...room, temperature: { min: tMin + shift, max: tMin + width + shift } }, []);
          expect(warm.tension).toBeLessThanOrEqual(cool.tension * (1 + 1e-12));
          // a wider range can only find a worse temperature
          const wider = computeAllowables(m, { ...room, temperature: { min: tMin - shift, max: tMin + width + shift } }, []);
          expect(wider.tension).toBeLessThanOrEqual(cool.tension * (1 + 1e-12));
        },
      ),
    );
  });

  it('a longer sustained load is never stronger; more cycles are never stronger', () => {
    fc.assert(
      fc.property(
        decreasingCurve(fc.double({ min: 0, max: 1e6, noNaN: true })),
        decreasingCurve(fc.double({ min: 0, max: 1e8, noNaN: true })),
        fc.double({ min: 0, max: 2e6, noNaN: true }),
        fc.double({ min: 1, max: 100, noNaN: true }),
        fc.integer({ min: 0, max: 1e9 }),
        fc.integer({ min: 1, max: 1000 }),
        (hCurve, cCurve, hours, hMul, cycles, cMul) => {
          const m = {
            ...base,
            sustainedLoadFactors: hCurve.map((p) => ({ hours: p.x, factor: p.f })),
            cyclicFactors: cCurve.map((p) => ({ cycles: p.x, factor: p.f })),
          };
          const a = computeAllowables(m, { ...room, sustainedHours: hours, cycles }, []);
          const b = computeAllowables(m, { ...room, sustainedHours: hours * hMul, cycles: cycles * cMul }, []);
          expect(b.compression).toBeLessThanOrEqual(a.compression * (1 + 1e-12));
          expect(b.factors.sustainedLoad).toBeLessThanOrEqual(a.factors.sustainedLoad + 1e-12);
          expect(b.factors.cyclic).toBeLessThanOrEqual(a.factors.cyclic + 1e-12);
        },
      ),
    );
  });
});

describe('fmt', () => {
  it.each([
    [0, '0'],
    [1234.5678, '1235'],
    [0.30000001, '0.3'],
    [123456789, '123500000'],
    [-0.000123456, '-0.0001235'],
    [2.5e-9, '2.5e-9'],
  ])('%d → %s', (x, s) => {
    expect(fmt(x)).toBe(s);
  });

  it('matches String(Number(x.toPrecision(4))) everywhere (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true, noDefaultInfinity: true }), (x) => {
        expect(fmt(x)).toBe(String(Number(x.toPrecision(4))));
      }),
      { numRuns: 5000 },
    );
  });
});

describe('remembered allowables', () => {
  it('gives what computeAllowables gives, with its warnings, and recomputes when the service conditions change', () => {
    const m = { ...pvhoAcrylic };
    const cold: Conditions = { temperature: { min: 2, max: 10 }, sustainedHours: 1000, cycles: 2000 };
    const warm: Conditions = { temperature: { min: 2, max: 40 }, sustainedHours: 1000, cycles: 2000 };
    for (const c of [cold, cold, warm, cold, { ...warm, cycles: 10_000 }]) {
      const fresh: string[] = [];
      const remembered: string[] = [];
      expect(allowablesFor(m, c, remembered)).toEqual(computeAllowables(m, c, fresh));
      expect(remembered).toEqual(fresh);
    }
    expect(allowablesFor(m, warm, []).tension).toBeLessThan(allowablesFor(m, cold, []).tension);
  });
});

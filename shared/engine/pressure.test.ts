import { execFileSync } from 'node:child_process';
import { describe, expect, it } from 'vitest';
import {
  depthFromPressure,
  FRESH_WATER_METHOD,
  freshWaterDepthM,
  freshWaterPressurePa,
  PA_PER_DBAR,
  pressureFromDepth,
  saunders1981PressureDbar,
  SEAWATER_METHOD,
  unesco1983Depth,
  unesco1983PressureDbar,
} from './pressure';

/** Runs Python with Debian's python3-gsw (TEOS-10 reference library) and parses its JSON output. */
function python(script: string): unknown {
  let out: string;
  try {
    out = execFileSync('/usr/bin/python3', ['-c', script], { encoding: 'utf8', timeout: 120_000 });
  } catch (e) {
    throw new Error(
      'This test checks the engine against TEOS-10 through Debian\'s python3-gsw, which could not be run. ' +
        'Install it with `apt-get install -y python3-gsw` (the project test script does this). Cause: ' +
        (e instanceof Error ? e.message : String(e)),
    );
  }
  return JSON.parse(out);
}

describe('UNESCO 1983 depth formula', () => {
  // Source: Fofonoff & Millard 1983, Unesco Technical Papers in Marine Science 44 (depth of the
  // standard ocean; formula of Saunders & Fofonoff 1976): published check value and table values.
  // Tolerance: half a unit in the last published digit (0.0005 m).
  it.each([
    { dbar: 10000, lat: 30, depth: 9712.653 }, // published check value
    { dbar: 500, lat: 0, depth: 496.653 },
    { dbar: 500, lat: 30, depth: 495.998 },
    { dbar: 5000, lat: 0, depth: 4915.041 },
    { dbar: 5000, lat: 30, depth: 4908.56 },
  ])('$dbar dbar at $lat° → $depth m', ({ dbar, lat, depth }) => {
    expect(Math.abs(unesco1983Depth(dbar, lat) - depth)).toBeLessThan(0.0005);
  });

  it.each([
    [1, 0],
    [250, 45],
    [1200, 51],
    [4000, -30],
    [10994, 11.35],
    [12000, 90],
  ])('inverts to round-off: %d m at %d°', (depth, lat) => {
    const dbar = unesco1983PressureDbar(depth, lat);
    expect(Math.abs(unesco1983Depth(dbar, lat) - depth)).toBeLessThan(1e-9 * depth + 1e-12);
    expect(Math.abs(depthFromPressure(pressureFromDepth(depth, lat, 'sea').pressure, lat, 'sea') - depth)).toBeLessThan(1e-8 * depth);
  });

  it('agrees with the Saunders (1981) closed form within 0.05 % (two independent approximations of one ocean)', () => {
    // Source: Saunders 1981, J. Phys. Oceanogr. 11, 573–574, against the UNESCO 1983 formula; the
    // 0.05 % bound is ours (the two are independent fits to the same ocean and should agree closely).
    for (const lat of [0, 30, 60]) {
      for (const depth of [100, 1000, 4000, 8000]) {
        const a = unesco1983PressureDbar(depth, lat);
        const b = saunders1981PressureDbar(depth, lat);
        expect(Math.abs(a - b) / a).toBeLessThan(5e-4);
      }
    }
  });
});

describe('Saunders 1981 closed form', () => {
  it('z = 7321.45 m at 30° → 7500.0065 dbar', () => {
    // Source: Saunders 1981, J. Phys. Oceanogr. 11, 573–574, check value (7500.004 dbar in single
    // precision; 7500.0065 in double precision, as transcribed in REFERENCES.md).
    expect(Math.abs(saunders1981PressureDbar(7321.45, 30) - 7500.0065)).toBeLessThan(1e-4);
  });
});

describe('pressureFromDepth', () => {
  it('names its model and source', () => {
    expect(pressureFromDepth(100, 45, 'sea').method).toBe(SEAWATER_METHOD);
    expect(SEAWATER_METHOD).toMatch(/UNESCO 1983/);
    expect(SEAWATER_METHOD).toMatch(/Fofonoff & Millard/);
    expect(pressureFromDepth(100, 45, 'fresh').method).toBe(FRESH_WATER_METHOD);
    expect(FRESH_WATER_METHOD).toMatch(/TEOS-10/);
  });

  it('is zero at the surface and rejects bad input', () => {
    expect(pressureFromDepth(0, 10, 'sea').pressure).toBe(0);
    expect(pressureFromDepth(0, 10, 'fresh').pressure).toBe(0);
    expect(() => pressureFromDepth(-1, 0, 'sea')).toThrow(RangeError);
    expect(() => pressureFromDepth(Number.NaN, 0, 'sea')).toThrow(RangeError);
    expect(() => pressureFromDepth(10, 91, 'sea')).toThrow(RangeError);
  });

  it('rises with depth and, at the same depth, with latitude (gravity), seawater above fresh water', () => {
    let last = 0;
    for (let d = 10; d <= 12000; d *= 1.7) {
      const p = pressureFromDepth(d, 30, 'sea').pressure;
      expect(p).toBeGreaterThan(last);
      last = p;
      expect(pressureFromDepth(d, 60, 'sea').pressure).toBeGreaterThan(pressureFromDepth(d, 0, 'sea').pressure);
      expect(pressureFromDepth(d, 30, 'sea').pressure).toBeGreaterThan(pressureFromDepth(d, 30, 'fresh').pressure);
    }
  });

  it('fresh water round-trips through its inverse', () => {
    for (const [depth, lat] of [
      [0.5, 0],
      [50, 45],
      [1642, 53],
      [12000, 90],
    ]) {
      expect(Math.abs(freshWaterDepthM(freshWaterPressurePa(depth, lat), lat) - depth)).toBeLessThan(1e-9 * depth);
    }
  });
});

describe('against TEOS-10 (Debian python3-gsw, called live)', () => {
  // Reference library: TEOS-10 Gibbs SeaWater toolbox, gsw.p_from_z(z, lat) (standard ocean,
  // SA = 35.16504 g/kg, CT = 0 °C), sea pressure in dbar, z negative downward.
  const points: [number, number][] = [
    [10, 60],
    [500, 45],
    [1000, 0],
    [1000, 30],
    [1200, 50],
    [4000, 30],
    [6000, 30],
    [11000, 30],
  ];

  it('seawater pressure within 0.02 % down to 11,000 m (measured: ≤ 0.004 % to 6,000 m, 0.015 % at 11,000 m)', () => {
    const gsw = python(
      `import gsw, json; print(json.dumps([float(gsw.p_from_z(-z, lat)) for z, lat in ${JSON.stringify(points)}]))`,
    ) as number[];
    points.forEach(([depth, lat], i) => {
      const reference = gsw[i] * PA_PER_DBAR;
      const engine = pressureFromDepth(depth, lat, 'sea').pressure;
      const err = Math.abs(engine - reference) / reference;
      expect(err, `${depth} m at ${lat}°`).toBeLessThan(2e-4);
      if (depth <= 6000) expect(err, `${depth} m at ${lat}°`).toBeLessThan(4e-5);
      // ρ·g·h with 1025 kg/m³ and standard gravity (common practice shortcut) is worse, by more
      // than 0.25 % already at 1,000 m and more than 1 % at 6,000 m: compressibility matters.
      const naive = 1025 * 9.80665 * depth;
      const naiveErr = Math.abs(naive - reference) / reference;
      expect(naiveErr).toBeGreaterThan(err);
      if (depth >= 1000) expect(naiveErr).toBeGreaterThan(2.5e-3);
      if (depth >= 6000) expect(naiveErr).toBeGreaterThan(1e-2);
    });
  });

  it('fresh water within 0.01 % of dp/dz = ρ·g integrated with TEOS-10 pure water at 4 °C (measured ≤ 0.003 %)', () => {
    // Reference: RK4 integration in Python of dp/dz = gsw.rho(0, 4, p)·gsw.grav(lat, p) — TEOS-10
    // density of pure water (SA = 0) at 4 °C and TEOS-10 gravity, both independent of the engine's
    // closed form (Murnaghan law, UNESCO gravity).
    const cases: [number, number][] = [
      [100, 45],
      [1000, 45],
      [1642, 53],
      [5000, 0],
    ];
    const ref = python(`
import gsw, json
def fresh(zmax, lat, n=400):
    h = zmax / n; p = 0.0
    f = lambda p: float(gsw.rho(0, 4, p / 1e4) * gsw.grav(lat, p / 1e4))
    for i in range(n):
        k1 = f(p); k2 = f(p + h * k1 / 2); k3 = f(p + h * k2 / 2); k4 = f(p + h * k3)
        p += h * (k1 + 2 * k2 + 2 * k3 + k4) / 6
    return p
print(json.dumps([fresh(z, lat) for z, lat in ${JSON.stringify(cases)}]))
`) as number[];
    cases.forEach(([depth, lat], i) => {
      const engine = pressureFromDepth(depth, lat, 'fresh').pressure;
      expect(Math.abs(engine - ref[i]) / ref[i], `${depth} m at ${lat}°`).toBeLessThan(1e-4);
      // incompressible ρ·g·h with 1000 kg/m³ is worse
      const naive = 1000 * 9.80665 * depth;
      expect(Math.abs(naive - ref[i])).toBeGreaterThan(Math.abs(engine - ref[i]));
    });
  });
});

import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { LoadCaseInput } from '../schemas/evaluate';
import { ratingTableContentSchema } from '../schemas/rating-tables';
import { evaluate } from './evaluate';
import { chamberViewport, withThickness } from './evaluate-fixtures';
import { minimumRatioAt, ratedPressureAt, rateWithTable, tableCovers } from './rating-tables';
import { acrylicLotMinimums, glass, sapphire } from './test-materials';
import { PSI, seededRatingTableRows, seededRatingTables } from './test-support';
import type { CandidateMaterial, RatingTable } from './types';

// The seeded rating tables (data/rating-tables.json), each validated by the shared schema.
const seed = { ratingTables: seededRatingTableRows() };
const tables = seededRatingTables();
const flat = tables['class-flat-acrylic'];
const cone90 = tables['stachiw-cones-90-150'];
const BAR = 1e5;

/**
 * Source of every value below: a classification society's Rules and Guidance for the
 * Classification of Underwater Vehicles, Table 1.5.2, minimum t/Di of flat acrylic windows
 * (public web edition; REFERENCES.md) [pub]. Rows 5–45 bar; columns 10 / 24 / 38 / 52 / 66 °C.
 */
const CLASS_TABLE: [number, number[]][] = [
  [5, [0.134, 0.146, 0.154, 0.164, 0.188]],
  [10, [0.154, 0.173, 0.188, 0.201, 0.226]],
  [15, [0.173, 0.195, 0.21, 0.223, 0.253]],
  [20, [0.188, 0.21, 0.226, 0.24, 0.281]],
  [25, [0.201, 0.223, 0.24, 0.257, 0.305]],
  [30, [0.21, 0.233, 0.253, 0.274, 0.324]],
  [35, [0.219, 0.243, 0.267, 0.292, 0.344]],
  [40, [0.226, 0.253, 0.281, 0.305, 0.363]],
  [45, [0.233, 0.264, 0.295, 0.317, 0.383]],
];
const COLUMNS = [10, 24, 38, 52, 66];

describe('seeded rating tables', () => {
  it('every seeded table passes the shared schema (ascending rows and columns, requirement never falling)', () => {
    for (const { name, geometry, includedAngle, limits, grade, note, data } of seed.ratingTables) {
      expect(ratingTableContentSchema.safeParse({ name, geometry, includedAngle, limits, grade, note, data }).success, name).toBe(true);
    }
    expect(Object.keys(tables)).toEqual(['class-flat-acrylic', 'stachiw-cones-90-150', 'stachiw-cones-60']);
  });

  it('the schema refuses a table whose requirement falls with pressure or temperature, or has gaps', () => {
    const base = { name: 'x', geometry: 'flat-disc' as const, grade: 'acrylic', data: { form: 'minimum-ratio' as const, pressures: [1e5, 2e5], temperatures: [10, 20], ratios: [[0.2, 0.25], [0.3, 0.35]] } };
    expect(ratingTableContentSchema.safeParse(base).success).toBe(true);
    expect(ratingTableContentSchema.safeParse({ ...base, data: { ...base.data, ratios: [[0.2, 0.25], [0.1, 0.35]] } }).success).toBe(false);
    expect(ratingTableContentSchema.safeParse({ ...base, data: { ...base.data, ratios: [[0.2, 0.15], [0.3, 0.35]] } }).success).toBe(false);
    expect(ratingTableContentSchema.safeParse({ ...base, data: { ...base.data, pressures: [2e5, 1e5] } }).success).toBe(false);
    const gap = { ...base, data: { ...base.data, pressures: [1e5, 2e5, 3e5], ratios: [[0.2, 0.25], [null, 0.3], [0.4, 0.45]] } };
    expect(ratingTableContentSchema.safeParse(gap).success).toBe(false);
    expect(ratingTableContentSchema.safeParse({ ...base, geometry: 'conical-frustum' }).success).toBe(false); // needs its angles
  });
});

describe('flat-window table (classification rules, Table 1.5.2) read by the engine', () => {
  it.each(CLASS_TABLE.flatMap(([bar, row]) => row.map((r, j) => [bar, COLUMNS[j], r] as const)))(
    'reproduces the grid point %d bar, %d °C → t/Di %d',
    (bar, temperature, ratio) => {
      expect(minimumRatioAt(flat.data, bar * BAR, temperature).value).toBeCloseTo(ratio, 12);
    },
  );

  it('interpolates linearly between rows and between columns', () => {
    // 12.5 bar, 24 °C: halfway between 0.173 and 0.195
    expect(minimumRatioAt(flat.data, 12.5 * BAR, 24).value).toBeCloseTo(0.184, 12);
    // 10 bar, 31 °C: halfway between 0.173 (24 °C) and 0.188 (38 °C)
    expect(minimumRatioAt(flat.data, 10 * BAR, 31).value).toBeCloseTo(0.1805, 12);
    // 12.5 bar, 31 °C: bilinear
    expect(minimumRatioAt(flat.data, 12.5 * BAR, 31).value).toBeCloseTo((0.173 + 0.195 + 0.188 + 0.21) / 4, 12);
  });

  it('never extrapolates: beyond the last row or column, or into an empty cell, gives no number and says why', () => {
    expect(minimumRatioAt(flat.data, 46 * BAR, 66)).toMatchObject({ value: null });
    expect(minimumRatioAt(flat.data, 50 * BAR, 24).outside).toMatch(/no value above/);
    expect(minimumRatioAt(flat.data, 50 * BAR, 10).value).toBeCloseTo(0.24, 12); // the one cell of the 50 bar row that was seen
    expect(minimumRatioAt(flat.data, 55 * BAR, 10).outside).toMatch(/above the table's last row/);
    expect(minimumRatioAt(flat.data, 10 * BAR, 70).outside).toMatch(/above the table's last column/);
  });

  it('below the first row or column uses the first (conservative), and says so', () => {
    const low = minimumRatioAt(flat.data, 3 * BAR, 5);
    expect(low.value).toBeCloseTo(0.134, 12);
    expect(low.notes.join(' ')).toMatch(/below the first row/);
    expect(low.notes.join(' ')).toMatch(/below the first column/);
  });

  it('rated pressure inverts the requirement, at grid points and between them', () => {
    expect(ratedPressureAt(flat.data, 0.173, 24).value).toBeCloseTo(10 * BAR, 6);
    expect(ratedPressureAt(flat.data, 0.184, 24).value).toBeCloseTo(12.5 * BAR, 6);
    expect(ratedPressureAt(flat.data, 0.5, 24)).toMatchObject({ lowerBound: true });
    expect(ratedPressureAt(flat.data, 0.1, 24).value).toBeNull();
  });

  it('rated pressure and minimum ratio are consistent: a ratio meets the table exactly when its rating reaches the pressure (fast-check)', () => {
    fc.assert(
      fc.property(fc.double({ min: 5, max: 45, noNaN: true }), fc.double({ min: 10, max: 66, noNaN: true }), fc.double({ min: 0.1, max: 0.45, noNaN: true }), (bar, T, r) => {
        const need = minimumRatioAt(flat.data, bar * BAR, T).value!;
        const rated = ratedPressureAt(flat.data, r, T);
        if (r >= need * (1 + 1e-9)) expect(rated.value === null ? false : rated.value >= bar * BAR * (1 - 1e-9)).toBe(true);
        if (r <= need * (1 - 1e-9)) expect(rated.value === null || rated.value <= bar * BAR * (1 + 1e-9)).toBe(true);
      }),
    );
  });

  it('the conical tables apply only to their included angles; the flat table to flat discs', () => {
    expect(tableCovers(flat, { type: 'flat-disc', diameter: 0.2, thickness: 0.03, edge: 'clamped' })).toBe(true);
    expect(tableCovers(cone90, { type: 'conical-frustum', minorDiameter: 0.1, thickness: 0.06, includedAngle: 90 })).toBe(true);
    expect(tableCovers(cone90, { type: 'conical-frustum', minorDiameter: 0.1, thickness: 0.06, includedAngle: 60 })).toBe(false);
    expect(tableCovers(tables['stachiw-cones-60'], { type: 'conical-frustum', minorDiameter: 0.1, thickness: 0.06, includedAngle: 60 })).toBe(true);
    expect(tableCovers(cone90, { type: 'flat-disc', diameter: 0.2, thickness: 0.03, edge: 'clamped' })).toBe(false);
  });

  it('a service beyond the table limits gives no number (the cone tests lasted 1,000 h)', () => {
    const c = { type: 'conical-frustum' as const, minorDiameter: 0.1, thickness: 0.07, includedAngle: 90 };
    expect(rateWithTable(cone90, c, 5000 * PSI, { temperature: { max: 20 }, sustainedHours: 500, cycles: 10 }).requiredThickness).toBeCloseTo(0.0625, 12);
    expect(rateWithTable(cone90, c, 5000 * PSI, { temperature: { max: 20 }, sustainedHours: 5000, cycles: 10 }).outside).toMatch(/1000 h/);
  });
});

describe('the critical-pressure form: design pressure ≤ STCP / conversion factor', () => {
  // An invented Harrow Sound test table (demo only): STCP 10 → 40 MPa over t/Di 0.2 → 0.6, CF 4 at 24 °C rising to 8 at 66 °C.
  const stcp: RatingTable = {
    name: 'Harrow Sound demo STCP curve',
    geometry: 'conical-frustum',
    includedAngle: { min: 90, max: 90 },
    source: 'demo',
    data: { form: 'critical-pressure', ratios: [0.2, 0.4, 0.6], criticalPressures: [10e6, 25e6, 40e6], conversionFactors: [{ temperature: 24, factor: 4 }, { temperature: 66, factor: 8 }] },
  };
  it('required ratio from STCP⁻¹(CF·P), rated pressure STCP(r)/CF', () => {
    // CF·P = 4 × 5 MPa = 20 MPa, between the rows at 10 and 25 MPa
    expect(minimumRatioAt(stcp.data, 5e6, 24).value).toBeCloseTo(0.2 + (0.2 * 10) / 15, 12);
    expect(ratedPressureAt(stcp.data, 0.4, 24).value).toBeCloseTo(25e6 / 4, 6);
    expect(ratedPressureAt(stcp.data, 0.4, 45).value).toBeCloseTo(25e6 / 6, 6);
    expect(minimumRatioAt(stcp.data, 6e6, 66).outside).toMatch(/above the table's last row/);
    expect(minimumRatioAt(stcp.data, 1e6, 70).outside).toMatch(/last conversion-factor column/);
  });
});

// ---------------------------------------------------------------------------------------------
// Evaluate with the tables
// ---------------------------------------------------------------------------------------------

// The window: acrylic at the pressure-window standard's lot minimums (UFC 4-159-01 Tables 3-1, 3-2
// [pub]), no curves of its own (test-materials.ts), as the catalogue's set 1.
const lotMinimum: CandidateMaterial = { ...acrylicLotMinimums, propertySetId: 1 };
const covered: CandidateMaterial = { ...lotMinimum, ratingTables: [flat, cone90, tables['stachiw-cones-60']] };

// The 5 bar chamber viewport of evaluate-fixtures.ts at another pressure, temperature and thickness.
const disc = (bar: number, T: number, thickness = 0.04, extra: Partial<LoadCaseInput> = {}): LoadCaseInput => ({
  ...withThickness(chamberViewport, thickness),
  pressure: { value: bar * BAR },
  temperature: { min: T, max: T },
  ...extra,
});

describe('evaluate: a covering rating table sizes the window, the analytical modes cross-check', () => {
  it('flat disc 10 bar: t/Di 0.154 at 10 °C and 0.173 at 24 °C, as the classification rules require (Table 1.5.2) [pub]', () => {
    for (const [T, ratio] of [
      [10, 0.154],
      [24, 0.173],
    ] as const) {
      const r = evaluate({ loadCase: disc(10, T), candidates: [covered] }).results[0];
      expect(r.sizedBy).toMatchObject({ kind: 'rating-table', name: flat.name });
      expect(r.requiredThickness! / 0.25).toBeCloseTo(ratio, 12);
      expect(r.rating!.minimumRatio).toBeCloseTo(ratio, 12);
      // margin = rated pressure at the entered 40 mm (t/Di 0.16) / design − 1
      expect(r.margin).toBeCloseTo(r.rating!.ratedPressure! / (10 * BAR) - 1, 12);
      expect(r.rating!.crossCheckSafetyFactor).toBeGreaterThan(1);
    }
  });

  it('temperature changes the answer for acrylic: the table by column, the analytical modes by the family curve', () => {
    const cold = evaluate({ loadCase: disc(10, 10), candidates: [covered] }).results[0];
    const warm = evaluate({ loadCase: disc(10, 52), candidates: [covered] }).results[0];
    expect(warm.requiredThickness!).toBeGreaterThan(cold.requiredThickness!);
    const coldA = evaluate({ loadCase: disc(10, 10), candidates: [lotMinimum] }).results[0];
    const warmA = evaluate({ loadCase: disc(10, 52), candidates: [lotMinimum] }).results[0];
    expect(warmA.safetyFactor).toBeLessThan(coldA.safetyFactor);
    expect(warmA.factors.temperatureSource).toBe('family');
  });

  it('outside the table: no thickness, the reason, and the analytical modes still shown', () => {
    const r = evaluate({ loadCase: disc(48, 24), candidates: [covered] }).results[0];
    expect(r.requiredThickness).toBeNull();
    expect(r.sizedBy).toBeNull();
    expect(r.rating!.outside).toMatch(/Outside the rating table/);
    expect(r.modes.every((m) => m.requiredThickness !== null)).toBe(true);
    expect(r.warnings.some((w) => /Outside the rating table/.test(w))).toBe(true);
  });

  it('an uncovered acrylic set is sized analytically and says that no table covers it', () => {
    const r = evaluate({ loadCase: disc(10, 24), candidates: [lotMinimum] }).results[0];
    expect(r.sizedBy).toMatchObject({ kind: 'mode' });
    expect(r.rating).toBeUndefined();
    expect(r.warnings.some((w) => /No published rating table covers/.test(w))).toBe(true);
  });

  it('the 1,200 m 90° cone is sized by the Stachiw table (below 5,000 psi the 5,000 psi row, conservative)', () => {
    const r = evaluate({
      loadCase: { pressure: { depth: 1200, latitude: 57, water: 'sea' }, temperature: { min: 2, max: 25 }, sustainedHours: 1000, cycles: 2000, component: { type: 'conical-frustum', minorDiameter: 0.15, thickness: 0.1, includedAngle: 90 } },
      candidates: [covered],
    }).results[0];
    expect(r.sizedBy).toMatchObject({ kind: 'rating-table', name: cone90.name });
    expect(r.requiredThickness).toBeCloseTo(0.625 * 0.15, 12);
    expect(r.rating!.interpolation).toMatch(/below the first row/);
  });
});

describe('human occupancy: windows no rule covers warn and rank below covered ones', () => {
  // glass and sapphire: the demo brittle windows of test-materials.ts
  const crewed = disc(5, 24, 0.04, { humanOccupancy: true });

  it('covered first by default; the toggle ranks them together; the uncovered carry the warning', () => {
    const out = evaluate({ loadCase: crewed, candidates: [sapphire, glass, covered] });
    expect(out.results[0].name).toBe(covered.name);
    expect(out.results[0].coverage).toBe('covered');
    for (const r of out.results.slice(1)) {
      expect(r.coverage).toBe('not-covered');
      expect(r.warnings[0]).toMatch(/^HUMAN OCCUPANCY/);
    }
    const mixed = evaluate({ loadCase: crewed, candidates: [sapphire, glass, covered], coveredFirst: false });
    expect(mixed.results[0].name).toBe(sapphire.name); // strongest by margin, still not covered
  });

  it('brittle windows always warn about contact fracture at the seat and static fatigue', () => {
    const r = evaluate({ loadCase: disc(5, 24), candidates: [glass] }).results[0];
    expect(r.coverage).toBeUndefined();
    expect(r.warnings.some((w) => /contact fracture/.test(w) && /static/.test(w))).toBe(true);
  });

  it('the fast ranking path keeps covered candidates first, identical to ranking them all', () => {
    const many = Array.from({ length: 150 }, (_, i) => ({ ...(i % 3 === 0 ? covered : i % 3 === 1 ? glass : sapphire), name: `lot ${String(i).padStart(3, '0')}`, propertySetId: i + 1, tensileStrength: 40e6 + i * 1e5 }));
    const fast = evaluate({ loadCase: crewed, candidates: many, limit: 60 });
    const all = evaluate({ loadCase: crewed, candidates: many, limit: 1000 }).results.slice(0, 60);
    expect(fast.results).toEqual(all);
    expect(fast.results.slice(0, 50).every((r) => r.coverage === 'covered')).toBe(true);
  });
});

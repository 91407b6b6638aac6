/**
 * Tests of the request schemas in shared/schemas/evaluate.ts (kept beside the engine that uses them).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { evaluateRequestSchema, loadCaseSchema, pressureQuerySchema } from '../schemas/evaluate';
import { cameraCone } from './evaluate-fixtures';
import { acrylicLotMinimums } from './test-materials';

// The 4,000 m camera cone of evaluate-fixtures.ts, a catalogue set and an inline material: the
// lot-minimum acrylic of test-materials.ts with its compressive value as a strength only and its own
// sustained-load point.
const valid = {
  loadCase: cameraCone,
  candidates: [
    { propertySetId: 12 },
    {
      inline: {
        ...acrylicLotMinimums,
        name: 'Harrow Sound trial acrylic',
        compressiveYield: undefined,
        sustainedLoadFactors: [{ hours: 1000, factor: 0.6 }],
      },
    },
  ],
};

/** Issues as { "a.b.c": message } for compact assertions. */
function fields(input: unknown): Record<string, string> {
  const r = evaluateRequestSchema.safeParse(input);
  if (r.success) return {};
  return Object.fromEntries(r.error.issues.map((i) => [i.path.join('.'), i.message]));
}

/** The message of the first issue whose path starts with `prefix`. */
function messageUnder(input: unknown, prefix: string): string | undefined {
  const f = fields(input);
  const key = Object.keys(f).find((k) => k === prefix || k.startsWith(`${prefix}.`));
  return key === undefined ? undefined : f[key];
}

/** A deep copy of `valid` with one value replaced (path like "loadCase.component.thickness"). */
function withValue(path: string, value: unknown): unknown {
  const copy = structuredClone(valid) as Record<string, unknown>;
  const keys = path.split('.');
  let o = copy as Record<string, unknown>;
  for (const k of keys.slice(0, -1)) o = o[k] as Record<string, unknown>;
  if (value === undefined) delete o[keys[keys.length - 1]];
  else o[keys[keys.length - 1]] = value;
  return copy;
}

describe('evaluate request schema', () => {
  it('accepts the contract example and applies defaults (limit 100, sortBy margin, proof factor 1.25)', () => {
    const r = evaluateRequestSchema.parse(valid);
    expect(r.limit).toBe(100);
    expect(r.sortBy).toBe('margin');
    expect(r.loadCase.proofFactor).toBe(1.25);
    expect(r.loadCase.targetSafetyFactor).toBeUndefined();
    expect(r.candidates).toHaveLength(2);
  });

  it('accepts every component type, a direct pressure, filters and no candidates', () => {
    for (const component of [
      { type: 'flat-disc', diameter: 0.25, thickness: 0.03, edge: 'clamped' },
      { type: 'conical-frustum', minorDiameter: 0.1, thickness: 0.1, includedAngle: 180 },
      { type: 'sphere', innerRadius: 0.8, thickness: 0.03 },
      { type: 'cylinder', innerRadius: 0.8, thickness: 0.025, length: 0.7 },
    ]) {
      const input = {
        loadCase: { ...valid.loadCase, pressure: { value: 5e5 }, component, targetSafetyFactor: 3, proofFactor: 1.5 },
        filters: { family: 'acrylic', transparent: true, coversTemperature: true },
        sortBy: 'massPerArea',
        limit: 5000,
      };
      expect(fields(input)).toEqual({});
    }
  });

  it.each([
    ['loadCase.component.thickness', 0, 'loadCase.component.thickness', /Thickness must be at least 0.000001 m|Thickness must be at least 1e-6 m/],
    ['loadCase.component.thickness', -0.01, 'loadCase.component.thickness', /Thickness must be at least/],
    ['loadCase.component.thickness', 101, 'loadCase.component.thickness', /Thickness must be at most 100 m\./],
    ['loadCase.component.thickness', Number.POSITIVE_INFINITY, 'loadCase.component.thickness', /Thickness must be a number\./],
    ['loadCase.component.thickness', Number.NaN, 'loadCase.component.thickness', /Thickness must be a number\./],
    ['loadCase.component.thickness', '0.06', 'loadCase.component.thickness', /Thickness must be a number\./],
    ['loadCase.component.includedAngle', 29, 'loadCase.component.includedAngle', /Included angle must be at least 30 °\./],
    ['loadCase.component.includedAngle', 181, 'loadCase.component.includedAngle', /Included angle must be at most 180 °\./],
    ['loadCase.component.type', 'dome', 'loadCase.component.type', /Component type must be one of/],
    ['loadCase.component.extra', 1, 'loadCase.component', /Conical frustum has unknown field "extra"/],
    ['loadCase.pressure.depth', 12001, 'loadCase.pressure.depth', /Depth must be at most 12000 m\./],
    ['loadCase.pressure.depth', 0, 'loadCase.pressure.depth', /Depth must be at least 0.01 m\./],
    ['loadCase.pressure.latitude', 91, 'loadCase.pressure.latitude', /Latitude must be at most 90 °\./],
    ['loadCase.pressure.water', 'brine', 'loadCase.pressure', /Water must be "sea" or "fresh"\./],
    ['loadCase.pressure.latitude', undefined, 'loadCase.pressure', /Latitude is required\./],
    ['loadCase.pressure', { value: 3e9 }, 'loadCase.pressure.value', /Pressure value must be at most 2000000000 Pa\./],
    ['loadCase.pressure', { value: -1 }, 'loadCase.pressure.value', /Pressure value must be at least 1 Pa\./],
    ['loadCase.pressure', { value: 1e6, depth: 100 }, 'loadCase.pressure', /Pressure/],
    ['loadCase.pressure', {}, 'loadCase.pressure', /Pressure must be either/],
    ['loadCase.temperature', { min: 30, max: 20 }, 'loadCase.temperature.max', /Maximum temperature must not be below the minimum temperature\./],
    ['loadCase.sustainedHours', -1, 'loadCase.sustainedHours', /Sustained-load hours must be zero or more\./],
    ['loadCase.cycles', 2.5, 'loadCase.cycles', /Pressure cycles must be a whole number\./],
    ['loadCase.targetSafetyFactor', 0, 'loadCase.targetSafetyFactor', /Target safety factor must be greater than 0\./],
    ['loadCase.proofFactor', 0.9, 'loadCase.proofFactor', /Proof factor must be at least 1\./],
    ['loadCase.proofFactor', 3.5, 'loadCase.proofFactor', /Proof factor must be at most 3\./],
    ['loadCase.component', undefined, 'loadCase.component', /Component is required\./],
    ['candidates', [], 'candidates', /omit the field to evaluate the published catalogue/],
    ['candidates', Array.from({ length: 5001 }, () => ({ propertySetId: 1 })), 'candidates', /At most 5000 candidates/],
    ['candidates', [{ propertySetId: 0 }], 'candidates.0.propertySetId', /Property set id must be at least 1\./],
    ['candidates', [{ propertySetId: 1.5 }], 'candidates.0', /Property set id must be a whole number\./],
    ['candidates', [{ inline: { name: 'x' } }], 'candidates.0', /Density is required\./],
    ['candidates', [{ ...valid.candidates[1], propertySetId: 3 }], 'candidates.0', /Candidate/],
    ['limit', 0, 'limit', /Limit must be at least 1\./],
    ['limit', 5001, 'limit', /Limit must be at most 5000\./],
    ['sortBy', 'price', 'sortBy', /Sort must be one of/],
    ['filters', { family: 'wood' }, 'filters.family', /./],
    ['loadCase.unknown', true, 'loadCase', /Load case has unknown field "unknown"/],
  ])('%s = %j → error at %s', (path, value, at, message) => {
    const f = fields(withValue(path, value));
    expect(Object.keys(f)).toContain(at);
    expect(f[at]).toMatch(message);
  });

  it('inline material bounds and Poisson ratio', () => {
    const inline = (patch: Record<string, unknown>) => ({
      ...valid,
      candidates: [{ inline: { ...(valid.candidates[1] as { inline: object }).inline, ...patch } }],
    });
    expect(messageUnder(inline({ poissonsRatio: 0.5 }), 'candidates.0')).toMatch(/Poisson's ratio must be less than 0.5\./);
    expect(messageUnder(inline({ density: 0 }), 'candidates.0')).toMatch(/Density must be greater than 0 kg\/m³\./);
    expect(messageUnder(inline({ sustainedLoadFactors: [{ hours: 1, factor: 0 }] }), 'candidates.0')).toMatch(
      /Sustained-load factor must be greater than 0\./,
    );
    expect(messageUnder(inline({ serviceTemperature: { min: 50, max: 0 } }), 'candidates.0')).toMatch(
      /Maximum service temperature must not be below the minimum\./,
    );
    expect(messageUnder(inline({ colour: 'clear' }), 'candidates.0')).toMatch(/Inline material has unknown field "colour"/);
    expect(messageUnder(inline({ youngsModulus: 'stiff' }), 'candidates.0')).toMatch(/Young's modulus must be a number\./);
    expect(fields(inline({ tensileYield: 50e6, compressiveYield: 90e6, family: 'polycarbonate' }))).toEqual({});
  });

  it('random invalid load cases fail validation (fast-check)', () => {
    const notNumber = fc.constantFrom<unknown>(Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 'x', null, true, {}, []);
    const outside = (lo: number, hi: number) =>
      fc.oneof(
        notNumber,
        fc.double({ max: lo, noNaN: true }).filter((x) => x < lo),
        fc.double({ min: hi, noNaN: true }).filter((x) => x > hi),
      );
    const cases: [string, fc.Arbitrary<unknown>][] = [
      ['loadCase.component.thickness', outside(1e-6, 100)],
      ['loadCase.component.minorDiameter', outside(1e-6, 100)],
      ['loadCase.component.includedAngle', outside(30, 180)],
      ['loadCase.pressure.depth', outside(0.01, 12000)],
      ['loadCase.pressure.latitude', outside(-90, 90)],
      ['loadCase.temperature.min', notNumber],
      ['loadCase.sustainedHours', outside(0, 1e6)],
      ['loadCase.cycles', fc.oneof(outside(0, 1e9), fc.double({ min: 0.001, max: 1e6, noNaN: true }).filter((x) => !Number.isInteger(x)))],
      ['loadCase.targetSafetyFactor', fc.oneof(notNumber, fc.double({ max: 0, noNaN: true }), fc.double({ min: 100, minExcluded: true, noNaN: true }))],
      ['limit', outside(1, 5000)],
    ];
    fc.assert(
      fc.property(fc.constantFrom(...cases).chain(([path, arb]) => arb.map((v) => [path, v] as const)), ([path, value]) => {
        expect(evaluateRequestSchema.safeParse(withValue(path, value)).success).toBe(false);
      }),
      { numRuns: 500 },
    );
    fc.assert(
      fc.property(fc.string({ minLength: 1 }).filter((k) => !['pressure', 'temperature', 'sustainedHours', 'cycles', 'targetSafetyFactor', 'proofFactor', 'humanOccupancy', 'component'].includes(k)), (key) => {
        expect(loadCaseSchema.safeParse({ ...valid.loadCase, [key]: 1 }).success).toBe(false);
      }),
    );
  });

  it('can be published as JSON Schema (for the OpenAPI document)', () => {
    const schema = z.toJSONSchema(evaluateRequestSchema, { io: 'input' }) as { properties: Record<string, unknown> };
    expect(Object.keys(schema.properties)).toEqual(['loadCase', 'candidates', 'limit', 'sortBy', 'coveredFirst', 'filters', 'form']);
  });
});

describe('pressure query schema', () => {
  it('parses strings from the URL, allows depth 0 and refuses junk', () => {
    expect(pressureQuerySchema.parse({ depth: '1200', latitude: '-56.5', water: 'sea' })).toEqual({ depth: 1200, latitude: -56.5, water: 'sea' });
    expect(pressureQuerySchema.parse({ depth: '0', latitude: '0', water: 'fresh' }).depth).toBe(0);
    const r = pressureQuerySchema.safeParse({ depth: 'deep', latitude: '', water: 'lake', extra: '1' });
    expect(r.success).toBe(false);
    const f = Object.fromEntries(r.error!.issues.map((i) => [i.path.join('.'), i.message]));
    expect(f.depth).toBe('Depth must be a number.');
    expect(f.latitude).toBe('Latitude is required.');
    expect(f.water).toBe('Water must be "sea" or "fresh".');
    expect(f['']).toMatch(/unknown field "extra"/);
  });
});

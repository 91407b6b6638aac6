import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compareResults, sortResults, topResults } from './rank';
import type { CandidateResult, SortBy } from './types';

const result = (name: string, margin: number, requiredThickness: number | null, propertySetId?: number): CandidateResult => ({
  name,
  propertySetId,
  governingMode: 'tension',
  safetyFactor: (margin + 1) * 2,
  margin,
  requiredThickness,
  sizedBy: requiredThickness === null ? null : { kind: 'mode', mode: 'tension' },
  proofSafetyFactor: (margin + 1) * 1.6,
  massPerArea: requiredThickness === null ? null : requiredThickness * 1000,
  weightToDisplacement: requiredThickness === null ? null : requiredThickness / 10,
  targetSafetyFactor: 2,
  factors: { temperature: 1, worstTemperature: 20, temperatureSource: 'set', sustainedLoad: 1, cyclic: 1, life: 1, lifeBasis: 'none' },
  modes: [],
  warnings: [],
});

describe('ranking', () => {
  const rows = [result('C', 0.5, 0.02), result('A', -0.2, null), result('B', 0.5, 0.01), result('D', 1.5, 0.03)];
  it.each([
    ['margin', ['D', 'B', 'C', 'A']],
    ['requiredThickness', ['B', 'C', 'D', 'A']],
    ['massPerArea', ['B', 'C', 'D', 'A']],
    ['weightToDisplacement', ['B', 'C', 'D', 'A']],
  ] as [SortBy, string[]][])('%s', (sortBy, expected) => {
    expect(sortResults(rows.slice(), sortBy).map((r) => r.name)).toEqual(expected);
  });

  it('topResults equals a full sort cut to the limit, including ties (fast-check)', () => {
    const row = fc
      .record({
        name: fc.constantFrom('A', 'B', 'C', 'D', 'E'),
        margin: fc.constantFrom(-1, -0.5, 0, 0.25, 0.5, 3),
        t: fc.option(fc.constantFrom(0.01, 0.02, 0.05), { nil: null }),
        id: fc.option(fc.integer({ min: 1, max: 50 }), { nil: undefined }),
      })
      .map((r) => result(r.name, r.margin, r.t, r.id));
    fc.assert(
      fc.property(
        fc.array(row, { maxLength: 200 }),
        fc.integer({ min: 1, max: 250 }),
        fc.constantFrom<SortBy>('margin', 'requiredThickness', 'massPerArea', 'weightToDisplacement'),
        (list, limit, sortBy) => {
          const expected = list.slice().sort(compareResults(sortBy)).slice(0, limit);
          const got = topResults(list, sortBy, limit);
          expect(got.map((r) => [r.name, r.propertySetId, r.margin, r.requiredThickness])).toEqual(
            expected.map((r) => [r.name, r.propertySetId, r.margin, r.requiredThickness]),
          );
        },
      ),
    );
  });
});

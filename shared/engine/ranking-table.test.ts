import { describe, expect, it } from 'vitest';
import { DEMO_CAMERA, DEMO_CHAMBER_PORT, DEMO_HULL, DEMO_VIEWPORT } from '../demo-load-cases';
import { evaluate, prepareLoadCase } from './evaluate';
import { rankingMargin, rankingMarginFromTable } from './evaluate-candidate';
import { loadCases } from './evaluate-fixtures';
import { familyTargets, rankingTable } from './ranking-table';
import { acrylicLotMinimums, demo, hy80, titanium } from './test-materials';
import { seededRatingTables } from './test-support';
import type { CandidateMaterial, RatingTable } from './types';

// The seeded rating tables, so that candidates sized by a table take the per-object path.
const tables: RatingTable[] = Object.values(seededRatingTables());

/** 120 candidates: the test materials, numbered, one in five with the rating tables, one in seven without a family. */
const many = (): CandidateMaterial[] =>
  Array.from({ length: 120 }, (_, i) => {
    const base = [...demo, acrylicLotMinimums, hy80][i % 7];
    const c: CandidateMaterial = { ...base, name: `${base.name} #${i}`, propertySetId: i + 1, ...(i % 5 === 0 ? { ratingTables: tables } : {}) };
    if (i % 7 === 3) delete c.family;
    return c;
  });

const cases = { DEMO_VIEWPORT, DEMO_HULL, DEMO_CAMERA, DEMO_CHAMBER_PORT, ...loadCases };

describe('ranking table (typed-array columns of the ranking inputs)', () => {
  it.each(Object.entries(cases))('gives every candidate the same margin and group as rankingMargin: %s', (_name, loadCase) => {
    const candidates = many();
    for (const lc of [loadCase, { ...loadCase, humanOccupancy: true }, { ...loadCase, targetSafetyFactor: 3 }, { ...loadCase, familyTargets: { 'titanium-alloy': 2.5 } }]) {
      const prepared = prepareLoadCase(lc);
      const table = rankingTable(candidates, prepared.conditions);
      const targets = familyTargets(prepared.targetByFamily);
      for (let i = 0; i < candidates.length; i++) {
        const fromTable = rankingMarginFromTable(prepared, table, i, targets, { margin: 0, group: 0 });
        const direct = rankingMargin(prepared, candidates[i]);
        expect(fromTable).toEqual(direct);
      }
    }
  });

  it('is reused for the same list and conditions, and rebuilt when either changes', () => {
    const candidates = many();
    const c = { temperature: { min: 2, max: 25 }, sustainedHours: 1000, cycles: 2000 };
    const first = rankingTable(candidates, c);
    expect(rankingTable(candidates, { ...c, temperature: { ...c.temperature } })).toBe(first);
    const hot = rankingTable(candidates, { ...c, temperature: { min: 2, max: 60 } });
    expect(hot).not.toBe(first);
    expect(rankingTable(candidates, c)).toBe(first);
    // A list changed in place is never read stale.
    candidates[4] = { ...titanium, name: 'Harrow replacement titanium', propertySetId: 999 };
    const after = rankingTable(candidates, c);
    expect(after).not.toBe(first);
    expect(after.E[4]).toBe(titanium.youngsModulus);
  });

  it('a list changed in place ranks as the changed list (evaluate, against ranking them all)', () => {
    const candidates = many();
    const loadCase = DEMO_HULL;
    evaluate({ loadCase, candidates, limit: 10 });
    // The weakest candidate becomes the strongest titanium of all: the cut must see it.
    const before = evaluate({ loadCase, candidates, limit: 1000 }).results;
    const worst = before[before.length - 1];
    const at = candidates.findIndex((c) => c.name === worst.name);
    const k = 3;
    candidates[at] = { ...titanium, name: worst.name, propertySetId: at + 1, tensileStrength: titanium.tensileStrength * k, tensileYield: (titanium.tensileYield ?? 0) * k, compressiveStrength: titanium.compressiveStrength * k, shearStrength: titanium.shearStrength * k };
    const fast = evaluate({ loadCase, candidates, limit: 10 }).results;
    expect(fast).toEqual(evaluate({ loadCase, candidates, limit: 1000 }).results.slice(0, 10));
    expect(fast.map((r) => r.name)).toContain(worst.name);
  });
});

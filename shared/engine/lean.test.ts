import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEMO_CAMERA, DEMO_CHAMBER_PORT, DEMO_HULL, DEMO_VIEWPORT } from '../demo-load-cases';
import { evaluate } from './evaluate';
import { loadCases } from './evaluate-fixtures';
import { LEAN_FORMAT, packEvaluation, roundedLikeLean, unpackEvaluation } from './lean';
import { acrylicLotMinimums, demo, hy80 } from './test-materials';
import { seededRatingTables } from './test-support';
import type { CandidateMaterial, EvaluateResult, RatingTable } from './types';

// The seeded rating tables, so that candidates sized by a table (with its rating block) are packed too.
const tables: RatingTable[] = Object.values(seededRatingTables());

/** 100 candidates: the test materials, numbered, one in five with the rating tables. */
const hundred: CandidateMaterial[] = Array.from({ length: 100 }, (_, i) => {
  const base = [...demo, acrylicLotMinimums, hy80][i % 7];
  return { ...base, name: `${base.name} #${i}`, propertySetId: i + 1, ...(i % 5 === 0 ? { ratingTables: tables } : {}) };
});

const cases = { DEMO_VIEWPORT, DEMO_HULL, DEMO_CAMERA, DEMO_CHAMBER_PORT, ...loadCases };
const run = (loadCase: (typeof cases)[keyof typeof cases]): EvaluateResult => evaluate({ loadCase, candidates: hundred, limit: 100, coveredFirst: false });

describe('lean evaluation answer', () => {
  it.each(Object.entries(cases))('unpacks %s to the full answer but for the rounding to 6 significant digits', (_name, loadCase) => {
    const full = run(loadCase);
    const lean = packEvaluation(full);
    expect(lean.format).toBe(LEAN_FORMAT);
    const back = unpackEvaluation(JSON.parse(JSON.stringify(lean)));
    expect(back).toEqual(roundedLikeLean(full));
    // Every model text and warning is sent once.
    expect(new Set(lean.texts).size).toBe(lean.texts.length);
  });

  it('sends 100 results in at most 60 KB of JSON (the full form is several times larger)', () => {
    for (const loadCase of Object.values(cases)) {
      const full = run(loadCase);
      expect(full.results).toHaveLength(100);
      const lean = JSON.stringify(packEvaluation(full)).length;
      expect(lean).toBeLessThanOrEqual(60 * 1024);
      expect(JSON.stringify(full).length).toBeGreaterThan(3 * lean);
    }
  });

  it('keeps ids and counts exact and the sign of every margin, however small', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e-3, max: 1e-3, noNaN: true }).filter((m) => m !== 0), (margin) => {
        const full = run(DEMO_VIEWPORT);
        full.results[0].margin = margin;
        const back = unpackEvaluation(packEvaluation(full));
        expect(Math.sign(back.results[0].margin)).toBe(Math.sign(margin));
        expect(back.results.map((r) => r.propertySetId)).toEqual(full.results.map((r) => r.propertySetId));
        expect(back.total).toBe(full.total);
      }),
      { numRuns: 50 },
    );
  });
});

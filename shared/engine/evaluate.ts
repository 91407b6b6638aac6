/**
 * Evaluation of candidates against one load case: allowables, per-mode checks, governing mode,
 * required thickness, mass per area and hull weight-to-displacement, with warnings, ranked best
 * first. The load case is prepared in load-case.ts and each candidate checked in
 * evaluate-candidate.ts; this file ranks them.
 */
import type { LoadCaseInput } from '../schemas/evaluate';
import { prepareLoadCase } from './load-case';
import { evaluateCandidate, rankingMarginFromTable } from './evaluate-candidate';
import { familyTargets, rankingTable } from './ranking-table';
import { sortResults, topResults } from './rank';
import type { CandidateMaterial, CandidateResult, EvaluateResult, SortBy } from './types';

export { prepareLoadCase, targetFor, type PreparedLoadCase } from './load-case';
export { evaluateCandidate, modeMaterial, rankingMargin } from './evaluate-candidate';

/** Input of `evaluate`: a load case and candidates already resolved to material values. */
export interface EvaluateInput {
  loadCase: LoadCaseInput;
  candidates: readonly CandidateMaterial[];
  /** How many results to return, best first (default 100). */
  limit?: number;
  /** Ranking (default 'margin'). */
  sortBy?: SortBy;
  /** Human occupancy, windows: rank covered candidates above uncovered ones (default true). */
  coveredFirst?: boolean;
}

/**
 * The `limit`-th smallest key of `keys` (the cut-off of the best `limit`), by quickselect on a
 * copy (Hoare's selection: linear on average, where sorting would be n log n).
 */
function cutOff(keys: Float64Array, limit: number): number {
  const a = keys.slice();
  const k = limit - 1;
  let lo = 0;
  let hi = a.length - 1;
  while (lo < hi) {
    const pivot = a[(lo + hi) >>> 1];
    let i = lo;
    let j = hi;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) hi = j;
    else if (k >= i) lo = i;
    else break;
  }
  return a[k];
}

/**
 * Evaluates every candidate against the load case, ranks them best first and returns at most
 * `limit` of them. Pure and deterministic.
 */
export function evaluate(input: EvaluateInput): EvaluateResult {
  const prepared = prepareLoadCase(input.loadCase);
  const candidates = input.candidates;
  const n = candidates.length;
  const limit = Math.max(0, Math.floor(input.limit ?? 100));
  const sortBy = input.sortBy ?? 'margin';
  const coveredFirst = input.coveredFirst ?? true;
  let results: CandidateResult[];
  if (sortBy === 'margin' && limit > 0 && limit < n && n > 64) {
    // Ranking by margin needs only each candidate's sizing margin (and coverage group). Every
    // candidate is checked; the full result (required thicknesses, warnings, model texts) is
    // built only for those that make the cut, in the same order topResults would give.
    const keys = new Float64Array(n);
    const groups = new Uint8Array(n);
    let uncovered = 0;
    const r = { margin: 0, group: 0 };
    const table = rankingTable(candidates, prepared.conditions);
    const targets = familyTargets(prepared.targetByFamily);
    for (let i = 0; i < n; i++) {
      rankingMarginFromTable(prepared, table, i, targets, r);
      // A margin that is not a number (no answer) counts as the worst.
      keys[i] = Number.isNaN(r.margin) ? Infinity : -r.margin;
      if (coveredFirst && r.group === 1) {
        groups[i] = 1;
        uncovered++;
      }
    }
    const kept: CandidateResult[] = [];
    const covered = n - uncovered;
    if (uncovered === 0 || limit <= covered) {
      const pool = uncovered === 0 ? keys : keys.filter((_, i) => groups[i] === 0);
      const cut = cutOff(pool, limit);
      for (let i = 0; i < n; i++) if (groups[i] === 0 && keys[i] <= cut) kept.push(evaluateCandidate(prepared, candidates[i]));
    } else {
      const cut = cutOff(keys.filter((_, i) => groups[i] === 1), limit - covered);
      for (let i = 0; i < n; i++) if (groups[i] === 0 || keys[i] <= cut) kept.push(evaluateCandidate(prepared, candidates[i]));
    }
    results = sortResults(kept, 'margin', coveredFirst).slice(0, limit);
  } else {
    const all: CandidateResult[] = new Array(n);
    for (let i = 0; i < n; i++) all[i] = evaluateCandidate(prepared, candidates[i]);
    results = topResults(all, sortBy, limit, coveredFirst);
  }
  return {
    pressure: prepared.pressure,
    proofTestPressure: prepared.proofTestPressure,
    pressureMethod: prepared.pressureMethod,
    results,
    total: n,
  };
}

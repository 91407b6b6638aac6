/**
 * Ranking of evaluated candidates, best first, with a deterministic tie-break
 * (name in code-unit order, then property set id, inline candidates last).
 */
import type { CandidateResult, SortBy } from './types';

function byName(a: CandidateResult, b: CandidateResult): number {
  if (a.name < b.name) return -1;
  if (a.name > b.name) return 1;
  const ia = a.propertySetId ?? Number.MAX_SAFE_INTEGER;
  const ib = b.propertySetId ?? Number.MAX_SAFE_INTEGER;
  return ia - ib;
}

/**
 * The ranking key, smaller is better: −margin for 'margin'; the value itself for the others,
 * with null (no thickness suffices / not a hull) as +Infinity so it sorts last.
 */
export function rankKey(r: CandidateResult, sortBy: SortBy): number {
  switch (sortBy) {
    case 'requiredThickness':
      return r.requiredThickness ?? Infinity;
    case 'massPerArea':
      return r.massPerArea ?? Infinity;
    case 'weightToDisplacement':
      return r.weightToDisplacement ?? Infinity;
    case 'margin':
    default:
      return -r.margin;
  }
}

/** Human occupancy: 1 for a window no rule covers, else 0 (covered candidates rank first). */
export function coverageGroup(r: Pick<CandidateResult, 'coverage'>): number {
  return r.coverage === 'not-covered' ? 1 : 0;
}

/**
 * Comparator for a ranking: negative when `a` ranks before `b`. With `coveredFirst`, windows no
 * rule covers for human occupancy come after the covered ones whatever their key.
 */
export function compareResults(sortBy: SortBy, coveredFirst = false): (a: CandidateResult, b: CandidateResult) => number {
  return (a, b) => {
    if (coveredFirst) {
      const g = coverageGroup(a) - coverageGroup(b);
      if (g !== 0) return g;
    }
    const ka = rankKey(a, sortBy);
    const kb = rankKey(b, sortBy);
    return ka < kb ? -1 : ka > kb ? 1 : byName(a, b);
  };
}

/**
 * Sorts results in place, best first: 'margin' descending; 'requiredThickness', 'massPerArea'
 * and 'weightToDisplacement' ascending with nulls last. Ties: by name, then property set id.
 */
export function sortResults(results: CandidateResult[], sortBy: SortBy, coveredFirst = false): CandidateResult[] {
  return results.sort(compareResults(sortBy, coveredFirst));
}

/**
 * The best `limit` results in ranking order (the same as `sortResults(...).slice(0, limit)`),
 * without sorting everything: the keys are sorted natively to find the cut-off, then only the
 * results at or better than it are sorted with the tie-break.
 */
export function topResults(results: CandidateResult[], sortBy: SortBy, limit: number, coveredFirst = false): CandidateResult[] {
  const n = results.length;
  if (limit <= 0) return [];
  if (limit >= n || n <= 64 || (coveredFirst && results.some((r) => coverageGroup(r) === 1))) {
    return sortResults(results.slice(), sortBy, coveredFirst).slice(0, limit);
  }
  const keys = new Float64Array(n);
  for (let i = 0; i < n; i++) keys[i] = rankKey(results[i], sortBy);
  const sorted = keys.slice().sort();
  const cut = sorted[limit - 1];
  const kept: CandidateResult[] = [];
  for (let i = 0; i < n; i++) if (keys[i] <= cut) kept.push(results[i]);
  return sortResults(kept, sortBy).slice(0, limit);
}

/** The lowest margin among a result's checks of one failure mode (a hull can have several), or undefined. */
export function modeMargin(r: Pick<CandidateResult, 'modes'>, mode: CandidateResult['governingMode']): number | undefined {
  let worst: number | undefined;
  for (const m of r.modes) if (m.mode === mode && (worst === undefined || m.margin < worst)) worst = m.margin;
  return worst;
}

/**
 * The ranking inputs of a candidate list as columns of typed arrays: for each candidate its
 * modulus, Poisson's ratio, allowables under one set of conditions, family and whether it has
 * rating tables. Ranking by margin reads every candidate of every evaluation; reading numbers
 * from arrays costs a fraction of reading them from thousands of differently shaped objects
 * (and of a per-object memo lookup), so a table is built once per list and conditions and reused.
 *
 * A list is the same list while it holds the same candidate objects in the same order (checked
 * element by element on every use, so a list changed in place is never read stale). Candidate
 * objects are treated as immutable, as the allowables memo in allowables.ts already does.
 */
import { allowablesFor, type Conditions } from './allowables';
import type { ModeMaterial } from './components/common';
import { FAMILIES, type Family } from '../schemas/catalogue';
import type { CandidateMaterial } from './types';

const SHEAR_BASES = ['strength', 'yield', 'von-mises'] as const;
/** Family index for a candidate without a family. */
export const NO_FAMILY = 255;
const FAMILY_INDEX = new Map<Family, number>(FAMILIES.map((f, i) => [f, i]));

export interface RankingTable {
  readonly candidates: readonly CandidateMaterial[];
  readonly min: number;
  readonly max: number;
  readonly hours: number;
  readonly cycles: number;
  readonly E: Float64Array;
  readonly nu: Float64Array;
  readonly tension: Float64Array;
  readonly compression: Float64Array;
  readonly shear: Float64Array;
  /** Bit 0: tension on yield; bit 1: compression on yield; bits 2–3: index in SHEAR_BASES. */
  readonly flags: Uint8Array;
  /** Index in FAMILIES, or NO_FAMILY. */
  readonly family: Uint8Array;
  /** 1 when the candidate has rating tables (ranked through the per-object path). */
  readonly rated: Uint8Array;
}

function build(candidates: readonly CandidateMaterial[], c: Conditions): RankingTable {
  const n = candidates.length;
  const t: RankingTable = {
    candidates: candidates.slice(),
    min: c.temperature.min,
    max: c.temperature.max,
    hours: c.sustainedHours,
    cycles: c.cycles,
    E: new Float64Array(n),
    nu: new Float64Array(n),
    tension: new Float64Array(n),
    compression: new Float64Array(n),
    shear: new Float64Array(n),
    flags: new Uint8Array(n),
    family: new Uint8Array(n),
    rated: new Uint8Array(n),
  };
  for (let i = 0; i < n; i++) {
    const m = candidates[i];
    const a = allowablesFor(m, c, null);
    t.E[i] = m.youngsModulus;
    t.nu[i] = m.poissonsRatio;
    t.tension[i] = a.tension;
    t.compression[i] = a.compression;
    t.shear[i] = a.shear;
    t.flags[i] = (a.tensionOnYield ? 1 : 0) | (a.compressionOnYield ? 2 : 0) | (SHEAR_BASES.indexOf(a.shearBasis) << 2);
    t.family[i] = m.family === undefined ? NO_FAMILY : (FAMILY_INDEX.get(m.family) ?? NO_FAMILY);
    t.rated[i] = m.ratingTables && m.ratingTables.length > 0 ? 1 : 0;
  }
  return t;
}

function sameList(t: RankingTable, candidates: readonly CandidateMaterial[]): boolean {
  const own = t.candidates;
  if (own.length !== candidates.length) return false;
  for (let i = 0; i < own.length; i++) if (own[i] !== candidates[i]) return false;
  return true;
}

/** The last few tables per list (an engineer changes geometry and depth far more often than conditions). */
const TABLES = new WeakMap<readonly CandidateMaterial[], RankingTable[]>();
const KEPT_PER_LIST = 4;

/** The ranking table of `candidates` under conditions `c`, built on first use. */
export function rankingTable(candidates: readonly CandidateMaterial[], c: Conditions): RankingTable {
  let kept = TABLES.get(candidates);
  if (kept === undefined) TABLES.set(candidates, (kept = []));
  for (let k = 0; k < kept.length; k++) {
    const t = kept[k];
    if (t.min === c.temperature.min && t.max === c.temperature.max && t.hours === c.sustainedHours && t.cycles === c.cycles) {
      if (sameList(t, candidates)) return t;
      // The list was changed in place: every table of it is stale.
      kept.length = 0;
      break;
    }
  }
  const t = build(candidates, c);
  kept.unshift(t);
  if (kept.length > KEPT_PER_LIST) kept.length = KEPT_PER_LIST;
  return t;
}

/** Writes candidate i's material values from the table into `mm` (one object, one shape). */
export function readModeMaterial(t: RankingTable, i: number, mm: ModeMaterial): void {
  const f = t.flags[i];
  mm.E = t.E[i];
  mm.nu = t.nu[i];
  mm.tension = t.tension[i];
  mm.compression = t.compression[i];
  mm.shear = t.shear[i];
  mm.tensionOnYield = (f & 1) !== 0;
  mm.compressionOnYield = (f & 2) !== 0;
  mm.shearBasis = SHEAR_BASES[f >> 2];
}

/** Each family's target (by index in FAMILIES), for a prepared load case's lookup. */
export function familyTargets(targetByFamily: Record<Family, number>): Float64Array {
  const out = new Float64Array(FAMILIES.length);
  for (let i = 0; i < FAMILIES.length; i++) out[i] = targetByFamily[FAMILIES[i]];
  return out;
}

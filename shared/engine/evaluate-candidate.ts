/**
 * One candidate against a prepared load case: per-mode checks at the load case's thickness and
 * proof pressure, governing mode, required thickness (from a covering rating table, else the
 * analytical modes), mass per area and weight-to-displacement, with warnings; and the cheaper
 * ranking margin alone.
 */
import { allowablesFor, fmt, isBrittle, isPolymer, type Allowables } from './allowables';
import type { ModeMaterial } from './components/common';
import { isWindowComponent, rateWithTable, ratingMargin, tableCovers } from './rating-tables';
import type { CandidateMaterial, CandidateResult, ModeResult, RatingResult, RatingTable, SizedBy, WindowCoverage } from './types';
import { targetFor, type PreparedLoadCase } from './load-case';
import { FALLBACK_TARGET_SAFETY_FACTOR } from './defaults';
import { NO_FAMILY, readModeMaterial, type RankingTable } from './ranking-table';
import { ACRYLIC_UNRATED_WARNING, BRITTLE_WINDOW_WARNING, CREEP_MODULUS_WARNING, FALLBACK_TARGET_WARNING, uncoveredWarning } from './candidate-warnings';

// Scratch arrays for one candidate's modes (at most 4); evaluation is synchronous.
const STRESS = new Float64Array(4);
const ALLOWABLE = new Float64Array(4);
const PROOF_STRESS = new Float64Array(4);
const PROOF_ALLOWABLE = new Float64Array(4);

const finiteOrNull = (x: number | null): number | null => (x !== null && Number.isFinite(x) ? x : null);

/** Material values for the component models from a candidate and its allowables. */
function toModeMaterial(candidate: CandidateMaterial, a: Allowables): ModeMaterial {
  return {
    E: candidate.youngsModulus,
    nu: candidate.poissonsRatio,
    tension: a.tension,
    compression: a.compression,
    shear: a.shear,
    tensionOnYield: a.tensionOnYield,
    compressionOnYield: a.compressionOnYield,
    shearBasis: a.shearBasis,
  };
}

/** The same with short-term allowables (no life factor), for the proof test. */
function toShortTermMaterial(mm: ModeMaterial, a: Allowables): ModeMaterial {
  return { ...mm, tension: a.shortTerm.tension, compression: a.shortTerm.compression, shear: a.shortTerm.shear };
}

/** Material values for the component models, with allowables for the prepared load case. */
export function modeMaterial(candidate: CandidateMaterial, prepared: PreparedLoadCase, warnings: string[]): ModeMaterial {
  return toModeMaterial(candidate, allowablesFor(candidate, prepared.conditions, warnings));
}

/** Rating-table readings per prepared load case (shared by its candidates; never changed once made). */
const TABLE_READINGS = new WeakMap<PreparedLoadCase, Map<RatingTable, Readonly<RatingResult>>>();

/**
 * The rating-table route of a window candidate: among the published tables that cover its grade
 * and this geometry, the one that asks for the most thickness (conservative); when none gives a
 * number, the first one's reason. Null when no table covers the candidate or the component is no window.
 */
function ratingRoute(prepared: PreparedLoadCase, candidate: CandidateMaterial): Readonly<RatingResult> | null {
  const tables = candidate.ratingTables;
  const c = prepared.component;
  if (!tables || tables.length === 0 || !isWindowComponent(c)) return null;
  // A table's reading depends on the load case alone, and many candidates (every set of a grade)
  // share a table: read each table once per load case.
  let read = TABLE_READINGS.get(prepared);
  if (read === undefined) TABLE_READINGS.set(prepared, (read = new Map()));
  let best: Readonly<RatingResult> | null = null;
  for (let i = 0; i < tables.length; i++) {
    if (!tableCovers(tables[i], c)) continue;
    let r = read.get(tables[i]);
    if (r === undefined) read.set(tables[i], (r = rateWithTable(tables[i], c, prepared.pressure, prepared.conditions)));
    if (best === null) best = r;
    else if (r.requiredThickness !== null && (best.requiredThickness === null || r.requiredThickness > best.requiredThickness)) best = r;
  }
  return best;
}

/** Lowest safety factor over the modes at thickness t (analytical cross-check of a table's thickness). */
function lowestSafetyFactorAt(prepared: PreparedLoadCase, mm: ModeMaterial, t: number): number {
  const { model, component, pressure } = prepared;
  model.fill(component, t, pressure, mm, PROOF_STRESS, PROOF_ALLOWABLE);
  let sf = Infinity;
  for (let i = 0; i < model.modes.length; i++) {
    const s = PROOF_ALLOWABLE[i] / PROOF_STRESS[i];
    if (s < sf) sf = s;
  }
  return sf;
}

/** Reused by rankingMargin, which runs for every candidate of every evaluation: nothing is allocated per candidate. */
const SCRATCH_MM: ModeMaterial = { E: 0, nu: 0, tension: 0, compression: 0, shear: 0, tensionOnYield: false, compressionOnYield: false, shearBasis: 'strength' };

/** What rankingMargin gives for one candidate: its sizing margin and coverage group (0 first). */
export interface RankingKey {
  margin: number;
  group: number;
}

/**
 * The ranking inputs of one candidate (its sizing margin and coverage group), computed exactly as
 * evaluateCandidate does, without building its result; written into `out`.
 */
export function rankingMargin(prepared: PreparedLoadCase, candidate: CandidateMaterial, out: RankingKey = { margin: 0, group: 0 }): RankingKey {
  const a = allowablesFor(candidate, prepared.conditions, null);
  const mm = SCRATCH_MM;
  mm.E = candidate.youngsModulus;
  mm.nu = candidate.poissonsRatio;
  mm.tension = a.tension;
  mm.compression = a.compression;
  mm.shear = a.shear;
  mm.tensionOnYield = a.tensionOnYield;
  mm.compressionOnYield = a.compressionOnYield;
  mm.shearBasis = a.shearBasis;
  const { model, component, pressure: p } = prepared;
  const t = model.thickness(component);
  const rating = ratingRoute(prepared, candidate);
  const tableMargin = rating ? ratingMargin(rating, p, t) : null;
  out.group = prepared.humanOccupancy && isWindowComponent(component) && tableMargin === null ? 1 : 0;
  if (tableMargin !== null) {
    out.margin = tableMargin;
    return out;
  }
  model.fill(component, t, p, mm, STRESS, ALLOWABLE);
  let govSf = Infinity;
  for (let i = 0; i < model.modes.length; i++) {
    const sf = ALLOWABLE[i] / STRESS[i];
    if (sf < govSf) govSf = sf;
  }
  out.margin = govSf / targetFor(prepared, candidate) - 1;
  return out;
}

/**
 * rankingMargin for candidate `i` of a ranking table (same answer, read from the table's
 * columns). `targets` holds each family's target under the prepared load case (familyTargets).
 * A candidate with rating tables goes through rankingMargin.
 */
export function rankingMarginFromTable(prepared: PreparedLoadCase, table: RankingTable, i: number, targets: Float64Array, out: RankingKey): RankingKey {
  if (table.rated[i] === 1) return rankingMargin(prepared, table.candidates[i], out);
  const mm = SCRATCH_MM;
  readModeMaterial(table, i, mm);
  const { model, component, pressure: p } = prepared;
  model.fill(component, model.thickness(component), p, mm, STRESS, ALLOWABLE);
  let govSf = Infinity;
  for (let k = 0; k < model.modes.length; k++) {
    const sf = ALLOWABLE[k] / STRESS[k];
    if (sf < govSf) govSf = sf;
  }
  // No rating route: uncovered under human occupancy when the component is a window.
  out.group = prepared.humanOccupancy && isWindowComponent(component) ? 1 : 0;
  const f = table.family[i];
  const target = prepared.targetSafetyFactor ?? (f === NO_FAMILY ? FALLBACK_TARGET_SAFETY_FACTOR : targets[f]);
  out.margin = govSf / target - 1;
  return out;
}

/** Evaluates one candidate at the load case's own thickness. */
export function evaluateCandidate(prepared: PreparedLoadCase, candidate: CandidateMaterial): CandidateResult {
  const warnings: string[] = [];
  const allowables = allowablesFor(candidate, prepared.conditions, warnings);
  const mm = toModeMaterial(candidate, allowables);
  const target = targetFor(prepared, candidate);
  if (prepared.targetSafetyFactor === undefined && candidate.family === undefined) warnings.push(FALLBACK_TARGET_WARNING);

  const { model, component, pressure: p } = prepared;
  const t = model.thickness(component);
  model.fill(component, t, p, mm, STRESS, ALLOWABLE);
  model.fill(component, t, prepared.proofTestPressure, toShortTermMaterial(mm, allowables), PROOF_STRESS, PROOF_ALLOWABLE);

  const n = model.modes.length;
  const modes: ModeResult[] = new Array(n);
  let gov = 0;
  let govSf = Infinity;
  let proofSf = Infinity;
  let required: number | null = 0;
  let sizing = 0;
  for (let i = 0; i < n; i++) {
    const stress = STRESS[i];
    const allowable = ALLOWABLE[i];
    const sf = allowable / stress;
    const proof = { stress: PROOF_STRESS[i], allowable: PROOF_ALLOWABLE[i], safetyFactor: PROOF_ALLOWABLE[i] / PROOF_STRESS[i] };
    if (proof.safetyFactor < proofSf) proofSf = proof.safetyFactor;
    const req = finiteOrNull(model.required(component, p, mm, target, i, t, stress, allowable));
    modes[i] = {
      mode: model.modes[i],
      stress,
      allowable,
      safetyFactor: sf,
      margin: sf / target - 1,
      requiredThickness: req,
      model: model.model(component, i, mm),
      proof,
    };
    if (model.checkName) modes[i].check = model.checkName(component, i);
    const detail = model.collapse?.(component, t, mm, i);
    if (detail) modes[i].collapse = detail;
    if (sf < govSf) {
      govSf = sf;
      gov = i;
    }
    if (req === null) {
      required = null;
      warnings.push(
        `No thickness of this material meets the target safety factor ${fmt(target)} in ${model.modes[i]} at ${fmt(p / 1e6)} MPa: ` +
          'thickening cannot bring the stress below allowable ÷ target.',
      );
    } else if (required !== null && req > required) {
      required = req;
      sizing = i;
    }
  }
  if (proofSf < 1) {
    warnings.push(
      `At the proof-test pressure (${fmt(prepared.proofTestPressure / 1e6)} MPa, ${fmt(prepared.proofFactor)} × design) the lowest safety factor ` +
        `against short-term strength is ${fmt(proofSf)}, below 1: the proof test itself would fail this part at the evaluated thickness.`,
    );
  }

  const deflection = model.check(component, p, mm, STRESS, ALLOWABLE, warnings);
  if (model.usesModulus && prepared.conditions.sustainedHours > 0 && isPolymer(candidate.family)) warnings.push(CREEP_MODULUS_WARNING);

  // Sizing: a rating table that covers the candidate, else the analytical modes.
  let margin = modes[gov].margin;
  let sizedBy: SizedBy | null = required === null ? null : { kind: 'mode', mode: model.modes[sizing] };
  // A copy: this candidate's cross-check is written into it; the table reading is shared.
  const read = ratingRoute(prepared, candidate);
  const rating: RatingResult | null = read ? { ...read } : null;
  const window = isWindowComponent(component);
  if (rating) {
    const tableMargin = ratingMargin(rating, p, t);
    if (tableMargin === null || rating.requiredThickness === null) {
      required = null;
      sizedBy = null;
      warnings.push(`${rating.outside} No thickness is given; the analytical modes below are cross-checks, not a substitute for the table.`);
    } else {
      margin = tableMargin;
      required = rating.requiredThickness;
      sizedBy = rating.ratingTableId === undefined ? { kind: 'rating-table', name: rating.name } : { kind: 'rating-table', ratingTableId: rating.ratingTableId, name: rating.name };
      const cross = lowestSafetyFactorAt(prepared, mm, required);
      rating.crossCheckSafetyFactor = cross;
      if (cross < 1) {
        warnings.push(
          `At the rating table's thickness the analytical cross-check gives a safety factor of ${fmt(cross)}, below 1: the table and the ` +
            "analytical model disagree; confirm that the table applies to this grade, seat and service.",
        );
      }
    }
  } else if (window && candidate.family === 'acrylic') {
    warnings.push(ACRYLIC_UNRATED_WARNING);
  }
  if (window && isBrittle(candidate.family)) warnings.push(BRITTLE_WINDOW_WARNING);
  let coverage: WindowCoverage | undefined;
  if (prepared.humanOccupancy && window) {
    coverage = sizedBy !== null && sizedBy.kind === 'rating-table' ? 'covered' : 'not-covered';
    if (coverage === 'not-covered') warnings.unshift(uncoveredWarning(candidate.family, rating !== null));
  }
  for (let i = 0; i < prepared.warnings.length; i++) warnings.push(prepared.warnings[i]);

  const g = modes[gov];
  const result: CandidateResult = {
    name: candidate.name,
    governingMode: g.mode,
    safetyFactor: g.safetyFactor,
    margin,
    requiredThickness: required,
    sizedBy,
    proofSafetyFactor: proofSf,
    massPerArea: required === null ? null : model.massPerArea ? model.massPerArea(component, required, candidate.density) : candidate.density * required,
    weightToDisplacement:
      required === null || !model.weightToDisplacement
        ? null
        : model.weightToDisplacement(component, required, candidate.density, prepared.waterDensity),
    targetSafetyFactor: target,
    factors: allowables.factors,
    modes,
    warnings,
  };
  if (rating) result.rating = rating;
  if (coverage) result.coverage = coverage;
  if (candidate.propertySetId !== undefined) result.propertySetId = candidate.propertySetId;
  if (candidate.family !== undefined) result.family = candidate.family;
  if (candidate.inputs) result.inputs = candidate.inputs;
  if (deflection !== undefined) result.deflection = deflection;
  return result;
}

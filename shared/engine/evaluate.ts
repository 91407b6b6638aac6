/**
 * Evaluation of candidates against one load case: allowables, per-mode checks, governing mode,
 * required thickness, mass per area and hull weight-to-displacement, with warnings.
 */
import type { Component, LoadCaseInput } from '../schemas/evaluate';
import { DEFAULT_PROOF_FACTOR } from '../schemas/evaluate';
import { computeAllowables, fmt, isBrittle, isPolymer, type Allowables, type Conditions } from './allowables';
import type { ComponentModel, ModeMaterial } from './components/common';
import { modelFor } from './components/index';
import { defaultTargetSafetyFactor, WATER_DENSITY } from './defaults';
import { pressureFromDepth } from './pressure';
import { sortResults, topResults } from './rank';
import { isWindowComponent, rateWithTable, ratingMargin, tableCovers } from './rating-tables';
import type { CandidateMaterial, CandidateResult, EvaluateResult, ModeResult, RatingResult, SizedBy, SortBy, WindowCoverage } from './types';

/** A load case with its design pressure worked out once, for evaluating many candidates. */
export interface PreparedLoadCase {
  /** Design pressure, Pa gauge. */
  pressure: number;
  /** Design pressure × proof factor, Pa gauge. */
  proofTestPressure: number;
  proofFactor: number;
  pressureMethod: string;
  /** kg/m³, for weight-to-displacement. */
  waterDensity: number;
  conditions: Conditions;
  /** From the load case, or undefined to use each candidate's family default. */
  targetSafetyFactor: number | undefined;
  component: Component;
  model: ComponentModel<Component>;
  /** For human occupancy (window candidates no rule covers then warn and may rank lower). */
  humanOccupancy: boolean;
  /** Warnings that concern the load case itself; repeated on every result. */
  warnings: string[];
}

const PRESSURE_GIVEN = 'Pressure given directly by the user.';

function checkPositive(label: string, v: number): void {
  if (!(Number.isFinite(v) && v > 0)) throw new RangeError(`${label} must be a finite number greater than zero`);
}

/**
 * Works out the design pressure and everything else that does not depend on the candidate.
 * Expects a load case that passed `loadCaseSchema`; throws RangeError on values that would make
 * results non-finite (non-positive pressure or sizes).
 */
export function prepareLoadCase(loadCase: LoadCaseInput): PreparedLoadCase {
  const pin = loadCase.pressure;
  let pressure: number;
  let pressureMethod: string;
  let waterDensity = WATER_DENSITY.sea;
  if ('value' in pin) {
    pressure = pin.value;
    pressureMethod = PRESSURE_GIVEN;
  } else {
    const r = pressureFromDepth(pin.depth, pin.latitude, pin.water);
    pressure = r.pressure;
    pressureMethod = r.method;
    waterDensity = WATER_DENSITY[pin.water];
  }
  checkPositive('design pressure', pressure);
  const c = loadCase.component;
  checkPositive('thickness', c.thickness);
  if (c.type === 'flat-disc') checkPositive('diameter', c.diameter);
  else if (c.type === 'conical-frustum') checkPositive('minor diameter', c.minorDiameter);
  else if (c.type === 'spherical-sector') checkPositive('inner radius', c.innerRadius);
  else {
    checkPositive('inner radius', c.innerRadius);
    if (c.type === 'cylinder' || c.type === 'ring-stiffened-cylinder') checkPositive('length', c.length);
  }
  const proofFactor = loadCase.proofFactor ?? DEFAULT_PROOF_FACTOR;
  const target = loadCase.targetSafetyFactor;
  if (target !== undefined) checkPositive('target safety factor', target);
  const warnings: string[] = [];
  if (target !== undefined && target < 1) {
    warnings.push(`The target safety factor ${fmt(target)} is below 1: it accepts stresses above the allowable.`);
  }
  if ('value' in pin && (c.type === 'sphere' || c.type === 'cylinder' || c.type === 'ring-stiffened-cylinder')) {
    warnings.push('Pressure was given directly, so weight-to-displacement assumes seawater (1025 kg/m³).');
  }
  return {
    pressure,
    proofTestPressure: pressure * proofFactor,
    proofFactor,
    pressureMethod,
    waterDensity,
    conditions: {
      temperature: { min: loadCase.temperature.min, max: loadCase.temperature.max },
      sustainedHours: loadCase.sustainedHours,
      cycles: loadCase.cycles,
    },
    targetSafetyFactor: target,
    component: c,
    model: modelFor(c),
    humanOccupancy: loadCase.humanOccupancy === true,
    warnings,
  };
}

// Scratch arrays for one candidate's modes (at most 4); evaluation is synchronous.
const STRESS = new Float64Array(4);
const ALLOWABLE = new Float64Array(4);
const PROOF_STRESS = new Float64Array(4);
const PROOF_ALLOWABLE = new Float64Array(4);

const CREEP_MODULUS_WARNING =
  "Buckling and deflection use the short-term Young's modulus; creep under sustained load lowers the effective modulus of " +
  'polymers, so buckling margins and deflections shown here are not conservative.';

const FALLBACK_TARGET_WARNING =
  'No family given and no target safety factor in the load case: the most cautious family default was used as the target (common practice).';

const BRITTLE_WINDOW_WARNING =
  'Brittle window material in a bearing seat: glass and ceramics fail by contact fracture where the window bears on its seat (edge chipping ' +
  'and cracks from local contact stresses, which these models do not compute) and lose strength under sustained stress in water (static ' +
  'fatigue). Seat fit, gaskets and proof testing decide them; defer to the applicable standard and to tests.';

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
  return toModeMaterial(candidate, computeAllowables(candidate, prepared.conditions, warnings));
}

/** The target safety factor a candidate is held to under a prepared load case. */
export function targetFor(prepared: PreparedLoadCase, candidate: CandidateMaterial): number {
  return prepared.targetSafetyFactor ?? defaultTargetSafetyFactor(candidate.family);
}

/**
 * The rating-table route of a window candidate: among the published tables that cover its grade
 * and this geometry, the one that asks for the most thickness (conservative); when none gives a
 * number, the first one's reason. Null when no table covers the candidate or the component is no window.
 */
function ratingRoute(prepared: PreparedLoadCase, candidate: CandidateMaterial): RatingResult | null {
  const tables = candidate.ratingTables;
  const c = prepared.component;
  if (!tables || tables.length === 0 || !isWindowComponent(c)) return null;
  let best: RatingResult | null = null;
  for (let i = 0; i < tables.length; i++) {
    if (!tableCovers(tables[i], c)) continue;
    const r = rateWithTable(tables[i], c, prepared.pressure, prepared.conditions);
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

const SCRATCH_WARNINGS: string[] = [];

/**
 * The ranking inputs of one candidate (its sizing margin and coverage group), computed exactly as
 * evaluateCandidate does, without building its result.
 */
export function rankingMargin(prepared: PreparedLoadCase, candidate: CandidateMaterial): { margin: number; group: number } {
  SCRATCH_WARNINGS.length = 0;
  const mm = toModeMaterial(candidate, computeAllowables(candidate, prepared.conditions, SCRATCH_WARNINGS));
  const { model, component, pressure: p } = prepared;
  const t = model.thickness(component);
  const rating = ratingRoute(prepared, candidate);
  const tableMargin = rating ? ratingMargin(rating, p, t) : null;
  const group = prepared.humanOccupancy && isWindowComponent(component) && tableMargin === null ? 1 : 0;
  if (tableMargin !== null) return { margin: tableMargin, group };
  model.fill(component, t, p, mm, STRESS, ALLOWABLE);
  let govSf = Infinity;
  for (let i = 0; i < model.modes.length; i++) {
    const sf = ALLOWABLE[i] / STRESS[i];
    if (sf < govSf) govSf = sf;
  }
  return { margin: govSf / targetFor(prepared, candidate) - 1, group };
}

/** Evaluates one candidate at the load case's own thickness. */
export function evaluateCandidate(prepared: PreparedLoadCase, candidate: CandidateMaterial): CandidateResult {
  const warnings: string[] = [];
  const allowables = computeAllowables(candidate, prepared.conditions, warnings);
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
  const rating = ratingRoute(prepared, candidate);
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
  if (deflection !== undefined) result.deflection = deflection;
  return result;
}

const ACRYLIC_UNRATED_WARNING =
  'No published rating table covers this acrylic set for this window geometry: it is sized by the analytical modes alone. Window rules ' +
  "can ask for more: below about 20 bar the classification rules' flat-window table needs up to 45 % more thickness (at 5 bar) than " +
  "a safety factor of 4 on short-term strength gives. Enter your standard's tables as rating tables.";

function uncoveredWarning(family: CandidateMaterial['family'], outsideTable: boolean): string {
  const base = outsideTable
    ? 'HUMAN OCCUPANCY: this load case is outside the rating table that covers this window, so no window rule covers it here'
    : 'HUMAN OCCUPANCY: no window rule in the catalogue covers this material and geometry';
  const tail =
    family && family !== 'acrylic'
      ? `; the pressure-window standards' tables are written for acrylic, and ${family.replace('-', ' ')} windows for crewed service need a qualification of their own.`
      : '.';
  return `${base}${tail} It ranks below covered candidates; do not use it for crewed service without the approval of the applicable rules.`;
}

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

/** The `limit`-th smallest key of `keys` (the cut-off of the best `limit`). */
function cutOff(keys: Float64Array, limit: number): number {
  return keys.slice().sort()[limit - 1];
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
    for (let i = 0; i < n; i++) {
      const r = rankingMargin(prepared, candidates[i]);
      keys[i] = -r.margin;
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

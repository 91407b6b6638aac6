/**
 * Evaluation of candidates against one load case: allowables, per-mode checks, governing mode,
 * required thickness, mass per area and hull weight-to-displacement, with warnings.
 */
import type { Component, LoadCaseInput } from '../schemas/evaluate';
import { DEFAULT_PROOF_FACTOR } from '../schemas/evaluate';
import { computeAllowables, fmt, isPolymer, type Allowables, type Conditions } from './allowables';
import type { ComponentModel, ModeMaterial } from './components/common';
import { modelFor } from './components/index';
import { defaultTargetSafetyFactor, WATER_DENSITY } from './defaults';
import { pressureFromDepth } from './pressure';
import { sortResults, topResults } from './rank';
import type { CandidateMaterial, CandidateResult, EvaluateResult, ModeResult, SortBy } from './types';

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
  else {
    checkPositive('inner radius', c.innerRadius);
    if (c.type === 'cylinder') checkPositive('length', c.length);
  }
  const proofFactor = loadCase.proofFactor ?? DEFAULT_PROOF_FACTOR;
  const target = loadCase.targetSafetyFactor;
  if (target !== undefined) checkPositive('target safety factor', target);
  const warnings: string[] = [];
  if (target !== undefined && target < 1) {
    warnings.push(`The target safety factor ${fmt(target)} is below 1: it accepts stresses above the allowable.`);
  }
  if ('value' in pin && (c.type === 'sphere' || c.type === 'cylinder')) {
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
    warnings,
  };
}

// Scratch arrays for one candidate's modes (at most 4); evaluation is synchronous.
const STRESS = new Float64Array(4);
const ALLOWABLE = new Float64Array(4);

const CREEP_MODULUS_WARNING =
  "Buckling and deflection use the short-term Young's modulus; creep under sustained load lowers the effective modulus of " +
  'polymers, so buckling margins and deflections shown here are not conservative.';

const FALLBACK_TARGET_WARNING =
  'No family given and no target safety factor in the load case: the most cautious family default was used as the target (common practice).';

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
  };
}

/** Material values for the component models, with allowables for the prepared load case. */
export function modeMaterial(candidate: CandidateMaterial, prepared: PreparedLoadCase, warnings: string[]): ModeMaterial {
  return toModeMaterial(candidate, computeAllowables(candidate, prepared.conditions, warnings));
}

/** The target safety factor a candidate is held to under a prepared load case. */
export function targetFor(prepared: PreparedLoadCase, candidate: CandidateMaterial): number {
  return prepared.targetSafetyFactor ?? defaultTargetSafetyFactor(candidate.family);
}

const SCRATCH_WARNINGS: string[] = [];

/**
 * The governing margin of one candidate (lowest safety factor over the modes ÷ target − 1),
 * computed exactly as evaluateCandidate does, without building its result.
 */
export function governingMargin(prepared: PreparedLoadCase, candidate: CandidateMaterial): number {
  SCRATCH_WARNINGS.length = 0;
  const mm = toModeMaterial(candidate, computeAllowables(candidate, prepared.conditions, SCRATCH_WARNINGS));
  const { model, component, pressure: p } = prepared;
  model.fill(component, model.thickness(component), p, mm, STRESS, ALLOWABLE);
  let govSf = Infinity;
  for (let i = 0; i < model.modes.length; i++) {
    const sf = ALLOWABLE[i] / STRESS[i];
    if (sf < govSf) govSf = sf;
  }
  return govSf / targetFor(prepared, candidate) - 1;
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

  const n = model.modes.length;
  const modes: ModeResult[] = new Array(n);
  let gov = 0;
  let govSf = Infinity;
  let required: number | null = 0;
  for (let i = 0; i < n; i++) {
    const stress = STRESS[i];
    const allowable = ALLOWABLE[i];
    const sf = allowable / stress;
    const req = finiteOrNull(model.required(component, p, mm, target, i, t, stress, allowable));
    modes[i] = {
      mode: model.modes[i],
      stress,
      allowable,
      safetyFactor: sf,
      margin: sf / target - 1,
      requiredThickness: req,
      model: model.model(component, i, mm),
    };
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
    } else if (required !== null && req > required) required = req;
  }

  const deflection = model.check(component, p, mm, STRESS, ALLOWABLE, warnings);
  if (model.usesModulus && prepared.conditions.sustainedHours > 0 && isPolymer(candidate.family)) warnings.push(CREEP_MODULUS_WARNING);
  for (let i = 0; i < prepared.warnings.length; i++) warnings.push(prepared.warnings[i]);

  const g = modes[gov];
  const result: CandidateResult = {
    name: candidate.name,
    governingMode: g.mode,
    safetyFactor: g.safetyFactor,
    margin: g.margin,
    requiredThickness: required,
    massPerArea: required === null ? null : candidate.density * required,
    weightToDisplacement:
      required === null || !model.weightToDisplacement
        ? null
        : model.weightToDisplacement(component, required, candidate.density, prepared.waterDensity),
    targetSafetyFactor: target,
    factors: allowables.factors,
    modes,
    warnings,
  };
  if (candidate.propertySetId !== undefined) result.propertySetId = candidate.propertySetId;
  if (candidate.family !== undefined) result.family = candidate.family;
  if (deflection !== undefined) result.deflection = deflection;
  return result;
}

/** Input of `evaluate`: a load case and candidates already resolved to material values. */
export interface EvaluateInput {
  loadCase: LoadCaseInput;
  candidates: readonly CandidateMaterial[];
  /** How many results to return, best first (default 100). */
  limit?: number;
  /** Ranking (default 'margin'). */
  sortBy?: SortBy;
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
  let results: CandidateResult[];
  if (sortBy === 'margin' && limit < n && n > 64) {
    // Ranking by margin needs only each candidate's governing safety factor. Every candidate is
    // checked in every mode; the full result (required thicknesses, warnings, model texts) is
    // built only for those that make the cut, in the same order topResults would give.
    const keys = new Float64Array(n);
    for (let i = 0; i < n; i++) keys[i] = -governingMargin(prepared, candidates[i]);
    const cut = keys.slice().sort()[limit - 1];
    const kept: CandidateResult[] = [];
    for (let i = 0; i < n; i++) if (keys[i] <= cut) kept.push(evaluateCandidate(prepared, candidates[i]));
    results = sortResults(kept, 'margin').slice(0, limit);
  } else {
    const all: CandidateResult[] = new Array(n);
    for (let i = 0; i < n; i++) all[i] = evaluateCandidate(prepared, candidates[i]);
    results = topResults(all, sortBy, limit);
  }
  return {
    pressure: prepared.pressure,
    proofTestPressure: prepared.proofTestPressure,
    pressureMethod: prepared.pressureMethod,
    results,
    total: n,
  };
}

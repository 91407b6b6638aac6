/**
 * A load case prepared for evaluating many candidates: its design pressure worked out once, its
 * sizes checked, and the warnings that concern the load case itself.
 */
import type { Component, LoadCaseInput } from '../schemas/evaluate';
import { DEFAULT_PROOF_FACTOR } from '../schemas/evaluate';
import { fmt, type Conditions } from './allowables';
import type { ComponentModel } from './components/common';
import { modelFor } from './components/index';
import { DEFAULT_TARGET_SAFETY_FACTORS, FALLBACK_TARGET_SAFETY_FACTOR, WATER_DENSITY } from './defaults';
import { pressureFromDepth } from './pressure';
import type { CandidateMaterial } from './types';
import type { Family } from '../schemas/catalogue';

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
  /** From the load case, or undefined to use each candidate's family target. */
  targetSafetyFactor: number | undefined;
  /** The load case's own targets for some families; the others keep their common-practice default. */
  familyTargets: Partial<Record<Family, number>>;
  /** Every family's target under this load case (its own, else the default), looked up per candidate. */
  targetByFamily: Record<Family, number>;
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
  const familyTargets = target === undefined ? { ...(loadCase.familyTargets ?? {}) } : {};
  for (const [family, t] of Object.entries(familyTargets) as [Family, number][]) {
    checkPositive(`target safety factor of ${family}`, t);
    if (t < 1) warnings.push(`The target safety factor ${fmt(t)} set for ${family} is below 1: it accepts stresses above the allowable.`);
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
    familyTargets,
    targetByFamily: { ...DEFAULT_TARGET_SAFETY_FACTORS, ...familyTargets },
    component: c,
    model: modelFor(c),
    humanOccupancy: loadCase.humanOccupancy === true,
    warnings,
  };
}

/** The target safety factor a candidate is held to under a prepared load case. */
export function targetFor(prepared: PreparedLoadCase, candidate: CandidateMaterial): number {
  return prepared.targetSafetyFactor ?? (candidate.family ? prepared.targetByFamily[candidate.family] : FALLBACK_TARGET_SAFETY_FACTOR);
}

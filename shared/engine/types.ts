/**
 * Shared types of the calculation engine. All quantities are SI: Pa, m, kg/m³, °C, hours, cycles.
 */
import type { Family } from '../schemas/catalogue';

/** The four failure modes a result can be governed by. */
export type FailureMode = 'tension' | 'compression' | 'shear' | 'buckling';
export const FAILURE_MODES: readonly FailureMode[] = ['tension', 'compression', 'shear', 'buckling'];

/** Water the depth is measured in. */
export type Water = 'sea' | 'fresh';

/** One point of a strength-factor curve (factor multiplies the reference-condition strength). */
export interface TemperatureFactorPoint {
  temperature: number;
  factor: number;
}
export interface HoursFactorPoint {
  hours: number;
  factor: number;
}
export interface CyclesFactorPoint {
  cycles: number;
  factor: number;
}

/**
 * A candidate material as the engine sees it: either a catalogue property set (resolved by the
 * server, see `candidateFromPropertySet`) or an inline material typed by the user.
 */
export interface CandidateMaterial {
  name: string;
  propertySetId?: number;
  family?: Family;
  /** kg/m³ */
  density: number;
  /** Pa */
  youngsModulus: number;
  poissonsRatio: number;
  /** Pa */
  tensileStrength: number;
  /** Pa; when given, the tension allowable is based on it instead of tensileStrength. */
  tensileYield?: number | null;
  /** Pa */
  compressiveStrength: number;
  /** Pa; when given, the compression allowable is based on it instead of compressiveStrength. */
  compressiveYield?: number | null;
  /** Pa */
  shearStrength: number;
  /** °C */
  serviceTemperature?: { min: number; max: number } | null;
  temperatureFactors?: readonly TemperatureFactorPoint[] | null;
  sustainedLoadFactors?: readonly HoursFactorPoint[] | null;
  cyclicFactors?: readonly CyclesFactorPoint[] | null;
}

/** One failure mode's check at the evaluated thickness. */
export interface ModeResult {
  mode: FailureMode;
  /** Pa, positive magnitude */
  stress: number;
  /** Pa */
  allowable: number;
  /** allowable / stress */
  safetyFactor: number;
  /** safetyFactor / target − 1 */
  margin: number;
  /** m; the thickness at which this mode just meets the target; null when no thickness can. */
  requiredThickness: number | null;
  /** The model used and its published source. */
  model: string;
}

/** The strength factors that were applied (product gives allowable / base strength). */
export interface AppliedFactors {
  /** Worst (lowest) temperature factor over the design range. */
  temperature: number;
  /** Temperature (°C) at which the worst factor occurs. */
  worstTemperature: number;
  sustainedLoad: number;
  cyclic: number;
}

/** One candidate's evaluation. */
export interface CandidateResult {
  name: string;
  propertySetId?: number;
  family?: Family;
  governingMode: FailureMode;
  /** The governing mode's safety factor. */
  safetyFactor: number;
  /** The governing mode's margin. */
  margin: number;
  /** m; the largest of the modes' required thicknesses; null if any mode cannot meet the target. */
  requiredThickness: number | null;
  /** kg/m²; density × requiredThickness; null when requiredThickness is null. */
  massPerArea: number | null;
  /** Spheres and cylinders only: shell mass / displaced water mass at the required thickness. */
  weightToDisplacement: number | null;
  /** The target safety factor used (the load case's, or the family default). */
  targetSafetyFactor: number;
  /** Flat disc only: centre deflection (m) at the evaluated thickness. */
  deflection?: number;
  factors: AppliedFactors;
  modes: ModeResult[];
  warnings: string[];
}

export type SortBy = 'margin' | 'requiredThickness' | 'massPerArea' | 'weightToDisplacement';

/** Result of `evaluate`. */
export interface EvaluateResult {
  /** Design pressure, Pa gauge. */
  pressure: number;
  /** Design pressure × proof factor, Pa gauge. */
  proofTestPressure: number;
  /** How the design pressure was obtained (model and source). */
  pressureMethod: string;
  /** Best first, at most `limit`. */
  results: CandidateResult[];
  /** Number of candidates evaluated (before `limit`). */
  total: number;
}

/**
 * Isobath calculation engine: pure, deterministic TypeScript (no I/O), SI units throughout
 * (Pa, m, kg/m³, °C, hours). Results are screening estimates for qualified engineers; the
 * applicable pressure-vessel standard and classification rules govern real designs.
 *
 * Typical use (server):
 *   const req = evaluateRequestSchema.parse(body);              // ../schemas/evaluate
 *   const candidates = resolve(req.candidates)                   // property sets → candidateFromPropertySet
 *                                                                // inline        → candidateFromInline
 *   const out = evaluate({ loadCase: req.loadCase, candidates, limit: req.limit, sortBy: req.sortBy });
 *
 * See README.md beside this file for the models, their sources and limits.
 */

// Evaluation and ranking
export { evaluate } from './evaluate';
export type { EvaluateInput } from './evaluate';
export { prepareLoadCase, targetFor } from './load-case';
export type { PreparedLoadCase } from './load-case';
export { evaluateCandidate } from './evaluate-candidate';
export { sortResults, compareResults, topResults, rankKey } from './rank';
export { sweepThickness, MAX_SWEEP_STEPS } from './sweep';
export type { SweepOptions, SweepResult, SweepSeries, GoverningTransition } from './sweep';
export { modeMap, targetContour, MAX_MODE_MAP_CELLS } from './mode-map';
export type { ModeMapAxis, ModeMapAxisKind, ModeMapResult } from './mode-map';
export { candidateFromPropertySet, candidateFromInline } from './candidates';

// Pressure
export {
  pressureFromDepth,
  depthFromPressure,
  unesco1983Depth,
  unesco1983PressureDbar,
  saunders1981PressureDbar,
  freshWaterPressurePa,
  freshWaterDepthM,
  surfaceGravity,
  PA_PER_DBAR,
  SEAWATER_METHOD,
  FRESH_WATER_METHOD,
} from './pressure';
export type { PressureFromDepth } from './pressure';

// Allowables and defaults
export { computeAllowables, worstTemperatureFactor, sustainedLoadFactor, cyclicFactor, isPolymer, isBrittle } from './allowables';
export type { Allowables, Conditions } from './allowables';
export {
  DEFAULT_TARGET_SAFETY_FACTORS,
  FALLBACK_TARGET_SAFETY_FACTOR,
  defaultTargetSafetyFactor,
  WATER_DENSITY,
} from './defaults';
export { DEFAULT_PROOF_FACTOR } from '../schemas/evaluate';

// Raw published formulas (for tests, charts and explanations)
export { flatDiscBendingStress, flatDiscDeflection, edgeShearStress, flatDiscBendingCoefficient } from './components/flat-disc';
export { majorDiameter, seatBearingStress, confinedSeatStress, bearingOuterDiameter, coneFlexureCoefficient, CONICAL_FRUSTUM_WARNING } from './components/conical-frustum';
export { sectorSeatStress, SPHERICAL_SECTOR_WARNING } from './components/spherical-sector';
export {
  sphereLameStress,
  sphereMembraneStress,
  zoellyPressure,
  sphereElasticPressure,
  sphereYieldPressure,
  sphereCollapse,
  FABRICATED_SPHERE_FACTOR,
  MACHINED_SPHERE_COEFFICIENT,
} from './components/sphere';
export { johnsonOstenfeld, reducedSlenderness, collapsePressure, outOfRoundYield } from './components/collapse';
export type { CollapseDetail } from './components/collapse';
export { interframeYieldPressure, bryantPressure, frameProperties, ringStiffenedCritical } from './components/ring-stiffened-cylinder';
export {
  cylinderLameHoopStress,
  vonMisesPressure,
  vonMisesPressureForLobes,
  windenburgTrillingPressure,
  bryanPressure,
  cylinderClassicalBucklingPressure,
  cylinderBucklingPressure,
  cylinderYieldPressure,
  cylinderCollapse,
  CYLINDER_KNOCKDOWN,
} from './components/cylinder';

// Root finding
export { brent, thicknessForTarget } from './solve';

// Types
export type {
  FailureMode,
  Water,
  CandidateMaterial,
  ModeResult,
  CandidateResult,
  EvaluateResult,
  AppliedFactors,
  SortBy,
  TemperatureFactorPoint,
  HoursFactorPoint,
  CyclesFactorPoint,
  RatingTable,
  RatingResult,
  RatingGeometry,
  SizedBy,
  WindowCoverage,
  ProofCheck,
  LifeBasis,
  MinimumRatioData,
  CriticalPressureData,
} from './types';
export { minimumRatioAt, ratedPressureAt, rateWithTable, tableCovers, ratioBase, isWindowComponent, INTERPOLATION_RULE } from './rating-tables';
export { coverageGroup, modeMargin } from './rank';
export { FAILURE_MODES } from './types';

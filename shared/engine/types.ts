/**
 * Shared types of the calculation engine. All quantities are SI: Pa, m, kg/m³, °C, hours, cycles.
 */
import type { Family } from '../schemas/catalogue';
import type { InputStatus } from '../schemas/provenance';

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
  /** Pa; the shear ultimate. */
  shearStrength: number;
  /** Pa; when given, the shear allowable is based on it. Metals without it use yield/√3 (von Mises). */
  shearYield?: number | null;
  /** °C */
  serviceTemperature?: { min: number; max: number } | null;
  temperatureFactors?: readonly TemperatureFactorPoint[] | null;
  sustainedLoadFactors?: readonly HoursFactorPoint[] | null;
  cyclicFactors?: readonly CyclesFactorPoint[] | null;
  /** How many of the inputs the calculation uses are confirmed against their source (catalogue sets). */
  inputs?: InputStatus;
  /**
   * Published rating tables that cover this candidate's material grade (attached by the server
   * from the catalogue). For a window component one of them, when it covers the geometry, sizes
   * the candidate; the analytical modes become cross-checks.
   */
  ratingTables?: readonly RatingTable[] | null;
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
  /** The same mode at the proof-test pressure against short-term strength (no life factors). */
  proof: ProofCheck;
  /** Which check, when a component has several of one mode (ring-stiffened cylinders). */
  check?: string;
  /** Shell collapse modes: the knocked-down elastic, the yield and the collapse pressures (Pa). */
  collapse?: { elastic: number; yield: number; collapse: number };
}

/** One mode at the proof-test pressure. */
export interface ProofCheck {
  /** Pa */
  stress: number;
  /** Pa: base strength × temperature factor only (a proof test is short). */
  allowable: number;
  /** allowable / stress; below 1 the proof test itself would fail the part. */
  safetyFactor: number;
}

/** Which life factor governed: the lower of the two is applied, never their product. */
export type LifeBasis = 'sustained-load' | 'cyclic' | 'none';

/** The strength factors that were applied: allowable = base strength × temperature × life. */
export interface AppliedFactors {
  /** Worst (lowest) temperature factor over the design range. */
  temperature: number;
  /** Temperature (°C) at which the worst factor occurs. */
  worstTemperature: number;
  /** Where the temperature factor came from: the set's own curve, the family default, or none. */
  temperatureSource: 'set' | 'family' | 'none';
  /** Sustained-load factor at the load case's hours (1 without data). */
  sustainedLoad: number;
  /** Cyclic factor at the load case's cycles (1 without data). */
  cyclic: number;
  /** The life factor applied: min(sustainedLoad, cyclic). */
  life: number;
  /** Which of the two set the life factor ('none' when both are 1). */
  lifeBasis: LifeBasis;
}

/** What set a candidate's required thickness. */
export type SizedBy =
  | { kind: 'mode'; mode: FailureMode }
  | { kind: 'rating-table'; ratingTableId?: number; name: string };

/** Whether a window rule covers the candidate for human occupancy (window components only). */
export type WindowCoverage = 'covered' | 'not-covered';

/** One candidate's evaluation. */
export interface CandidateResult {
  name: string;
  propertySetId?: number;
  family?: Family;
  governingMode: FailureMode;
  /** The governing mode's safety factor (analytical). */
  safetyFactor: number;
  /**
   * The margin of what sizes the candidate (see `sizedBy`): the governing mode's
   * safetyFactor/target − 1, or, when a rating table sizes it, the table's rated pressure at the
   * entered thickness / design pressure − 1 (the table already holds its design factor).
   */
  margin: number;
  /**
   * m; the largest of the modes' required thicknesses (null if any mode cannot meet the target),
   * or the rating table's when one sizes the candidate (null outside the table).
   */
  requiredThickness: number | null;
  /** What set requiredThickness: a mode, or a rating table; null when no thickness is given. */
  sizedBy: SizedBy | null;
  /** The rating-table route, when a published table covers this candidate's grade and geometry. */
  rating?: RatingResult;
  /** Lowest safety factor over the modes at the proof-test pressure (short-term strength). */
  proofSafetyFactor: number;
  /** Set when the load case is for human occupancy and the component is a window. */
  coverage?: WindowCoverage;
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
  /** The status of the inputs used (catalogue sets): how many are confirmed, which are not. */
  inputs?: InputStatus;
}

export type SortBy = 'margin' | 'requiredThickness' | 'massPerArea' | 'weightToDisplacement';

// ---------------------------------------------------------------------------------------------
// Rating tables: the trade's empirical window data, cited and curated like property sets
// ---------------------------------------------------------------------------------------------

/** Window geometries a rating table can be written for. */
export type RatingGeometry = 'flat-disc' | 'conical-frustum' | 'spherical-sector';

/**
 * Minimum thickness ratio (t/Di; t/Ri for spherical sectors) against design pressure (rows, Pa)
 * and design temperature (columns, °C). `ratios[i][j]` is for pressures[i], temperatures[j];
 * null where the source gives no value.
 */
export interface MinimumRatioData {
  form: 'minimum-ratio';
  pressures: readonly number[];
  temperatures: readonly number[];
  ratios: readonly (readonly (number | null)[])[];
}

/**
 * Short-term critical pressure (Pa) against thickness ratio at the reference temperature, with
 * conversion factors by design temperature: design pressure ≤ STCP / conversion factor.
 */
export interface CriticalPressureData {
  form: 'critical-pressure';
  ratios: readonly number[];
  criticalPressures: readonly number[];
  conversionFactors: readonly { temperature: number; factor: number }[];
}

export interface RatingTable {
  id?: number;
  version?: number;
  name: string;
  geometry: RatingGeometry;
  /** Cones and spherical sectors: the included angles (°) the table applies to, inclusive. */
  includedAngle?: { min: number; max: number } | null;
  /** Service the table's data support; a load case beyond them is outside the table. */
  limits?: { sustainedHours?: number | null; cycles?: number | null } | null;
  /** The citation, for results and records. */
  source: string;
  data: MinimumRatioData | CriticalPressureData;
}

/** The rating-table route for one candidate. */
export interface RatingResult {
  ratingTableId?: number;
  version?: number;
  name: string;
  source: string;
  /** t/Di (t/Ri for spherical sectors) the table requires at the design pressure and temperature; null outside it. */
  minimumRatio: number | null;
  /** m; null outside the table. */
  requiredThickness: number | null;
  /** Pa; the pressure the table rates the entered thickness for; null when the table cannot say. */
  ratedPressure: number | null;
  /** True when ratedPressure is only a lower bound (the entered thickness exceeds the table's last row). */
  ratedPressureIsLowerBound: boolean;
  /** How the number was read from the table (interpolation, conservative clamping). */
  interpolation: string;
  /** Why the table gives no number, when it does not. */
  outside?: string;
  /** Safety factor of the governing analytical mode at the table's thickness (cross-check). */
  crossCheckSafetyFactor: number | null;
}

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

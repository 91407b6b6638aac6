/**
 * Defaults of the calculation. Every number here is common practice for screening, not a value
 * from a standard: the applicable standard or classification rules set the real design factors.
 */
import type { Family } from '../schemas/catalogue';
import type { TemperatureFactorPoint, Water } from './types';

/**
 * Default target safety factor (allowable strength / working stress) per family, used when the
 * load case gives none. All values: common practice for screening estimates.
 */
export const DEFAULT_TARGET_SAFETY_FACTORS: Record<Family, number> = {
  acrylic: 4, // common practice: polymers creep and craze; standards' conversion factors are larger still
  polycarbonate: 4, // common practice, as acrylic
  glass: 6, // common practice: brittle, flaw-sensitive, static fatigue in water
  'glass-ceramic': 5, // common practice: brittle, somewhat tougher than glass
  'sapphire-alumina': 4, // common practice: brittle ceramic, high and less scattered strength
  'titanium-alloy': 1.5, // common practice: ductile metal on yield
  steel: 1.5, // common practice: ductile metal on yield
  'aluminium-alloy': 1.5, // common practice: ductile metal on yield
  'fibre-composite': 2.5, // common practice: scatter, matrix-dominated compression and creep
  'syntactic-foam': 2, // common practice: on crush strength
};

/**
 * For an inline candidate without a family: the highest family default (common practice: an
 * unknown material is treated as the least forgiving one). Results say when it was used.
 */
export const FALLBACK_TARGET_SAFETY_FACTOR: number = Math.max(...Object.values(DEFAULT_TARGET_SAFETY_FACTORS));

/** Target for a candidate: the load case's own, else its family's default, else the fallback. */
export function defaultTargetSafetyFactor(family: Family | undefined): number {
  return family ? DEFAULT_TARGET_SAFETY_FACTORS[family] : FALLBACK_TARGET_SAFETY_FACTOR;
}

/**
 * Water density (kg/m³) for weight-to-displacement: 1025 for seawater and 1000 for fresh water
 * (common practice round values). A pressure given directly is taken as seawater.
 */
export const WATER_DENSITY: Record<Water, number> = { sea: 1025, fresh: 1000 };

/** A family's default temperature curve, used for a property set that carries none of its own. */
export interface FamilyTemperatureCurve {
  points: readonly TemperatureFactorPoint[];
  /** Said on every result that uses it: what the curve is and where it comes from. */
  warning: string;
}

/**
 * Acrylic: window practice is organised by design-temperature column, and a set without its own
 * curve must not be treated as equally strong at 66 °C as at 20 °C. The curve is the lower
 * envelope (conservative) of two published sources, normalised to 1 at 24 °C (75 °F, the
 * reference column of the window tables; room-temperature test data are at 23 °C):
 *  - Stachiw & McKay, NCEL Technical Report R-773 (1972), abstract [pub]: the short-term critical
 *    pressure of 90° conical acrylic windows is 15–25 % higher at 32 °F (0 °C) and 10–20 % lower
 *    at 90 °F (32 °C) than at 70 °F: the lower ends, 1.15 at 0 °C and 0.80 at 32 °C, are used;
 *    10 °C (1.07) is linear between them;
 *  - the flat acrylic window table of a classification society's underwater-vehicle rules
 *    (Table 1.5.2, in the seeded rating tables): the ratio of the pressures rated at equal t/Di
 *    between its temperature columns, relative to 24 °C, is 0.76 at 38 °C, 0.60 at 52 °C and 0.38 at
 *    66 °C, the same within ±0.02 for t/Di from 0.16 to 0.26 [calc from the table]. (The table
 *    would allow 1.49 at 10 °C; the measured short-term gain above is smaller, so it is used.)
 */
export const FAMILY_TEMPERATURE_FACTORS: Partial<Record<Family, FamilyTemperatureCurve>> = {
  acrylic: {
    points: [
      { temperature: 0, factor: 1.15 },
      { temperature: 10, factor: 1.07 },
      { temperature: 24, factor: 1 },
      { temperature: 32, factor: 0.8 },
      { temperature: 38, factor: 0.76 },
      { temperature: 52, factor: 0.6 },
      { temperature: 66, factor: 0.38 },
    ],
    warning:
      'This property set has no temperature curve of its own: the acrylic family default was used (lower envelope of NCEL R-773, ' +
      "Stachiw & McKay 1972, and the temperature columns of a classification society's flat acrylic window table; 1.0 at 24 °C).",
  },
};

/**
 * Defaults of the calculation. Every number here is common practice for screening, not a value
 * from a standard: the applicable standard or classification rules set the real design factors.
 */
import type { Family } from '../schemas/catalogue';
import type { Water } from './types';

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

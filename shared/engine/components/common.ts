/**
 * The shape every component model has, so evaluation, thickness sweeps and required-thickness
 * searches treat all components alike.
 */
import type { FailureMode } from '../types';
import type { CollapseDetail } from './collapse';

/** Material values a component model needs (allowables already reduced for the load case). */
export interface ModeMaterial {
  /** Young's modulus, Pa */
  E: number;
  /** Poisson's ratio */
  nu: number;
  /** Allowable stresses, Pa */
  tension: number;
  compression: number;
  shear: number;
  tensionOnYield: boolean;
  compressionOnYield: boolean;
  /** Basis of the shear allowable (default 'strength' for hand-built materials). */
  shearBasis?: 'yield' | 'von-mises' | 'strength';
}

export interface ComponentModel<G> {
  /** The modes checked, in a fixed order (the index used by `fill`, `required`, `model`). */
  readonly modes: readonly FailureMode[];
  /** The evaluated thickness of the geometry, m. */
  thickness(g: G): number;
  /**
   * Stress (positive magnitude) and allowable of each mode at thickness `t` (the geometry's own
   * thickness is ignored), pressure `p` (Pa). Writes into the given arrays; allocates nothing.
   */
  fill(g: G, t: number, p: number, m: ModeMaterial, stress: Float64Array, allowable: Float64Array): void;
  /**
   * The thickness at which mode `i` just meets `target`, or null if none can. `t`, `stress`,
   * `allowable` are those at the evaluated thickness (for closed forms).
   */
  required(g: G, p: number, m: ModeMaterial, target: number, i: number, t: number, stress: number, allowable: number): number | null;
  /** The model (and source) of mode `i`: a constant string. */
  model(g: G, i: number, m: ModeMaterial): string;
  /**
   * Validity checks at the evaluated thickness; warnings are appended. Returns the centre
   * deflection (m) for plates, else undefined.
   */
  check(g: G, p: number, m: ModeMaterial, stress: Float64Array, allowable: Float64Array, warnings: string[]): number | undefined;
  /** Shell collapse modes: the elastic, yield and collapse pressures behind mode `i` at thickness t (else null). */
  collapse?(g: G, t: number, m: ModeMaterial, i: number): CollapseDetail | null;
  /** Why mode `i`'s formula is outside its range at thickness t (null inside it), for charts that stop or grey the curve there. */
  validity?(g: G, t: number, i: number): string | null;
  /** The name of check `i` when a component has several of one failure mode (e.g. "interframe collapse"). */
  checkName?(g: G, i: number): string;
  /** Mass per unit area of shell (kg/m²) at thickness t when more than the shell counts (frames); default density × t. */
  massPerArea?(g: G, t: number, density: number): number;
  /** Hulls only: shell mass / displaced water mass at thickness t. */
  weightToDisplacement?(g: G, t: number, density: number, waterDensity: number): number;
  /** True when a reported quantity uses Young's modulus (buckling, deflection): creep matters. */
  readonly usesModulus: boolean;
}

/** Two versions of a model text: allowable on the ultimate strength, or on the yield. */
export interface BasisTexts {
  strength: string;
  yield: string;
}

/** Model text for a tension mode, naming which base strength the allowable used. */
export function tensionText(model: string): BasisTexts {
  return {
    strength: `${model} Allowable: tensile strength × temperature factor × life factor (the lower of the sustained-load and cyclic factors, not their product).`,
    yield: `${model} Allowable: tensile yield × temperature factor × life factor (the lower of the sustained-load and cyclic factors, not their product).`,
  };
}

/** Model text for a compression mode, naming which base strength the allowable used. */
export function compressionText(model: string): BasisTexts {
  return {
    strength: `${model} Allowable: compressive strength × temperature factor × life factor (the lower of the sustained-load and cyclic factors, not their product).`,
    yield: `${model} Allowable: compressive yield × temperature factor × life factor (the lower of the sustained-load and cyclic factors, not their product).`,
  };
}

const LIFE = '× temperature factor × life factor (the lower of the sustained-load and cyclic factors, not their product).';

/** Model texts for a shear mode, one per basis of the allowable. */
export function shearText(model: string): Record<'yield' | 'von-mises' | 'strength', string> {
  return {
    strength: `${model} Allowable: shear strength (ultimate) ${LIFE}`,
    yield: `${model} Allowable: shear yield ${LIFE}`,
    'von-mises': `${model} Allowable: shear yield = yield/√3 (von Mises criterion: pure shear yields at 1/√3 of the tensile yield) ${LIFE}`,
  };
}

/** Thickness that brings a stress ∝ 1/tᵏ to `allowable/target`: t·(target·stress/allowable)^(1/k). */
export function powerLawThickness(t: number, stress: number, allowable: number, target: number, k: 1 | 2): number {
  const ratio = (target * stress) / allowable;
  return k === 1 ? t * ratio : t * Math.sqrt(ratio);
}

/** Thin-shell buckling relations hold to about t/R 0.1 (common practice). */
export function thinShellValidity(t: number, meanRadius: number): string | null {
  return t / meanRadius > 0.1 ? 'thin-shell buckling relations beyond t/R 0.1 (common practice): indicative only' : null;
}

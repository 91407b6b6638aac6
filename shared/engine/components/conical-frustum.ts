/**
 * Conical frustum window (minor diameter Di, thickness t, included angle α), pressure p on the
 * major face, seated in a matching conical seat. An analytical SCREENING model, compared with
 * Stachiw's published tests below; where a rating table covers the window (the trade's way of
 * sizing acrylic cones), the table sizes it and this model is a cross-check.
 *
 * Geometry: x = t/Di; bearing annulus from Di to Db, Db = Di + 2t·tan(α/2) (the major diameter),
 * or the seat's outer diameter when that is smaller; a 180° (flat) seat has no geometric major
 * diameter, so Db is the seat's outer diameter (input, default 1.25·Di, stated in the result).
 * Seat normal stress, frictionless force balance: σn = p·Db²/(Db² − Di²).
 *
 * Modes:
 *  - tension: flexure of the unsupported minor face, σ = k·p·(Di/2)²/t² (Roark's Formulas for
 *    Stress and Strain, 7th ed., Table 11.2): k = 3(3+ν)/8 (simply supported, centre) while the
 *    window is a thin plate (x ≤ 0.25, Roark's thin-plate range), k = 3(1+ν)/8 (clamped, centre:
 *    the minor face is the tension face) once the wedge in the seat restrains the rim from turning
 *    (x ≥ 0.5, where Stachiw's 1,000-hour tests found 90–150° windows free of cracks at 5,000 psi),
 *    linear in x between; the restraint fades from full at α ≤ 150° to none at 180°.
 *  - compression: the larger of the minor-face flexure and the seat normal stress less the
 *    pressure that confines the window there, σn − p = p·Di²/(Db² − Di²) (Tresca: the difference of
 *    the principal stresses σn and p). Seat confinement is what lets cones carry many times the
 *    uniaxial compressive strength; there is no pressure cap.
 *  - shear: the plug at the minor diameter, τ = p·Di/(4t) (force balance p·πDi²/4 = τ·πDi·t),
 *    combined at the minor-diameter edge with the confined seat stress by the elliptical
 *    (von Mises-type) interaction (τ/τa)² + (σ/σa)² ≤ 1, each against its own allowable: reported
 *    as the equivalent shear τe = √(τ² + (σ·τa/σa)²) against τa. The interaction is what makes
 *    small angles weaker at the same t/Di, as the tests show.
 * Every stress falls as t grows (k and σn − p do not rise with t), so every safety factor is
 * non-decreasing in t (property-tested), as in the tests: thicker cones carry more.
 */
import type { ConicalFrustum } from '../../schemas/evaluate';
import { fmt } from '../allowables';
import { thicknessForTarget } from '../solve';
import type { FailureMode } from '../types';
import { compressionText, powerLawThickness, shearText, tensionText, type ComponentModel, type ModeMaterial } from './common';
import { edgeShearStress } from './flat-disc';

const MODES: readonly FailureMode[] = ['tension', 'compression', 'shear'];

/** Outer diameter of a flat (180°) seat's bearing annulus when none is given, as a multiple of Di (stated in results). */
export const DEFAULT_FLAT_SEAT_RATIO = 1.25;

/** tan(α/2) for the included angle α in degrees; Infinity at 180° (flat seat). */
export function halfAngleTangent(includedAngleDeg: number): number {
  return includedAngleDeg >= 180 ? Infinity : Math.tan((includedAngleDeg * Math.PI) / 360);
}

/** Major diameter Do = Di + 2·t·tan(α/2) (m); Infinity for a 180° flat seat. */
export function majorDiameter(minorDiameter: number, t: number, includedAngleDeg: number): number {
  return minorDiameter + 2 * t * halfAngleTangent(includedAngleDeg);
}

/** Outer diameter of the bearing annulus (m): the major diameter, capped by the seat's outer diameter. */
export function bearingOuterDiameter(g: Pick<ConicalFrustum, 'minorDiameter' | 'includedAngle' | 'seatOuterDiameter'>, t: number): number {
  const cap = g.seatOuterDiameter ?? (g.includedAngle >= 180 ? DEFAULT_FLAT_SEAT_RATIO * g.minorDiameter : Infinity);
  const Do = majorDiameter(g.minorDiameter, t, g.includedAngle);
  return Do < cap ? Do : cap;
}

/** Seat normal stress p·Db²/(Db² − Di²) (Pa) from the axial force balance on a frictionless seat. */
export function seatBearingStress(p: number, minorDiameter: number, bearingOuter: number): number {
  const k = minorDiameter / bearingOuter;
  return p / (1 - k * k);
}

/** Seat normal stress less the confining pressure, σn − p = p·Di²/(Db² − Di²) (Pa). */
export function confinedSeatStress(p: number, minorDiameter: number, bearingOuter: number): number {
  const k = minorDiameter / bearingOuter;
  const k2 = k * k;
  return (p * k2) / (1 - k2);
}

const K_SIMPLE = (nu: number) => (3 * (3 + nu)) / 8;
const K_CLAMPED_CENTRE = (nu: number) => (3 * (1 + nu)) / 8;
/** t/Di up to which the minor face is a thin, simply supported plate (Roark's thin-plate range). */
export const THIN_WINDOW_RATIO = 0.25;
/** t/Di from which the wedge restrains the rim fully (clamped centre value). */
export const WEDGED_WINDOW_RATIO = 0.5;

/** Flexure coefficient k in σ = k·p·(Di/2)²/t² for a cone of thickness ratio x and included angle α. */
export function coneFlexureCoefficient(x: number, includedAngleDeg: number, nu: number): number {
  const ss = K_SIMPLE(nu);
  const thick = x <= THIN_WINDOW_RATIO ? 0 : x >= WEDGED_WINDOW_RATIO ? 1 : (x - THIN_WINDOW_RATIO) / (WEDGED_WINDOW_RATIO - THIN_WINDOW_RATIO);
  const restraint = includedAngleDeg <= 150 ? 1 : includedAngleDeg >= 180 ? 0 : (180 - includedAngleDeg) / 30;
  return ss - thick * restraint * (ss - K_CLAMPED_CENTRE(nu));
}

/** Minor-face flexure stress (Pa). */
export function coneFlexureStress(p: number, minorDiameter: number, t: number, includedAngleDeg: number, nu: number): number {
  const a = 0.5 * minorDiameter;
  return (coneFlexureCoefficient(t / minorDiameter, includedAngleDeg, nu) * p * a * a) / (t * t);
}

/** Equivalent plug shear √(τ² + (σ·τa/σa)²) (Pa) of the plug shear τ and the confined seat stress σ. */
function equivalentShear(tau: number, sigma: number, shearAllowable: number, compressionAllowable: number): number {
  const s = (sigma * shearAllowable) / compressionAllowable;
  return Math.sqrt(tau * tau + s * s);
}

const FLEXURE =
  'Minor-face flexure σ = k·p·(Di/2)²/t² (Roark, 7th ed., Table 11.2): k = 3(3+ν)/8 (simply supported) up to t/Di 0.25, ' +
  '3(1+ν)/8 (clamped, centre) from t/Di 0.5, where the wedge in the seat restrains the rim, linear between; no restraint at 180°.';
const TENSION = tensionText(FLEXURE);
const COMPRESSION = compressionText(
  'Larger of the minor-face flexure and the confined seat stress σn − p = p·Di²/(Db² − Di²), where σn = p·Db²/(Db² − Di²) is the seat normal ' +
    'stress of a frictionless force balance and p the pressure confining the window at the seat (Tresca); Db = Di + 2t·tan(α/2), or the seat outer diameter.',
);
const SHEAR = shearText(
  'Plug shear at the minor diameter τ = p·Di/(4t) (force balance p·πDi²/4 = τ·πDi·t), combined with the confined seat stress σ by the ' +
    'elliptical interaction (τ/τa)² + (σ/σa)² ≤ 1 (von Mises type; each stress against its own allowable), reported as τe = √(τ² + (σ·τa/σa)²).',
);

export const CONICAL_FRUSTUM_WARNING =
  'The conical frustum model is an analytical screening estimate (minor-face flexure, confined seat bearing and the plug at the minor ' +
  "diameter), compared with Stachiw's published tests; acrylic cones are rated from the applicable standard's tables and tests (e.g. ASME " +
  'PVHO-1), entered here as rating tables; defer to them.';

interface ShearProblem {
  g: ConicalFrustum;
  p: number;
  m: ModeMaterial;
}
function shearSafetyFactor(t: number, c: ShearProblem): number {
  const tau = edgeShearStress(c.p, c.g.minorDiameter, t);
  const sigma = confinedSeatStress(c.p, c.g.minorDiameter, bearingOuterDiameter(c.g, t));
  return c.m.shear / equivalentShear(tau, sigma, c.m.shear, c.m.compression);
}
interface FlexureProblem {
  g: ConicalFrustum;
  p: number;
  allowable: number;
  nu: number;
}
function flexureSafetyFactor(t: number, c: FlexureProblem): number {
  return c.allowable / coneFlexureStress(c.p, c.g.minorDiameter, t, c.g.includedAngle, c.nu);
}
function compressionSafetyFactor(t: number, c: ShearProblem): number {
  const flex = coneFlexureStress(c.p, c.g.minorDiameter, t, c.g.includedAngle, c.m.nu);
  const seat = confinedSeatStress(c.p, c.g.minorDiameter, bearingOuterDiameter(c.g, t));
  return c.m.compression / (seat > flex ? seat : flex);
}

const MAX_THICKNESS_RATIO = 1e4;

export const conicalFrustumModel: ComponentModel<ConicalFrustum> = {
  modes: MODES,
  usesModulus: false,
  thickness: (g) => g.thickness,

  fill(g, t, p, m, stress, allowable) {
    const flex = coneFlexureStress(p, g.minorDiameter, t, g.includedAngle, m.nu);
    const seat = confinedSeatStress(p, g.minorDiameter, bearingOuterDiameter(g, t));
    stress[0] = flex;
    allowable[0] = m.tension;
    stress[1] = seat > flex ? seat : flex;
    allowable[1] = m.compression;
    stress[2] = equivalentShear(edgeShearStress(p, g.minorDiameter, t), seat, m.shear, m.compression);
    allowable[2] = m.shear;
  },

  required(g, p, m, target, i, t, stress, allowable) {
    const Di = g.minorDiameter;
    const sf = allowable / stress;
    // start from the power law each stress follows where it dominates: flexure 1/t², shear 1/t
    const guess = powerLawThickness(t, stress, allowable, target, i === 2 ? 1 : 2);
    if (i === 0) {
      const c: FlexureProblem = { g, p, allowable, nu: m.nu };
      return thicknessForTarget(flexureSafetyFactor, c, target, guess, Di * 1e-6, Di * MAX_THICKNESS_RATIO, 2, t, sf);
    }
    const c: ShearProblem = { g, p, m };
    // a flat seat of fixed outer diameter caps the confined seat stress at p·Di²/(Db² − Di²) for every t
    if (g.includedAngle >= 180 && i === 1 && !(m.compression / confinedSeatStress(p, Di, bearingOuterDiameter(g, t)) >= target)) return null;
    const f = i === 1 ? compressionSafetyFactor : shearSafetyFactor;
    return thicknessForTarget(f, c, target, guess, Di * 1e-6, Di * MAX_THICKNESS_RATIO, i === 2 ? 1 : 2, t, sf);
  },

  model(_g, i, m) {
    if (i === 0) return TENSION[m.tensionOnYield ? 'yield' : 'strength'];
    if (i === 1) return COMPRESSION[m.compressionOnYield ? 'yield' : 'strength'];
    return SHEAR[m.shearBasis ?? 'strength'];
  },

  check(g, _p, _m, _stress, _allowable, warnings) {
    warnings.push(CONICAL_FRUSTUM_WARNING);
    if (g.includedAngle >= 180 && g.seatOuterDiameter === undefined) {
      warnings.push(
        `A 180° (flat) seat has no major diameter: the bearing annulus was taken to end at ${fmt(DEFAULT_FLAT_SEAT_RATIO)} × Di (stated default); ` +
          'enter the seat outer diameter for your seat.',
      );
    }
    return undefined;
  },
};

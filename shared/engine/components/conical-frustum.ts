/**
 * Conical frustum window (minor diameter Di, thickness t, included angle α), pressure on the
 * major face, seated in a matching conical seat. A SCREENING APPROXIMATION built from force
 * balances and plate bending, not a fit to test data; the applicable standard's tables
 * (e.g. ASME PVHO-1 for acrylic windows) govern real designs.
 *
 *   major diameter       Do = Di + 2·t·tan(α/2)          (α = 180°: a flat seat, Do → ∞)
 *   seat bearing         σ = p·Do²/(Do² − Di²)           axial force p·πDo²/4 over the seat's
 *                                                        projected annulus π(Do² − Di²)/4
 *   minor-face bending   σ = 3(3+ν)·p·(Di/2)²/(8t²)      the unsupported minor face as a simply
 *                                                        supported plate of diameter Di (Roark 7th
 *                                                        ed., Table 11.2): the seat lets the edge
 *                                                        rotate, and simple support gives the larger
 *                                                        stress of the two Roark edge cases, so it is
 *                                                        the conservative choice
 *   shear plug           τ = p·Di/(4t)                   force balance p·πDi²/4 = τ·πDi·t over the
 *                                                        Di cylinder (common practice: windows of 90°
 *                                                        and more fail close to a shear plug there)
 * Modes: tension = minor-face bending; compression = the larger of seat bearing and the
 * bending compression; shear = the plug. Each stress falls as t grows (Do grows with t), so every
 * mode's safety factor is non-decreasing in t, matching the trend of Stachiw's tests (thicker
 * cones at the same angle carry more pressure; J. Eng. Ind. 94, 1972).
 */
import type { ConicalFrustum } from '../../schemas/evaluate';
import type { FailureMode } from '../types';
import { compressionText, powerLawThickness, shearText, tensionText, type ComponentModel } from './common';
import { edgeShearStress, flatDiscBendingStress } from './flat-disc';

const MODES: readonly FailureMode[] = ['tension', 'compression', 'shear'];

/** tan(α/2) for the included angle α in degrees; Infinity at 180° (flat seat). */
export function halfAngleTangent(includedAngleDeg: number): number {
  return includedAngleDeg >= 180 ? Infinity : Math.tan((includedAngleDeg * Math.PI) / 360);
}

/** Major diameter Do = Di + 2·t·tan(α/2) (m); Infinity for a 180° flat seat. */
export function majorDiameter(minorDiameter: number, t: number, includedAngleDeg: number): number {
  return minorDiameter + 2 * t * halfAngleTangent(includedAngleDeg);
}

/**
 * Seat bearing stress p·Do²/(Do² − Di²) (Pa) = p / (1 − (Di/Do)²); tends to p for a flat seat.
 */
export function seatBearingStress(p: number, minorDiameter: number, t: number, includedAngleDeg: number): number {
  const k = minorDiameter / majorDiameter(minorDiameter, t, includedAngleDeg); // 0 when Do = ∞
  return p / (1 - k * k);
}

const BEARING_AND_BENDING =
  'APPROXIMATION: larger of (a) seat bearing σ = p·Do²/(Do² − Di²), Do = Di + 2t·tan(α/2), from the axial force on the major face over the ' +
  "seat's projected annulus, and (b) bending compression of the minor face as a simply supported plate of diameter Di, " +
  "σ = 3(3+ν)·p·(Di/2)²/(8t²) (Roark's Formulas for Stress and Strain, 7th ed., Table 11.2).";
const BENDING =
  'APPROXIMATION: bending tension of the unsupported minor face as a simply supported plate of diameter Di (conservative: the seat ' +
  "lets the edge rotate), σ = 3(3+ν)·p·(Di/2)²/(8t²) (Roark's Formulas for Stress and Strain, 7th ed., Table 11.2).";
const TENSION = tensionText(BENDING);
const COMPRESSION = compressionText(BEARING_AND_BENDING);
const SHEAR = shearText('APPROXIMATION: shear plug at the minor diameter, τ = p·Di/(4t), from the force balance p·πDi²/4 = τ·πDi·t.');

export const CONICAL_FRUSTUM_WARNING =
  'The conical frustum model is a screening approximation (seat bearing, minor-face bending and a shear plug at the minor diameter); ' +
  "it is not a fit to test data. Real conical windows are rated from the applicable standard's tables and tests (e.g. ASME PVHO-1 for acrylic); defer to them.";

export const conicalFrustumModel: ComponentModel<ConicalFrustum> = {
  modes: MODES,
  usesModulus: false,
  thickness: (g) => g.thickness,

  fill(g, t, p, m, stress, allowable) {
    const bending = flatDiscBendingStress('simply-supported', p, 0.5 * g.minorDiameter, t, m.nu);
    const bearing = seatBearingStress(p, g.minorDiameter, t, g.includedAngle);
    stress[0] = bending;
    allowable[0] = m.tension;
    stress[1] = bearing > bending ? bearing : bending;
    allowable[1] = m.compression;
    stress[2] = edgeShearStress(p, g.minorDiameter, t);
    allowable[2] = m.shear;
  },

  required(g, p, m, target, i, t, stress, allowable) {
    if (i === 0) return powerLawThickness(t, stress, allowable, target, 2);
    if (i === 2) return powerLawThickness(t, stress, allowable, target, 1);
    // compression: both parts must meet the target
    const s = allowable / target; // design allowable stress
    const bendingStress = flatDiscBendingStress('simply-supported', p, 0.5 * g.minorDiameter, t, m.nu);
    const tBending = powerLawThickness(t, bendingStress, allowable, target, 2);
    // bearing: p·Do²/(Do² − Di²) = s  →  Do = Di·√(s/(s − p)); impossible when s ≤ p
    if (!(s > p)) return null;
    const tanHalf = halfAngleTangent(g.includedAngle);
    const tBearing = tanHalf === Infinity ? 0 : (g.minorDiameter * (Math.sqrt(s / (s - p)) - 1)) / (2 * tanHalf);
    return tBearing > tBending ? tBearing : tBending;
  },

  model(_g, i, m) {
    if (i === 0) return TENSION[m.tensionOnYield ? 'yield' : 'strength'];
    if (i === 1) return COMPRESSION[m.compressionOnYield ? 'yield' : 'strength'];
    return SHEAR;
  },

  check(_g, _p, _m, _stress, _allowable, warnings) {
    warnings.push(CONICAL_FRUSTUM_WARNING);
    return undefined;
  },
};

/**
 * Flat disc window over a circular opening (unsupported diameter D, thickness t), uniform
 * pressure q on one face.
 *
 * Bending: Roark's Formulas for Stress and Strain, 7th ed. (Young & Budynas 2002), Table 11.2,
 * uniform load over a solid circular plate of radius a = D/2, D_f = E t³ / (12(1−ν²)):
 *   simply supported edge: σ_max = 3(3+ν) q a² / (8 t²) at the centre; y = q a⁴ (5+ν) / (64 D_f (1+ν));
 *   clamped edge:          σ_max = 3 q a² / (4 t²) at the edge;         y = q a⁴ / (64 D_f).
 * The bending stress is tensile on one face and compressive on the other, of equal magnitude:
 * tension and compression modes share it and differ only in allowable.
 * Edge shear (punch-through): τ = q D / (4 t), from the force balance q·πD²/4 = τ·πD·t.
 * Validity (Roark §11.1 [memory: wording]): thickness not more than about a quarter of the least
 * transverse dimension, deflection not more than about half the thickness; warnings otherwise.
 */
import { fmt } from '../allowables';
import type { FlatDisc } from '../../schemas/evaluate';
import type { FailureMode } from '../types';
import { compressionText, powerLawThickness, shearText, tensionText, type ComponentModel, type ModeMaterial } from './common';

const MODES: readonly FailureMode[] = ['tension', 'compression', 'shear'];

/** Roark Table 11.2 maximum bending stress coefficient k in σ = k·q·a²/t². */
export function flatDiscBendingCoefficient(edge: FlatDisc['edge'], nu: number): number {
  return edge === 'clamped' ? 0.75 : (3 * (3 + nu)) / 8;
}

/** Roark Table 11.2 maximum bending stress (Pa) of a circular plate under uniform pressure q. */
export function flatDiscBendingStress(edge: FlatDisc['edge'], q: number, radius: number, t: number, nu: number): number {
  return (flatDiscBendingCoefficient(edge, nu) * q * radius * radius) / (t * t);
}

/** Roark Table 11.2 maximum (centre) deflection (m) of a circular plate under uniform pressure q. */
export function flatDiscDeflection(edge: FlatDisc['edge'], q: number, radius: number, t: number, E: number, nu: number): number {
  const rigidity = (E * t * t * t) / (12 * (1 - nu * nu));
  const a4 = radius * radius * radius * radius;
  return edge === 'clamped' ? (q * a4) / (64 * rigidity) : (q * a4 * (5 + nu)) / (64 * rigidity * (1 + nu));
}

/** Edge (punch-through) shear stress τ = q·D/(4t) (Pa), from q·πD²/4 = τ·πD·t. */
export function edgeShearStress(q: number, diameter: number, t: number): number {
  return (q * diameter) / (4 * t);
}

const SS_BENDING =
  "Plate bending, simply supported edge, uniform pressure: σ = 3(3+ν)·q·a²/(8t²) at the centre (Roark's Formulas for Stress and Strain, 7th ed., Table 11.2).";
const CL_BENDING =
  "Plate bending, clamped edge, uniform pressure: σ = 3·q·a²/(4t²) at the edge (Roark's Formulas for Stress and Strain, 7th ed., Table 11.2).";
const SS_TENSION = tensionText(SS_BENDING);
const SS_COMPRESSION = compressionText(SS_BENDING);
const CL_TENSION = tensionText(CL_BENDING);
const CL_COMPRESSION = compressionText(CL_BENDING);
const SHEAR = shearText('Edge shear (punch-through) at the support: τ = q·D/(4t), from the force balance q·πD²/4 = τ·πD·t.');

export const flatDiscModel: ComponentModel<FlatDisc> = {
  modes: MODES,
  usesModulus: true,
  thickness: (g) => g.thickness,

  fill(g, t, p, m, stress, allowable) {
    const a = 0.5 * g.diameter;
    const sigma = flatDiscBendingStress(g.edge, p, a, t, m.nu);
    stress[0] = sigma;
    allowable[0] = m.tension;
    stress[1] = sigma;
    allowable[1] = m.compression;
    stress[2] = edgeShearStress(p, g.diameter, t);
    allowable[2] = m.shear;
  },

  required(_g, _p, _m, target, i, t, stress, allowable) {
    // bending ∝ 1/t², shear ∝ 1/t; allowables do not depend on t
    return powerLawThickness(t, stress, allowable, target, i === 2 ? 1 : 2);
  },

  model(g, i, m: ModeMaterial) {
    const clamped = g.edge === 'clamped';
    if (i === 0) return (clamped ? CL_TENSION : SS_TENSION)[m.tensionOnYield ? 'yield' : 'strength'];
    if (i === 1) return (clamped ? CL_COMPRESSION : SS_COMPRESSION)[m.compressionOnYield ? 'yield' : 'strength'];
    return SHEAR[m.shearBasis ?? 'strength'];
  },

  validity: (g, t, i) => (i < 2 && t > 0.25 * g.diameter ? "thin-plate bending beyond t/D 0.25 (Roark's Formulas for Stress and Strain, §11.1): indicative only" : null),

  check(g, p, m, _stress, _allowable, warnings) {
    const a = 0.5 * g.diameter;
    const t = g.thickness;
    const y = flatDiscDeflection(g.edge, p, a, t, m.E, m.nu);
    if (y > 0.5 * t) {
      warnings.push(
        `Centre deflection ${fmt(y * 1000)} mm is more than half the thickness: outside small-deflection plate theory ` +
          "(Roark's Formulas for Stress and Strain, §11.1); membrane action changes the stresses, so treat this result as indicative only.",
      );
    }
    if (t > 0.25 * g.diameter) {
      warnings.push(
        `Thickness is more than a quarter of the unsupported diameter (t/D = ${fmt(t / g.diameter)}): a thick plate, outside the ` +
          "thin-plate assumptions of Roark's Table 11.2 (§11.1); bending stresses are approximate there and edge shear and bearing gain importance (common practice).",
      );
    }
    return y;
  },
};

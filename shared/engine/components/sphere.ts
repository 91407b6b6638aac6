/**
 * Spherical shell under external pressure p (inner radius Ri, thickness t, Ro = Ri + t,
 * mean radius R = Ri + t/2).
 *
 * Compression: Lamé thick-wall solution, hoop stress at the inner surface (the largest),
 *   σ = 1.5·p·Ro³/(Ro³ − Ri³)
 * used at every thickness: it is exact for an elastic sphere, continuous (no switch between a
 * thin and a thick formula, so required thickness and sweeps are smooth) and reduces to the
 * thin membrane value p·R/(2t) as t/R → 0 (it is always the larger of the two).
 *
 * Buckling: classical elastic buckling of a complete sphere (Zoelly 1915),
 *   p_cl = 2E/√(3(1−ν²)) · (t/R)²,
 * times an explicit knock-down factor for imperfections, NASA SP-8032 (1969), "Buckling of
 * thin-walled doubly curved shells" [memory: formula and λ definition not re-checked against the
 * document]: γ = 0.14 + 3.2/λ² (at most 1), with the shell parameter
 * λ = [12(1−ν²)]^¼ · √(R/t) (that of a hemispherical cap, whose base radius is R); for a
 * complete sphere λ is large and γ ≈ 0.14–0.2. Reported as stress = thin membrane stress
 * p·R/(2t) and allowable = the knocked-down critical membrane stress p_cr·R/(2t), so the
 * safety factor is p_cr/p.
 * When that critical stress exceeds the compressive allowable, buckling would be inelastic:
 * the elastic result is not valid and yield (the compression mode) governs; a warning says so.
 */
import type { Sphere } from '../../schemas/evaluate';
import { fmt } from '../allowables';
import type { FailureMode } from '../types';
import { compressionText, type ComponentModel, type ModeMaterial } from './common';

const MODES: readonly FailureMode[] = ['compression', 'buckling'];

/** Lamé inner-surface hoop stress of a thick sphere under external pressure (Pa). */
export function sphereLameStress(p: number, innerRadius: number, t: number): number {
  const ro = innerRadius + t;
  // Ro³ − Ri³ = t·(Ro² + Ro·Ri + Ri²), written so thin shells lose no digits
  return (1.5 * p * ro * ro * ro) / (t * (ro * ro + ro * innerRadius + innerRadius * innerRadius));
}

/** Thin membrane stress p·R/(2t) of a sphere of mean radius R (Pa). */
export function sphereMembraneStress(p: number, meanRadius: number, t: number): number {
  return (p * meanRadius) / (2 * t);
}

/** Zoelly (1915) classical elastic buckling pressure of a complete sphere (Pa), R = mean radius. */
export function zoellyPressure(E: number, nu: number, t: number, meanRadius: number): number {
  const r = t / meanRadius;
  return ((2 * E) / Math.sqrt(3 * (1 - nu * nu))) * r * r;
}

/** NASA SP-8032 [memory] knock-down γ = min(1, 0.14 + 3.2/λ²), λ = [12(1−ν²)]^¼·√(R/t). */
export function sphereKnockdown(nu: number, t: number, meanRadius: number): number {
  const lambda2 = Math.sqrt(12 * (1 - nu * nu)) * (meanRadius / t); // λ²
  const g = 0.14 + 3.2 / lambda2;
  return g < 1 ? g : 1;
}

/**
 * Thickness (m) at which the knocked-down buckling pressure of a sphere of inner radius Ri
 * reaches `pressure`, in closed form: with x = t/R and s = √(12(1−ν²)), γ = 0.14 + 3.2·x/s, so
 * p_cr/(C·E) = 0.14·x² + (3.2/s)·x³ (a cubic, increasing in x; solved by Newton from above),
 * or x² where γ is capped at 1; then t = x·Ri/(1 − x/2). Null when no x < 2 suffices.
 */
export function sphereBucklingThickness(E: number, nu: number, innerRadius: number, pressure: number): number | null {
  const k = 1 - nu * nu;
  const r = pressure / ((2 * E) / Math.sqrt(3 * k)); // required (t/R)²·γ
  const b = 3.2 / Math.sqrt(12 * k);
  let x: number;
  const xCap = 0.86 / b; // γ reaches 1 here
  if (0.14 * xCap * xCap + b * xCap * xCap * xCap <= r) {
    x = Math.sqrt(r);
  } else {
    // f(x) = 0.14x² + b·x³ − r is increasing and convex for x > 0: Newton from above converges monotonically
    x = Math.min(Math.sqrt(r / 0.14), Math.cbrt(r / b));
    for (let i = 0; i < 100; i++) {
      const f = (0.14 + b * x) * x * x - r;
      const dx = f / ((0.28 + 3 * b * x) * x);
      x -= dx;
      if (!(dx > 1e-15 * x)) break;
    }
  }
  if (!(x < 2)) return null;
  return (x * innerRadius) / (1 - 0.5 * x);
}

/** Knocked-down elastic buckling pressure of a sphere of inner radius Ri and thickness t (Pa). */
export function sphereBucklingPressure(E: number, nu: number, innerRadius: number, t: number): number {
  const R = innerRadius + 0.5 * t;
  return sphereKnockdown(nu, t, R) * zoellyPressure(E, nu, t, R);
}

const COMPRESSION = compressionText(
  'Membrane compression, Lamé thick-wall sphere under external pressure, inner surface: σ = 1.5·p·Ro³/(Ro³ − Ri³) ' +
    '(reduces to the thin-shell p·R/(2t) for thin walls; e.g. Roark, 7th ed., Table 13.5 [memory: table number]).',
);
const BUCKLING =
  'Elastic buckling of a complete sphere, Zoelly (1915): p_cr = 2E/√(3(1−ν²))·(t/R)², R = mean radius, times the knock-down ' +
  'γ = 0.14 + 3.2/λ² (≤ 1), λ = [12(1−ν²)]^¼·√(R/t), after NASA SP-8032 (1969) [memory]. Stress = p·R/(2t); ' +
  "allowable = p_cr·R/(2t), so the safety factor is p_cr/p. Uses the short-term Young's modulus.";

export const sphereModel: ComponentModel<Sphere> = {
  modes: MODES,
  usesModulus: true,
  thickness: (g) => g.thickness,

  fill(g, t, p, m, stress, allowable) {
    stress[0] = sphereLameStress(p, g.innerRadius, t);
    allowable[0] = m.compression;
    const R = g.innerRadius + 0.5 * t;
    const membrane = sphereMembraneStress(p, R, t);
    stress[1] = membrane;
    allowable[1] = sphereMembraneStress(sphereBucklingPressure(m.E, m.nu, g.innerRadius, t), R, t);
  },

  required(g, p, m: ModeMaterial, target, i, _t, _stress, allowable) {
    const ri = g.innerRadius;
    if (i === 0) {
      // 1.5·p·Ro³ = s·(Ro³ − Ri³) → Ro = Ri·(s/(s − 1.5p))^(1/3); impossible when s ≤ 1.5p
      const s = allowable / target;
      const x = (1.5 * p) / s;
      if (!(x < 1)) return null;
      return ri * Math.expm1(-Math.log1p(-x) / 3);
    }
    // buckling: p_cr(t) rises with t (t/R and γ both do), closed form
    return sphereBucklingThickness(m.E, m.nu, ri, target * p);
  },

  model(_g, i, m) {
    return i === 0 ? COMPRESSION[m.compressionOnYield ? 'yield' : 'strength'] : BUCKLING;
  },

  check(_g, _p, m, _stress, allowable, warnings) {
    if (allowable[1] > m.compression) {
      warnings.push(
        `The knocked-down elastic buckling stress (${fmt(allowable[1] / 1e6)} MPa) exceeds the compressive allowable ` +
          `(${fmt(m.compression / 1e6)} MPa): buckling would be inelastic, the elastic buckling result is not valid, and yield governs.`,
      );
    }
    return undefined;
  },

  weightToDisplacement(g, t, density, waterDensity) {
    const ro = g.innerRadius + t;
    const k = g.innerRadius / ro;
    return (density / waterDensity) * (1 - k * k * k);
  },
};

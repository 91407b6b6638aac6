/**
 * Cylindrical shell between rigid stiffeners or bulkheads under external hydrostatic pressure p
 * (inner radius Ri, thickness t, unsupported length L; Ro = Ri + t, mean radius R = Ri + t/2,
 * mean diameter D = 2R).
 *
 * Compression: Lamé thick-wall hoop stress at the inner surface (the largest stress),
 *   σ_hoop = 2·p·Ro²/(Ro² − Ri²) = (p·R/t)·(Ro/R)²,
 * always at least the thin hoop stress p·R/t and equal to it as t/R → 0. The axial stress
 * (closed ends) is exactly half of it, so hoop governs; no von Mises/Tresca reduction is taken
 * (conservative by up to about 13 % against von Mises for a biaxial membrane state).
 *
 * Buckling (elastic, simply supported ends, classical):
 *  - von Mises (1929) for hydrostatic pressure, minimised over whole numbers of lobes n ≥ 2,
 *    a = πR/L: p = (E·t/R)/(n² − 1 + a²/2)·[1/(n²/a² + 1)² + t²/(12R²(1−ν²))·(n² − 1 + a²)²];
 *  - Windenburg & Trilling (1934, Trans. ASME 56): p = 2.42E/(1−ν²)^¾·(t/D)^2.5/(L/D − 0.45√(t/D)).
 * The lower of the two is used, with Windenburg–Trilling floored at the long-cylinder
 * (Bresse/Bryan) limit p = 2E/(1−ν²)·(t/D)³ — below it the short-bay formula is out of its range,
 * since a bay cannot be weaker than an infinitely long tube — and ignored where its denominator is
 * not positive (very short bays): p_cl = min(vM, max(W&T, Bryan)). Each term rises with t, and
 * the combination is continuous, so the buckling safety factor is continuous and non-decreasing.
 * Knock-down for imperfections: γ = 0.56, NASA SP-8007 (1968), "Buckling of thin-walled circular
 * cylinders", lateral pressure [memory: value not re-checked against the document].
 * Reported as stress = thin hoop stress p·R/t, allowable = p_cr·R/t (safety factor = p_cr/p).
 * Frames and bulkheads are assumed rigid: general instability and frame strength are NOT checked.
 */
import type { Cylinder } from '../../schemas/evaluate';
import { thicknessForTarget } from '../solve';
import type { FailureMode } from '../types';
import { collapsePressure, COLLAPSE_INTERACTION, outOfRoundYield, type CollapseDetail } from './collapse';
import { compressionText, thinShellValidity, type ComponentModel, type ModeMaterial } from './common';

const MODES: readonly FailureMode[] = ['compression', 'buckling'];

/** NASA SP-8007 knock-down for cylinders under lateral (external) pressure [memory]. */
export const CYLINDER_KNOCKDOWN = 0.56;

/** Lamé inner-surface hoop stress of a thick cylinder under external pressure (Pa). */
export function cylinderLameHoopStress(p: number, innerRadius: number, t: number): number {
  const ro = innerRadius + t;
  // Ro² − Ri² = t·(Ro + Ri)
  return (2 * p * ro * ro) / (t * (ro + innerRadius));
}

/** von Mises hydrostatic buckling pressure (Pa) for n lobes; R = mean radius. */
export function vonMisesPressureForLobes(E: number, nu: number, R: number, t: number, L: number, n: number): number {
  const a = (Math.PI * R) / L;
  const a2 = a * a;
  const n2 = n * n;
  const q = n2 / a2 + 1;
  const s = n2 - 1 + a2;
  return (((E * t) / R) / (n2 - 1 + 0.5 * a2)) * (1 / (q * q) + ((t * t) / (12 * R * R * (1 - nu * nu))) * s * s);
}

let lastLobes = 2;

/**
 * von Mises hydrostatic buckling pressure minimised over n ≥ 2 (Pa); the minimising n is left in
 * `lastLobes`. The function of n is unimodal, so a local descent finds the minimum; it starts
 * from the previous call's n, which in thickness searches and candidate lists is the answer or a
 * neighbour of it. Same formula as `vonMisesPressureForLobes`, with the n-independent parts
 * computed once.
 */
function vonMisesMin(E: number, nu: number, R: number, t: number, L: number): number {
  const a = (Math.PI * R) / L;
  const a2 = a * a;
  const inv_a2 = 1 / a2;
  const k = (E * t) / R;
  const c = (t * t) / (12 * R * R * (1 - nu * nu));
  const h = a2 - 1; // n² − 1 + a² = n² + h
  const h2 = 0.5 * a2 - 1; // n² − 1 + a²/2 = n² + h2
  // p(n) = k/(n² + h2)·[1/(n²/a² + 1)² + c·(n² + h)²], written out (no closure) for speed
  let n = lastLobes;
  let n2 = n * n;
  let q = n2 * inv_a2 + 1;
  let s = n2 + h;
  let p = (k / (n2 + h2)) * (1 / (q * q) + c * s * s);
  let moved = false;
  // descend downward
  while (n > 2) {
    n2 = (n - 1) * (n - 1);
    q = n2 * inv_a2 + 1;
    s = n2 + h;
    const pd = (k / (n2 + h2)) * (1 / (q * q) + c * s * s);
    if (!(pd <= p)) break;
    n--;
    p = pd;
    moved = true;
  }
  // descend upward
  if (!moved) {
    for (;;) {
      n2 = (n + 1) * (n + 1);
      q = n2 * inv_a2 + 1;
      s = n2 + h;
      const pu = (k / (n2 + h2)) * (1 / (q * q) + c * s * s);
      if (!(pu < p)) break;
      n++;
      p = pu;
    }
  }
  lastLobes = n;
  return p;
}

/** von Mises hydrostatic buckling pressure minimised over n ≥ 2, with the minimising n. */
export function vonMisesPressure(E: number, nu: number, R: number, t: number, L: number): { pressure: number; lobes: number } {
  const pressure = vonMisesMin(E, nu, R, t, L);
  return { pressure, lobes: lastLobes };
}

/**
 * Windenburg & Trilling (1934) short-cylinder buckling pressure (Pa); D = mean diameter.
 * Null where the formula breaks down (L/D ≤ 0.45·√(t/D)).
 */
export function windenburgTrillingPressure(E: number, nu: number, D: number, t: number, L: number): number | null {
  const p = wtOrZero(E, nu, D, t, L);
  return p > 0 ? p : null;
}

/** Windenburg & Trilling, or 0 where the formula breaks down (kept number-typed for speed). */
function wtOrZero(E: number, nu: number, D: number, t: number, L: number): number {
  const std = Math.sqrt(t / D);
  const den = L / D - 0.45 * std;
  if (!(den > 0)) return 0;
  const k = 1 - nu * nu;
  const td = t / D;
  return ((2.42 * E) / Math.sqrt(k * Math.sqrt(k))) * ((td * td * std) / den); // k^0.75 = √(k·√k)
}

/** Bresse/Bryan long-cylinder buckling pressure 2E/(1−ν²)·(t/D)³ (Pa); D = mean diameter. */
export function bryanPressure(E: number, nu: number, D: number, t: number): number {
  const td = t / D;
  return ((2 * E) / (1 - nu * nu)) * td * td * td;
}

/**
 * Classical (not knocked-down) buckling pressure used by the model (Pa):
 * min(von Mises, max(Windenburg–Trilling, Bresse/Bryan)). Windenburg–Trilling is floored at the
 * long-cylinder limit (a bay cannot be weaker than an infinitely long tube) and ignored where its
 * denominator fails; the result is continuous and non-decreasing in t.
 */
export function cylinderClassicalBucklingPressure(E: number, nu: number, innerRadius: number, t: number, L: number): number {
  const R = innerRadius + 0.5 * t;
  const D = 2 * R;
  const pvm = vonMisesMin(E, nu, R, t, L);
  const pwt = wtOrZero(E, nu, D, t, L);
  if (pwt === 0) return pvm;
  const pb = bryanPressure(E, nu, D, t);
  const short = pwt > pb ? pwt : pb;
  return short < pvm ? short : pvm;
}

/** Knocked-down elastic buckling pressure of the bay (Pa). */
export function cylinderBucklingPressure(E: number, nu: number, innerRadius: number, t: number, L: number): number {
  return CYLINDER_KNOCKDOWN * cylinderClassicalBucklingPressure(E, nu, innerRadius, t, L);
}

/** Yield pressure of the Lamé hoop stress: the pressure at which the inner-surface hoop stress reaches σa (Pa). */
export function cylinderYieldPressure(allowable: number, innerRadius: number, t: number): number {
  return allowable / cylinderLameHoopStress(1, innerRadius, t);
}

/**
 * Collapse of the bay: the lower of (a) the yield–buckling interaction of the Lamé yield pressure
 * and the knocked-down elastic pressure, and (b) first yield of the shell with its out-of-roundness
 * w0 = OOR·R (Timoshenko & Gere) on the classical elastic pressure.
 */
export function cylinderCollapse(g: Cylinder, t: number, m: ModeMaterial): CollapseDetail {
  const py = cylinderYieldPressure(m.compression, g.innerRadius, t);
  const pe = CYLINDER_KNOCKDOWN * cylinderClassicalBucklingPressure(m.E, m.nu, g.innerRadius, t, g.length);
  const interaction = collapsePressure(py, pe);
  if (!g.outOfRoundness) return { elastic: pe, yield: py, collapse: interaction };
  // a measured oval (two-lobe) deviation: its amplification runs on the two-lobe pressure of the bay
  const w0 = g.outOfRoundness * (g.innerRadius + 0.5 * t);
  const p2 = vonMisesPressureForLobes(m.E, m.nu, g.innerRadius + 0.5 * t, t, g.length, 2);
  const ovality = outOfRoundYield(py, p2, w0, t);
  return { elastic: pe, yield: py, collapse: interaction < ovality ? interaction : ovality };
}

const COMPRESSION = compressionText(
  'Hoop compression, Lamé thick-wall cylinder under external pressure, inner surface: σ = 2·p·Ro²/(Ro² − Ri²) ' +
    '(reduces to the thin-shell p·R/t; axial stress is half of it, so hoop governs).',
);
const BUCKLING =
  'Collapse of the bay between rigid stiffeners: elastic pe = 0.56 (knock-down for lateral pressure, NASA SP-8007 [memory]) × the lower of von Mises ' +
  '(hydrostatic, minimised over n ≥ 2 lobes) and Windenburg & Trilling (1934, Trans. ASME 56), the latter floored at the Bresse/Bryan long-cylinder ' +
  `limit; yield py = σa·(Ro² − Ri²)/(2Ro²) (Lamé); ${COLLAPSE_INTERACTION}; with an out-of-roundness entered, not above first yield of the oval shell, ` +
  'p² − p·(py + (1 + 6w0/t)·p₂) + py·p₂ = 0, w0 = out-of-roundness × R, p₂ the two-lobe von Mises pressure of the bay (Timoshenko & Gere, Theory of Elastic Stability, 1961 ' +
  "[memory: section]). Stress = p·R/t; allowable = pc·R/t, so the safety factor is pc/p. Uses the short-term Young's modulus.";

export const CYLINDER_FRAMES_WARNING =
  'Stiffeners and bulkheads are assumed rigid: general instability of the stiffened hull and the strength of the frames themselves are not checked here; use the ring-stiffened cylinder for them.';

interface CollapseProblem {
  g: Cylinder;
  m: ModeMaterial;
  p: number;
}
function collapseSafetyFactor(t: number, c: CollapseProblem): number {
  return cylinderCollapse(c.g, t, c.m).collapse / c.p;
}

/** Largest thickness the searches consider, as a multiple of the inner radius. */
const MAX_THICKNESS_RATIO = 1e4;

export const cylinderModel: ComponentModel<Cylinder> = {
  modes: MODES,
  usesModulus: true,
  thickness: (g) => g.thickness,

  fill(g, t, p, m, stress, allowable) {
    stress[0] = cylinderLameHoopStress(p, g.innerRadius, t);
    allowable[0] = m.compression;
    const R = g.innerRadius + 0.5 * t;
    stress[1] = (p * R) / t;
    allowable[1] = (cylinderCollapse(g, t, m).collapse * R) / t;
  },

  required(g, p, m, target, i, t, stress, allowable) {
    const ri = g.innerRadius;
    if (i === 0) {
      // 2·p·Ro² = s·(Ro² − Ri²) → Ro = Ri·√(s/(s − 2p)); impossible when s ≤ 2p
      const x = (2 * p * target) / allowable;
      if (!(x < 1)) return null;
      return ri * Math.expm1(-0.5 * Math.log1p(-x));
    }
    // collapse grows roughly as t^2.5 while elastic, as t near yield
    const guess = t * Math.pow(target / (allowable / stress), 0.4);
    return thicknessForTarget(collapseSafetyFactor, { g, m, p }, target, guess, ri * 1e-9, ri * MAX_THICKNESS_RATIO, 2.5, t, allowable / stress);
  },

  model(_g, i, m) {
    return i === 0 ? COMPRESSION[m.compressionOnYield ? 'yield' : 'strength'] : BUCKLING;
  },

  collapse(g, t, m, i) {
    return i === 1 ? cylinderCollapse(g, t, m) : null;
  },

  check(g, _p, _m, _stress, _allowable, warnings) {
    warnings.push(CYLINDER_FRAMES_WARNING);
    if (!g.outOfRoundness && g.length > 4 * (g.innerRadius + 0.5 * g.thickness)) {
      warnings.push(
        'A long bay collapses in an oval mode that is sensitive to out-of-roundness: enter the measured out-of-roundness (a common tolerance is 0.5 % of the radius); without it only the knock-down of the elastic pressure covers imperfections.',
      );
    }
    if (g.thickness / (g.innerRadius + 0.5 * g.thickness) > 0.1) {
      warnings.push('t/R is past the thin-shell range of the buckling formulas (about 0.1, common practice): the collapse value is indicative; yield governs thick shells.');
    }
    return undefined;
  },

  validity: (g, t, i) => (i === 1 ? thinShellValidity(t, g.innerRadius + 0.5 * t) : null),

  weightToDisplacement(g, t, density, waterDensity) {
    // per unit length of the bay; end closures and frames excluded
    const k = g.innerRadius / (g.innerRadius + t);
    return (density / waterDensity) * (1 - k * k);
  },
};

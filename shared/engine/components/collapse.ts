/**
 * Collapse of shells where yield and buckling meet. Real shells collapse below both the yield
 * pressure and the (knocked-down) elastic buckling pressure where the two are close; taking the
 * lower of them is unconservative exactly where hulls are designed.
 *
 * Two published interactions, the lower taken:
 *  - Johnson–Ostenfeld: pc = pe for pe ≤ py/2, else py·(1 − py/(4·pe)) — Johnson's parabola
 *    (J. B. Johnson 1893) in stress-ratio form, tangent to the elastic curve at half the yield;
 *    class rules correct elastic buckling for yield above that point (e.g. Lloyd's Register, Rules
 *    for Offshore Units, Pt 4 Ch 5 §4.3.1: "where the elastic critical buckling stress exceeds 50 per
 *    cent of the … yield stress").
 *  - reduced slenderness: pc = py/√(1 + λ⁴), λ² = py/pe (DNV-RP-C202, Buckling Strength of
 *    Shells, §3.2 [memory: the form, corroborated by a public transcription]).
 * Both tend to pe when pe ≪ py and to py when pe ≫ py; near pe ≈ py they give 0.71–0.75·py.
 * `pe` must already carry the imperfection knock-down (or be an empirical collapse value).
 *
 * First yield of an out-of-round shell (Timoshenko & Gere, Theory of Elastic Stability, 2nd ed.,
 * 1961, the ring with an initial deviation w0 [memory: section]): the membrane stress p·R/t plus the
 * bending of the deviation amplified by 1/(1 − p/pe) reaches yield where
 *   p² − p·(py + (1 + 6·w0/t)·pe) + py·pe = 0   (smaller root),
 * which is min(py, pe) for a perfect shell and falls as the deviation grows.
 */

/** Johnson–Ostenfeld collapse pressure (Pa). */
export function johnsonOstenfeld(py: number, pe: number): number {
  return pe <= 0.5 * py ? pe : py * (1 - py / (4 * pe));
}

/** Reduced-slenderness collapse pressure py/√(1 + (py/pe)²) (Pa). */
export function reducedSlenderness(py: number, pe: number): number {
  const r = py / pe;
  return py / Math.sqrt(1 + r * r);
}

/** The lower of the two interactions (Pa). */
export function collapsePressure(py: number, pe: number): number {
  const a = johnsonOstenfeld(py, pe);
  const b = reducedSlenderness(py, pe);
  return a < b ? a : b;
}

/**
 * Pressure at first yield of a shell with an initial deviation of amplitude w0 (Pa): the smaller
 * root of p² − p·(py + (1 + 6·w0/t)·pe) + py·pe = 0 (Timoshenko & Gere). `pe` is the perfect
 * shell's elastic buckling pressure (the deviation is the imperfection).
 */
export function outOfRoundYield(py: number, pe: number, w0: number, t: number): number {
  const b = py + (1 + (6 * w0) / t) * pe;
  const disc = b * b - 4 * py * pe;
  // 2c/(b + √disc): the stable form of the smaller root
  return (2 * py * pe) / (b + Math.sqrt(disc > 0 ? disc : 0));
}

export const COLLAPSE_INTERACTION =
  'collapse = the lower of Johnson–Ostenfeld (pe for pe ≤ py/2, else py·(1 − py/(4pe)); Johnson 1893, the yield correction above half the ' +
  'yield of the class rules) and the reduced-slenderness curve py/√(1 + (py/pe)²) (DNV-RP-C202 §3.2 [memory])';

/** Collapse details a shell mode reports beside its safety factor (pressures, Pa). */
export interface CollapseDetail {
  /** The elastic buckling pressure used (knocked down, or empirical), Pa. */
  elastic: number;
  /** The yield pressure of the mode, Pa. */
  yield: number;
  /** The collapse pressure, Pa: what the safety factor is taken on. */
  collapse: number;
}

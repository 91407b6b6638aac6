/**
 * Ring-stiffened cylinder under external hydrostatic pressure: a shell (inner radius Ri,
 * thickness t, mean radius R) with equally spaced ring frames (spacing Lf, a tee or a section,
 * inside or outside) between bulkheads a length LB apart. The frames are of the shell's material.
 *
 * Four checks, each as a critical pressure (stress = p·R/t, allowable = p_crit·R/t, so the safety
 * factor is p_crit/p):
 *  1. interframe shell yield (compression): the pressure at which the mean hoop stress of the
 *     shell at mid-bay reaches yield, by the von Sanden–Günther / Pulos–Salerno solution in the form
 *     of the pressure-vessel codes (PD 5500 §3.6.2 / EN 13445-3 §8.5.3.4, as printed with a public
 *     worked example):
 *       δ = [3(1−ν²)]^¼/√(R·t), L = Lf − w (clear bay), N = (cosh δL − cos δL)/(sinh δL + sin δL),
 *       G = 2[sinh(δL/2)cos(δL/2) + cosh(δL/2)sin(δL/2)]/(sinh δL + sin δL), Am = Af·(R/Rf)²,
 *       B = 2tN/(δ(Am + wt)), γ = Am(1 − ν/2)/((Am + wt)(1 + B)), Py = σa·t/(R(1 − γG));
 *  2. interframe collapse (buckling): von Mises lobar buckling of the clear bay (hydrostatic,
 *     minimised over n ≥ 2) times the knock-down 0.56 (NASA SP-8007 [memory]), with yield Py, through
 *     the yield–buckling interaction (collapse.ts);
 *  3. overall collapse (buckling): general instability of shell and frames, Bryant (1954, NCRE
 *     R306 [memory: form]) p_n = (E·t/R)·λ⁴/((n² + λ²)²(n² − 1 + λ²/2)) + (n² − 1)·E·Ie/(R³·Lf),
 *     λ = πR/LB, minimised over n ≥ 2, Ie of the frame with an effective length of shell
 *     Le = min(Lf, 1.56√(R·t)) (common practice [memory]); with the ring's hoop yield
 *     σa·(t·Lf + Af)/(R·Lf), through the interaction;
 *  4. frame yield (compression): the frame's mean hoop stress p·R·Lf/(Af + t·Lf) plus the bending
 *     of the out-of-roundness w0 = OOR·R amplified in an n-lobe overall mode,
 *     σb = E·c·w0·(n² − 1)·p/(R²(p_n − p)) (the frame-stress check of the codes [memory: form]),
 *     reaches yield; c = distance from the combined neutral axis to the frame's outer fibre; the
 *     deviation taken in each low mode n = 2…6 (common practice), the lowest governing.
 * Required thickness is the shell's, with the frames as given.
 */
import { DEFAULT_OUT_OF_ROUNDNESS, type RingStiffenedCylinder } from '../../schemas/evaluate';
import { fmt } from '../allowables';
import { thicknessForTarget } from '../solve';
import type { FailureMode } from '../types';
import { collapsePressure, COLLAPSE_INTERACTION, type CollapseDetail } from './collapse';
import { compressionText, thinShellValidity, type ComponentModel, type ModeMaterial } from './common';
import { vonMisesPressure } from './cylinder';

const MODES: readonly FailureMode[] = ['compression', 'buckling', 'buckling', 'compression'];
const CHECKS = ['interframe shell yield', 'interframe collapse', 'overall collapse', 'frame yield'] as const;

/** Section properties of a frame, SI: area, second moment about its centroid, depth, centroid height above the shell surface, contact width. */
export interface FrameProperties {
  area: number;
  secondMoment: number;
  depth: number;
  centroidHeight: number;
  contactWidth: number;
}

export function frameProperties(frame: RingStiffenedCylinder['frame']): FrameProperties {
  if (frame.shape === 'section') return frame;
  const { webHeight: hw, webThickness: tw, flangeWidth: bf, flangeThickness: tf } = frame;
  const aw = hw * tw;
  const af = bf * tf;
  const area = aw + af;
  const zw = hw / 2;
  const zf = hw + tf / 2;
  const zc = (aw * zw + af * zf) / area;
  const secondMoment = (tw * hw ** 3) / 12 + (bf * tf ** 3) / 12 + aw * (zw - zc) ** 2 + af * (zf - zc) ** 2;
  return { area, secondMoment, depth: hw + tf, centroidHeight: zc, contactWidth: tw };
}

/**
 * Interframe yield pressure Py of the codes' von Sanden–Günther / Pulos–Salerno form (Pa).
 * R mean shell radius, t shell thickness, Rf radius of the frame centroid, L clear bay length,
 * w frame contact width, Af frame area, sy yield (allowable) stress.
 */
export function interframeYieldPressure(sy: number, t: number, R: number, Rf: number, L: number, w: number, Af: number, poisson: number): number {
  // the solution is for ordinary isotropic metals: ν taken as at least 0, and 1 − γG kept at 0.1 or more
  // (it is about 0.15 at its smallest for ν = 0.3), so an auxetic input cannot make the formula divide by zero
  const nu = poisson > 0 ? poisson : 0;
  const delta = Math.pow(3 * (1 - nu * nu), 0.25) / Math.sqrt(R * t);
  const x = delta * L;
  let N: number;
  let G: number;
  if (x > 40) {
    // long bays: the frames no longer reach mid-bay
    N = 1;
    G = 0;
  } else {
    const den = Math.sinh(x) + Math.sin(x);
    N = (Math.cosh(x) - Math.cos(x)) / den;
    G = (2 * (Math.sinh(x / 2) * Math.cos(x / 2) + Math.cosh(x / 2) * Math.sin(x / 2))) / den;
  }
  const Am = Af * (R / Rf) * (R / Rf);
  const B = (2 * t * N) / (delta * (Am + w * t));
  const gamma = (Am * (1 - nu / 2)) / ((Am + w * t) * (1 + B));
  const relief = 1 - gamma * G;
  return (sy * t) / (R * (relief > 0.1 ? relief : 0.1));
}

/** Bryant's overall buckling pressure for n lobes (Pa). */
export function bryantPressureForLobes(E: number, R: number, t: number, LB: number, Lf: number, Ie: number, n: number): number {
  const lambda = (Math.PI * R) / LB;
  const l2 = lambda * lambda;
  const n2 = n * n;
  const q = n2 + l2;
  return ((E * t) / R) * ((l2 * l2) / (q * q * (n2 - 1 + l2 / 2))) + ((n2 - 1) * E * Ie) / (R * R * R * Lf);
}

/** The largest lobe number searched (the minimum lies far below it for any hull). */
const MAX_LOBES = 40;

/** Bryant's overall buckling pressure, minimised over n = 2…40 (Pa). */
export function bryantPressure(E: number, R: number, t: number, LB: number, Lf: number, Ie: number): number {
  return bryantMinimum(E, R, t, LB, Lf, Ie).pressure;
}

function bryantMinimum(E: number, R: number, t: number, LB: number, Lf: number, Ie: number): { pressure: number; lobes: number } {
  let pressure = Infinity;
  let lobes = 2;
  for (let n = 2; n <= MAX_LOBES; n++) {
    const p = bryantPressureForLobes(E, R, t, LB, Lf, Ie, n);
    if (p < pressure) {
      pressure = p;
      lobes = n;
    }
  }
  return { pressure, lobes };
}

/** What the overall checks need about the hull at shell thickness t. */
export interface Hull {
  R: number;
  Rf: number;
  frame: FrameProperties;
  /** Combined frame + effective plating: second moment, and distance from its neutral axis to the frame's outer fibre. */
  Ie: number;
  c: number;
  pn: number;
  /** Lobes of the lowest overall mode. */
  lobes: number;
}

function hullAt(g: RingStiffenedCylinder, t: number, E: number): Hull {
  const frame = frameProperties(g.frame);
  const R = g.innerRadius + t / 2;
  const Rf = g.framePosition === 'internal' ? g.innerRadius - frame.centroidHeight : g.innerRadius + t + frame.centroidHeight;
  const Le = Math.min(g.frameSpacing, 1.56 * Math.sqrt(R * t));
  const ef = t / 2 + frame.centroidHeight; // frame centroid from the shell mid-surface
  const ac = frame.area + Le * t;
  const zna = (frame.area * ef) / ac;
  const Ie = frame.secondMoment + frame.area * (ef - zna) ** 2 + (Le * t ** 3) / 12 + Le * t * zna * zna;
  const c = t / 2 + frame.depth - zna;
  const { pressure: pn, lobes } = bryantMinimum(E, R, t, g.length, g.frameSpacing, Ie);
  return { R, Rf, frame, Ie, c, pn, lobes };
}

/** The critical pressure of check i at shell thickness t (Pa), with its collapse detail for the buckling checks. */
export function ringStiffenedCritical(g: RingStiffenedCylinder, t: number, m: ModeMaterial, i: number, hull?: Hull): CollapseDetail {
  const sy = m.compression;
  if (i < 2) {
    const frame = frameProperties(g.frame);
    const R = g.innerRadius + t / 2;
    const Rf = g.framePosition === 'internal' ? g.innerRadius - frame.centroidHeight : g.innerRadius + t + frame.centroidHeight;
    const clear = g.frameSpacing - frame.contactWidth;
    const py = interframeYieldPressure(sy, t, R, Rf, clear, frame.contactWidth, frame.area, m.nu);
    if (i === 0) return { elastic: Infinity, yield: py, collapse: py };
    const pe = 0.56 * vonMisesPressure(m.E, m.nu, R, t, clear).pressure;
    return { elastic: pe, yield: py, collapse: collapsePressure(py, pe) };
  }
  // the overall checks share the hull's section and overall mode (worked out once per thickness by fill)
  const h = hull ?? hullAt(g, t, m.E);
  const pyRing = (sy * (t * g.frameSpacing + h.frame.area)) / (h.R * g.frameSpacing);
  if (i === 2) return { elastic: h.pn, yield: pyRing, collapse: collapsePressure(pyRing, h.pn) };
  // frame yield: mean hoop stress plus the out-of-roundness bending amplified in an n-lobe mode reach
  // yield below that mode's p_n; the imperfection can lie in any mode, so the lowest over n governs
  const w0 = (g.outOfRoundness ?? DEFAULT_OUT_OF_ROUNDNESS) * h.R;
  const membrane = (h.R * g.frameSpacing) / (h.frame.area + t * g.frameSpacing); // per unit pressure
  let pfy = sy / membrane;
  // the deviation is taken in each of the low modes n = 2…6, where fabrication out-of-roundness is
  // measured and lies (common practice); the lowest governs. A fixed set keeps the check continuous.
  // A perfectly round frame (w0 = 0) is the limit of a nearly round one: it yields at its membrane
  // stress unless an n-lobe mode buckles first (the root below is then min(σy/a, p_n) exactly), so
  // a vanishing out-of-roundness cannot jump the check up to the membrane yield alone.
  for (let n = 2; n <= 6; n++) {
    const pnn = bryantPressureForLobes(m.E, h.R, t, g.length, g.frameSpacing, h.Ie, n);
    const bending = (m.E * h.c * w0 * (n * n - 1)) / (h.R * h.R);
    // p·a + b·p/(p_n − p) = σy  ⇔  a·p² − (a·p_n + b + σy)·p + σy·p_n = 0: the smaller root, in its stable form
    const B = membrane * pnn + bending + sy;
    const disc = B * B - 4 * membrane * sy * pnn;
    const root = (2 * sy * pnn) / (B + Math.sqrt(disc > 0 ? disc : 0));
    if (root < pfy) pfy = root;
  }
  return { elastic: h.pn, yield: sy / membrane, collapse: pfy };
}

const CHECK_TEXTS = [
  compressionText(
    'Interframe shell yield: mean hoop stress at mid-bay reaches yield at Py = σa·t/(R(1 − γG)), the von Sanden–Günther / Pulos–Salerno solution in ' +
      'the form of PD 5500 §3.6.2 / EN 13445-3 §8.5.3.4 (δ = [3(1−ν²)]^¼/√(Rt), N, G, Am = Af(R/Rf)², B, γ as there; L the clear bay). Stress = p·R/t; allowable = Py·R/t.',
  ),
  `Interframe collapse: elastic pe = 0.56 (NASA SP-8007 [memory]) × von Mises lobar buckling of the clear bay (hydrostatic, minimised over n ≥ 2); yield Py (interframe); ${COLLAPSE_INTERACTION}. Stress = p·R/t; allowable = pc·R/t.`,
  `Overall collapse of shell and frames: elastic p_n of Bryant (1954, NCRE R306 [memory]) minimised over n ≥ 2, Ie with shell over Le = min(Lf, 1.56√(Rt)); yield of the ring σa(t·Lf + Af)/(R·Lf); ${COLLAPSE_INTERACTION}. Stress = p·R/t; allowable = pc·R/t.`,
  compressionText(
    'Frame yield: the frame mean hoop stress p·R·Lf/(Af + t·Lf) plus the out-of-roundness bending E·c·w0·(n² − 1)·p/(R²(p_n − p)) (the codes\' frame-stress check [memory: form]), w0 = out-of-roundness × R, reaches yield. Stress = p·R/t; allowable = p_fy·R/t.',
  ),
] as const;

function modeSafetyFactor(t: number, c: { g: RingStiffenedCylinder; m: ModeMaterial; p: number; i: number }): number {
  return ringStiffenedCritical(c.g, t, c.m, c.i).collapse / c.p;
}

export const ringStiffenedCylinderModel: ComponentModel<RingStiffenedCylinder> = {
  modes: MODES,
  usesModulus: true,
  thickness: (g) => g.thickness,

  fill(g, t, p, m, stress, allowable) {
    const R = g.innerRadius + t / 2;
    const membrane = (p * R) / t;
    const hull = hullAt(g, t, m.E);
    for (let i = 0; i < 4; i++) {
      stress[i] = membrane;
      allowable[i] = (ringStiffenedCritical(g, t, m, i, i < 2 ? undefined : hull).collapse * R) / t;
    }
  },

  required(g, p, m, target, i, t, stress, allowable) {
    const sf = allowable / stress;
    const guess = t * Math.pow(target / sf, i === 0 || i === 3 ? 1 : 0.5);
    return thicknessForTarget(modeSafetyFactor, { g, m, p, i }, target, guess, g.innerRadius * 1e-6, g.innerRadius, i === 0 || i === 3 ? 1 : 2, t, sf);
  },

  model(_g, i, m) {
    const text = CHECK_TEXTS[i];
    return typeof text === 'string' ? text : text[m.compressionOnYield ? 'yield' : 'strength'];
  },

  checkName: (_g, i) => CHECKS[i],

  collapse(g, t, m, i) {
    return i === 0 ? null : ringStiffenedCritical(g, t, m, i);
  },

  check(g, _p, _m, stress, allowable, warnings) {
    if (allowable[3] / stress[3] < 1.5 && allowable[3] / stress[3] < allowable[2] / stress[2]) {
      warnings.push('Frame yield is the lowest check: the frames (not the shell) are too small for this out-of-roundness; enlarge the frames or tighten the tolerance.');
    }
    if (g.outOfRoundness === undefined) {
      warnings.push(
        `No out-of-roundness given: ${fmt(DEFAULT_OUT_OF_ROUNDNESS * 100)} % of the radius was assumed in the frame-yield check (a common fabrication tolerance); enter the measured value.`,
      );
    }
    warnings.push('Frames are of the shell material, welded fully to the shell, and tripping of the frames is not checked.');
    return undefined;
  },

  validity: (g, t, i) => (i === 1 || i === 2 ? thinShellValidity(t, g.innerRadius + 0.5 * t) : null),

  weightToDisplacement(g, t, density, waterDensity) {
    const frame = frameProperties(g.frame);
    const ro = g.innerRadius + t;
    const Rf = g.framePosition === 'internal' ? g.innerRadius - frame.centroidHeight : ro + frame.centroidHeight;
    const frameArea = (2 * Math.PI * Rf * frame.area) / g.frameSpacing; // per unit length
    const metal = Math.PI * (ro * ro - g.innerRadius * g.innerRadius) + frameArea;
    const displaced = Math.PI * ro * ro + (g.framePosition === 'external' ? frameArea : 0);
    return ((density / waterDensity) * metal) / displaced;
  },

  massPerArea(g, t, density) {
    return density * (t + frameProperties(g.frame).area / g.frameSpacing);
  },
};

/**
 * Spherical shell under external pressure p (inner radius Ri, thickness t, Ro = Ri + t, mean
 * radius R = Ri + t/2).
 *
 * Compression (yield): Lamé thick-wall solution, hoop stress at the inner surface (the largest),
 *   σ = 1.5·p·Ro³/(Ro³ − Ri³),
 * exact for an elastic sphere and equal to the thin p·R/(2t) as t/R → 0. Its yield pressure
 *   py = σa·(Ro³ − Ri³)/(1.5·Ro³)  (σa the compressive allowable)
 * enters the collapse below.
 *
 * Buckling (collapse): the elastic pressure of a WHOLE sphere by how it was made — no shallow-cap
 * formula — then the yield–buckling interaction (collapse.ts):
 *  - fabricated (welded or formed within ordinary tolerances, the default): the elastic branch of
 *    the pressure-vessel code's sphere curve, pe = 0.18·pZoelly (EN 13445-3 §8.7, Pr/Py = 0.18·Pm/Py
 *    for Pm/Py < 0.5 [a public transcription of the standard]); pZoelly = 2E/√(3(1−ν²))·(t/R)²
 *    (Zoelly 1915);
 *  - machined (near-perfect, stress-relieved): pe = 0.84·E·(t/Ro)², the empirical relation of the
 *    David Taylor Model Basin tests of machined spheres (Krenzke & Kiernan 1963, DTIC AD0422297
 *    [memory: the constant]);
 *  - a measured local radius Rl (over an arc of 2.2·√(R·t)) replaces R: pe ∝ (t/Rl)², taken for
 *    both classes (the lower governs) (Krenzke & Kiernan, DTMB [memory]).
 * Collapse pc = the interaction of py and pe; stress = p·R/(2t), allowable = pc·R/(2t), so the
 * safety factor is pc/p. The elastic and yield pressures are reported beside it.
 */
import type { Sphere } from '../../schemas/evaluate';
import { fmt } from '../allowables';
import { thicknessForTarget } from '../solve';
import type { FailureMode } from '../types';
import { collapsePressure, COLLAPSE_INTERACTION, type CollapseDetail } from './collapse';
import { compressionText, thinShellValidity, type ComponentModel, type ModeMaterial } from './common';

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

/** Fraction of Zoelly for fabricated spheres (EN 13445-3 §8.7 elastic branch [public transcription]). */
export const FABRICATED_SPHERE_FACTOR = 0.18;
/** Coefficient of the machined-sphere relation pe = 0.84·E·(t/Ro)² (Krenzke & Kiernan [memory]). */
export const MACHINED_SPHERE_COEFFICIENT = 0.84;

/** Elastic (imperfection-inclusive) buckling pressure of a whole sphere (Pa). */
export function sphereElasticPressure(
  E: number,
  nu: number,
  innerRadius: number,
  t: number,
  fabrication: 'fabricated' | 'machined' = 'fabricated',
  localRadiusRatio = 1,
): number {
  const R = innerRadius + 0.5 * t;
  const ro = innerRadius + t;
  const rl = ro * localRadiusRatio;
  const machined = MACHINED_SPHERE_COEFFICIENT * E * (t / rl) * (t / rl);
  if (fabrication === 'machined') return machined;
  const coded = (FABRICATED_SPHERE_FACTOR * zoellyPressure(E, nu, t, R)) / (localRadiusRatio * localRadiusRatio);
  return coded < machined ? coded : machined;
}

/** Yield pressure of the Lamé sphere: the pressure at which the inner-surface stress reaches σa (Pa). */
export function sphereYieldPressure(allowable: number, innerRadius: number, t: number): number {
  return allowable / sphereLameStress(1, innerRadius, t);
}

/** Collapse pressure of the sphere: interaction of yield and elastic (Pa). */
export function sphereCollapse(g: Sphere, t: number, m: ModeMaterial): CollapseDetail {
  const py = sphereYieldPressure(m.compression, g.innerRadius, t);
  const pe = sphereElasticPressure(m.E, m.nu, g.innerRadius, t, g.fabrication, g.localRadiusRatio);
  return { elastic: pe, yield: py, collapse: collapsePressure(py, pe) };
}

const COMPRESSION = compressionText(
  'Membrane compression, Lamé thick-wall sphere under external pressure, inner surface: σ = 1.5·p·Ro³/(Ro³ − Ri³) ' +
    '(reduces to the thin-shell p·R/(2t) for thin walls; e.g. Roark, 7th ed., Table 13.5 [memory: table number]).',
);
const ELASTIC_TEXT = {
  fabricated:
    'elastic pe = 0.18 × Zoelly (1915) 2E/√(3(1−ν²))·(t/R)², the elastic branch of the pressure-vessel code for fabricated spheres (EN 13445-3 §8.7, a public transcription)',
  machined: 'elastic pe = 0.84·E·(t/Ro)², the David Taylor Model Basin relation for machined spheres (Krenzke & Kiernan 1963 [memory: constant])',
};
const buckling = (fabrication: 'fabricated' | 'machined', local: boolean) =>
  `Collapse of a complete sphere (${fabrication}): ${ELASTIC_TEXT[fabrication]}${local ? ', with R replaced by the measured local radius over an arc of 2.2√(Rt) (Krenzke & Kiernan [memory])' : ''}; ` +
  `yield py = σa·(Ro³ − Ri³)/(1.5·Ro³) (Lamé); ${COLLAPSE_INTERACTION}. Stress = p·R/(2t); allowable = pc·R/(2t), so the safety factor is pc/p. ` +
  "Uses the short-term Young's modulus.";
const BUCKLING = {
  fabricated: buckling('fabricated', false),
  machined: buckling('machined', false),
  fabricatedLocal: buckling('fabricated', true),
  machinedLocal: buckling('machined', true),
};

function collapseSafetyFactor(t: number, c: { g: Sphere; m: ModeMaterial; p: number }): number {
  return sphereCollapse(c.g, t, c.m).collapse / c.p;
}

export const sphereModel: ComponentModel<Sphere> = {
  modes: MODES,
  usesModulus: true,
  thickness: (g) => g.thickness,

  fill(g, t, p, m, stress, allowable) {
    stress[0] = sphereLameStress(p, g.innerRadius, t);
    allowable[0] = m.compression;
    const R = g.innerRadius + 0.5 * t;
    stress[1] = sphereMembraneStress(p, R, t);
    allowable[1] = sphereMembraneStress(sphereCollapse(g, t, m).collapse, R, t);
  },

  required(g, p, m: ModeMaterial, target, i, t, stress, allowable) {
    const ri = g.innerRadius;
    if (i === 0) {
      // 1.5·p·Ro³ = s·(Ro³ − Ri³) → Ro = Ri·(s/(s − 1.5p))^(1/3); impossible when s ≤ 1.5p
      const s = allowable / target;
      const x = (1.5 * p) / s;
      if (!(x < 1)) return null;
      return ri * Math.expm1(-Math.log1p(-x) / 3);
    }
    // collapse rises with t (yield and elastic both do); ~t² while elastic, ~t near yield
    const sf = allowable / stress;
    const guess = t * Math.pow(target / sf, 0.5);
    return thicknessForTarget(collapseSafetyFactor, { g, m, p }, target, guess, ri * 1e-9, ri * 1e4, 2, t, sf);
  },

  model(g, i, m) {
    if (i === 0) return COMPRESSION[m.compressionOnYield ? 'yield' : 'strength'];
    const f = g.fabrication ?? 'fabricated';
    return BUCKLING[g.localRadiusRatio !== undefined && g.localRadiusRatio > 1 ? (f === 'machined' ? 'machinedLocal' : 'fabricatedLocal') : f];
  },

  collapse(g, t, m, i) {
    return i === 1 ? sphereCollapse(g, t, m) : null;
  },

  check(g, _p, _m, _stress, _allowable, warnings) {
    if ((g.fabrication ?? 'fabricated') === 'machined' && g.localRadiusRatio === undefined) {
      warnings.push(
        'Machined-sphere collapse assumes a near-perfect, stress-relieved shell (David Taylor Model Basin tests): fabricated or welded spheres ' +
          'collapse far lower. Measure the local radius over an arc of 2.2√(R·t) and enter it, or treat the sphere as fabricated.',
      );
    }
    if (g.thickness / (g.innerRadius + 0.5 * g.thickness) > 0.1) {
      warnings.push(
        `t/R = ${fmt(g.thickness / (g.innerRadius + 0.5 * g.thickness))} is past the thin-shell range of the buckling relations (about 0.1, common practice): the collapse value is indicative; yield governs thick spheres.`,
      );
    }
    return undefined;
  },

  validity: (g, t, i) => (i === 1 ? thinShellValidity(t, g.innerRadius + 0.5 * t) : null),

  weightToDisplacement(g, t, density, waterDensity) {
    const ro = g.innerRadius + t;
    const k = g.innerRadius / ro;
    return (density / waterDensity) * (1 - k * k * k);
  },
};

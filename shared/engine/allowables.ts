/**
 * Allowable stresses per failure mode for one candidate under one load case.
 *
 * Base strengths: tension = tensileYield ?? tensileStrength; compression = compressiveYield ??
 * compressiveStrength; shear = shearYield ?? (metals: yield/√3, von Mises) ?? shearStrength (the
 * ultimate, for brittle and polymer materials). Each is multiplied by
 *  - the temperature factor: the WORST (lowest) factor over the design range, piecewise-linear
 *    in °C, found at the range ends and at every data point inside the range; clamped to the end
 *    value outside the data (with a warning). The set's own curve, else its family's default
 *    curve (`FAMILY_TEMPERATURE_FACTORS`, cited there), else none (with a warning for polymers);
 *  - ONE life factor: the lower of the sustained-load factor (at the load case's hours, linear in
 *    log10(hours)) and the cyclic factor (at its cycles, linear in log10(cycles)). Static and
 *    cyclic fatigue are measured on separate tests, each of which already spends load time on
 *    the other effect; multiplying the two counts the same damage twice. Taking the governing one
 *    is the rule stated here (common practice; the pressure-window standard likewise folds both
 *    into a single conversion factor).
 * Short-term allowables (base × temperature, no life factor) serve the proof-test check.
 * Missing data never passes silently: a warning says what was not accounted for.
 * Buckling uses Young's modulus (not reduced here; see the creep warning for polymers).
 */
import type { Family } from '../schemas/catalogue';
import { FAMILY_TEMPERATURE_FACTORS } from './defaults';
import type { AppliedFactors, CandidateMaterial, LifeBasis } from './types';

/** The load-case conditions that affect allowables. */
export interface Conditions {
  /** °C */
  temperature: { min: number; max: number };
  sustainedHours: number;
  cycles: number;
}

export interface Allowables {
  /** Pa */
  tension: number;
  /** Pa */
  compression: number;
  /** Pa */
  shear: number;
  /** true when tension is based on tensileYield rather than tensileStrength. */
  tensionOnYield: boolean;
  /** true when compression is based on compressiveYield rather than compressiveStrength. */
  compressionOnYield: boolean;
  /** What the shear allowable is based on: the set's shear yield, yield/√3 (von Mises), or the shear ultimate. */
  shearBasis: ShearBasis;
  /** Short-term allowables (base strength × temperature factor, no life factor), Pa: for the proof test. */
  shortTerm: { tension: number; compression: number; shear: number };
  factors: AppliedFactors;
}

const POW10: number[] = Array.from({ length: 31 }, (_, i) => Number(`1e${i}`));

/**
 * Rounded for messages: 4 significant figures in the shortest decimal form, exactly as
 * `String(Number(x.toPrecision(4)))` but several times faster for ordinary magnitudes.
 */
export function fmt(x: number): string {
  if (x === 0 || !Number.isFinite(x)) return String(x);
  const ax = x < 0 ? -x : x;
  if (ax < 1e-6 || ax >= 1e21) return String(Number(x.toPrecision(4)));
  const e = Math.floor(Math.log10(ax)) - 3; // −9 … 17
  if (e >= 0) return String(Math.round(x / POW10[e]) * POW10[e]); // an integer: prints exactly
  // a 4-digit (or 5 after rounding up) integer with the decimal point placed by hand
  const digits = String(Math.round(ax * POW10[-e]));
  let end = digits.length;
  while (end > 0 && digits.charCodeAt(end - 1) === 48 /* 0 */ && end > digits.length + e) end--;
  const point = digits.length + e; // digits before the point
  const frac = digits.slice(point > 0 ? point : 0, end);
  const whole = point > 0 ? digits.slice(0, point) : '0';
  const lead = point < 0 ? '0'.repeat(-point) : '';
  const out = frac.length > 0 || lead.length > 0 ? `${whole}.${lead}${frac}` : whole;
  return x < 0 ? `-${out}` : out;
}

// ---------------------------------------------------------------------------------------------
// Piecewise-linear interpolation of the property set's own factor lists. One small function per
// abscissa (temperature, hours, cycles) keeps every property access monomorphic; lists already
// sorted (the usual case) are used in place, unsorted ones are sorted into a copy.
// ---------------------------------------------------------------------------------------------

type TPoint = { temperature: number; factor: number };
type HPoint = { hours: number; factor: number };
type CPoint = { cycles: number; factor: number };

function sortedT(pts: readonly TPoint[] | null | undefined): readonly TPoint[] | null {
  if (!pts || pts.length === 0) return null;
  for (let i = 1; i < pts.length; i++) if (pts[i].temperature < pts[i - 1].temperature) return [...pts].sort((a, b) => a.temperature - b.temperature);
  return pts;
}
function sortedH(pts: readonly HPoint[] | null | undefined): readonly HPoint[] | null {
  if (!pts || pts.length === 0) return null;
  for (let i = 1; i < pts.length; i++) if (pts[i].hours < pts[i - 1].hours) return [...pts].sort((a, b) => a.hours - b.hours);
  return pts;
}
function sortedC(pts: readonly CPoint[] | null | undefined): readonly CPoint[] | null {
  if (!pts || pts.length === 0) return null;
  for (let i = 1; i < pts.length; i++) if (pts[i].cycles < pts[i - 1].cycles) return [...pts].sort((a, b) => a.cycles - b.cycles);
  return pts;
}

/** Weight of x between x0 < x ≤ x1: linear in log10 when x0 > 0, else linear (log undefined at 0). */
function logWeight(x: number, x0: number, x1: number): number {
  if (x0 > 0) {
    // differences of logs (the log of a ratio overflows for a subnormal x0); fall back to linear
    // where x0 and x1 are so close that their logs coincide
    const d = Math.log(x1) - Math.log(x0);
    if (d > 0) return (Math.log(x) - Math.log(x0)) / d;
  }
  return (x - x0) / (x1 - x0);
}

/** Temperature factor at t over sorted points, linear in °C, clamped to the end values. */
export function temperatureFactorAt(pts: readonly TPoint[], t: number): number {
  const n = pts.length;
  if (t <= pts[0].temperature) return pts[0].factor;
  if (t >= pts[n - 1].temperature) return pts[n - 1].factor;
  let i = 1;
  while (pts[i].temperature < t) i++;
  const a = pts[i - 1];
  const b = pts[i];
  const w = (t - a.temperature) / (b.temperature - a.temperature);
  return a.factor + (b.factor - a.factor) * (w < 1 ? w : 1);
}

/** Sustained-load factor at h hours over sorted points, linear in log10(hours), clamped. */
export function sustainedFactorAt(pts: readonly HPoint[], h: number): number {
  const n = pts.length;
  if (h <= pts[0].hours) return pts[0].factor;
  if (h >= pts[n - 1].hours) return pts[n - 1].factor;
  let i = 1;
  while (pts[i].hours < h) i++;
  const a = pts[i - 1];
  const b = pts[i];
  const w = logWeight(h, a.hours, b.hours);
  return a.factor + (b.factor - a.factor) * (w < 1 ? w : 1);
}

/** Cyclic factor at c cycles over sorted points, linear in log10(cycles), clamped. */
export function cyclicFactorAt(pts: readonly CPoint[], c: number): number {
  const n = pts.length;
  if (c <= pts[0].cycles) return pts[0].factor;
  if (c >= pts[n - 1].cycles) return pts[n - 1].factor;
  let i = 1;
  while (pts[i].cycles < c) i++;
  const a = pts[i - 1];
  const b = pts[i];
  const w = logWeight(c, a.cycles, b.cycles);
  return a.factor + (b.factor - a.factor) * (w < 1 ? w : 1);
}

let worstAt = 0;

/**
 * The lowest factor of a sorted temperature curve over the closed range [tMin, tMax]. The curve
 * is piecewise linear, so its minimum over the range lies at a range end or at a data point
 * inside it; only those are evaluated. The temperature where it occurs is left in `worstAt`.
 */
function worstOverRange(pts: readonly TPoint[], tMin: number, tMax: number): number {
  let factor = temperatureFactorAt(pts, tMin);
  let at = tMin;
  for (let i = 0; i < pts.length; i++) {
    const x = pts[i].temperature;
    if (x > tMin && x < tMax && pts[i].factor < factor) {
      factor = pts[i].factor;
      at = x;
    }
  }
  const fMax = temperatureFactorAt(pts, tMax);
  if (fMax < factor) {
    factor = fMax;
    at = tMax;
  }
  worstAt = at;
  return factor;
}

/** Worst temperature factor over a range, with where it occurs (1 when there are no data). */
export function worstTemperatureFactor(points: readonly TPoint[], tMin: number, tMax: number): { factor: number; at: number } {
  const pts = sortedT(points);
  if (!pts) return { factor: 1, at: tMin };
  const factor = worstOverRange(pts, tMin, tMax);
  return { factor, at: worstAt };
}

/** Sustained-load factor of a point list (any order) at `hours`; 1 when there are no data. */
export function sustainedLoadFactor(points: readonly HPoint[], hours: number): number {
  const pts = sortedH(points);
  return pts ? sustainedFactorAt(pts, hours) : 1;
}

/** Cyclic factor of a point list (any order) at `cycles`; 1 when there are no data. */
export function cyclicFactor(points: readonly CPoint[], cycles: number): number {
  const pts = sortedC(points);
  return pts ? cyclicFactorAt(pts, cycles) : 1;
}

/** Basis of a shear allowable. */
export type ShearBasis = 'yield' | 'von-mises' | 'strength';

/** Ductile metals: allowables on yield; shear yield = yield/√3 (von Mises) when not given. */
export function isMetal(family: Family | undefined): boolean {
  return family === 'titanium-alloy' || family === 'steel' || family === 'aluminium-alloy';
}

const INV_SQRT3 = 1 / Math.sqrt(3);

/** Polymer-like families: strength and stiffness depend strongly on load duration and temperature. */
export function isPolymer(family: Family | undefined): boolean {
  return family === 'acrylic' || family === 'polycarbonate' || family === 'fibre-composite' || family === 'syntactic-foam';
}

/** Brittle families that lose strength under sustained load in water (static fatigue). */
export function isBrittle(family: Family | undefined): boolean {
  return family === 'glass' || family === 'glass-ceramic' || family === 'sapphire-alumina';
}

function familyWord(family: Family | undefined): string {
  switch (family) {
    case 'acrylic':
      return 'Acrylic';
    case 'polycarbonate':
      return 'Polycarbonate';
    case 'fibre-composite':
      return 'Fibre composite';
    case 'syntactic-foam':
      return 'Syntactic foam';
    default:
      return 'This material';
  }
}

// Warnings that depend only on the load case and the material's family are the same for every
// candidate of an evaluation: build each once per load case (the Conditions object) and reuse it.
type MessageKind = 'noTemperature' | 'familyTemperature' | 'noSustained' | 'noCyclic';
const MESSAGES = new WeakMap<Conditions, Record<MessageKind, Map<string | undefined, string>>>();
function once(c: Conditions, kind: MessageKind, variant: string | undefined, build: () => string): string {
  let byKind = MESSAGES.get(c);
  if (!byKind) MESSAGES.set(c, (byKind = { noTemperature: new Map(), familyTemperature: new Map(), noSustained: new Map(), noCyclic: new Map() }));
  const byVariant = byKind[kind];
  let text = byVariant.get(variant);
  if (text === undefined) byVariant.set(variant, (text = build()));
  return text;
}

/**
 * Allowables of `m` under `c`. Warnings about data coverage are appended to `warnings`.
 */
export function computeAllowables(m: CandidateMaterial, c: Conditions, warnings: string[]): Allowables {
  const polymer = isPolymer(m.family);
  const brittle = isBrittle(m.family);
  const tMin = c.temperature.min;
  const tMax = c.temperature.max;

  // Temperature: the set's own curve, else the family's default curve, else none
  let temperature = 1;
  let worstTemperature = tMin;
  let temperatureSource: AppliedFactors['temperatureSource'] = 'none';
  const own = sortedT(m.temperatureFactors);
  const familyCurve = own || m.family === undefined ? undefined : FAMILY_TEMPERATURE_FACTORS[m.family];
  const tPts = own ?? (familyCurve ? familyCurve.points : null);
  if (tPts) {
    temperature = worstOverRange(tPts, tMin, tMax);
    worstTemperature = worstAt;
    temperatureSource = own ? 'set' : 'family';
    if (familyCurve) warnings.push(once(c, 'familyTemperature', m.family, () => familyCurve.warning));
    const lo = tPts[0].temperature;
    const hi = tPts[tPts.length - 1].temperature;
    if (tMin < lo || tMax > hi) {
      warnings.push(
        `Temperature-factor data cover ${fmt(lo)} to ${fmt(hi)} °C but the design range is ${fmt(tMin)} to ${fmt(tMax)} °C: ` +
          'the end value of the data was used beyond it (clamped, not extrapolated).',
      );
    }
  } else if (polymer || m.family === undefined) {
    warnings.push(
      once(c, 'noTemperature', m.family, () =>
        `No temperature-dependence data: strengths are taken at the reference condition over ${fmt(tMin)} to ${fmt(tMax)} °C. ` +
          `${familyWord(m.family)} may be markedly weaker when warm.`,
      ),
    );
  }
  const st = m.serviceTemperature;
  if (st && (tMin < st.min || tMax > st.max)) {
    warnings.push(
      `The design temperature range ${fmt(tMin)} to ${fmt(tMax)} °C is outside this property set's service range ` +
        `${fmt(st.min)} to ${fmt(st.max)} °C.`,
    );
  }

  // Sustained load
  let sustainedLoad = 1;
  const hPts = sortedH(m.sustainedLoadFactors);
  if (hPts) {
    sustainedLoad = sustainedFactorAt(hPts, c.sustainedHours);
    const last = hPts[hPts.length - 1].hours;
    if (c.sustainedHours > last) {
      warnings.push(
        `Sustained-load data end at ${fmt(last)} h; the factor there (${fmt(sustainedLoad)}) was used for ${fmt(c.sustainedHours)} h ` +
          'without extrapolation, which may overstate the long-term strength.',
      );
    }
  } else if (c.sustainedHours > 0) {
    if (polymer) {
      warnings.push(
        once(c, 'noSustained', m.family, () =>
          `No sustained-load (creep) data in this property set: strength is NOT reduced for ${fmt(c.sustainedHours)} h of sustained load. ` +
            `${familyWord(m.family)} loses strength and stiffness under sustained load; obtain creep-rupture data before relying on this result.`,
        ),
      );
    } else if (brittle) {
      warnings.push(
        once(c, 'noSustained', 'brittle', () =>
          `No sustained-load data in this property set: strength is not reduced for ${fmt(c.sustainedHours)} h of sustained load, ` +
            'although glass and ceramics lose strength under sustained stress in water (static fatigue).',
        ),
      );
    } else {
      warnings.push(
        once(c, 'noSustained', 'other', () => `No sustained-load data in this property set: strength is not reduced for ${fmt(c.sustainedHours)} h of sustained load (factor 1.0 assumed).`),
      );
    }
  }

  // Cycles
  let cyclic = 1;
  const cPts = sortedC(m.cyclicFactors);
  if (cPts) {
    cyclic = cyclicFactorAt(cPts, c.cycles);
    const last = cPts[cPts.length - 1].cycles;
    if (c.cycles > last) {
      warnings.push(
        `Cyclic data end at ${fmt(last)} cycles; the factor there (${fmt(cyclic)}) was used for ${fmt(c.cycles)} cycles ` +
          'without extrapolation, which may overstate the fatigue strength.',
      );
    }
  } else if (c.cycles > 1) {
    warnings.push(
      once(c, 'noCyclic', polymer ? m.family : undefined, () =>
        `No cyclic (fatigue) data in this property set: strength is not reduced for ${fmt(c.cycles)} pressure cycles (factor 1.0 assumed).` +
          (polymer ? ` ${familyWord(m.family)} windows and parts can crack under repeated pressurisation.` : ''),
      ),
    );
  }

  // One life factor: the governing (lower) of the two, never their product.
  const life = sustainedLoad < cyclic ? sustainedLoad : cyclic;
  const lifeBasis: LifeBasis = life >= 1 ? 'none' : sustainedLoad <= cyclic ? 'sustained-load' : 'cyclic';
  const tensionOnYield = m.tensileYield != null;
  const compressionOnYield = m.compressiveYield != null;
  const tension = (tensionOnYield ? (m.tensileYield as number) : m.tensileStrength) * temperature;
  const compression = (compressionOnYield ? (m.compressiveYield as number) : m.compressiveStrength) * temperature;
  // Shear on the same basis as tension and compression: the set's shear yield, else for a metal
  // its yield/√3 (von Mises), else the shear ultimate (brittle and polymer windows fail in shear at it).
  const metalYield = isMetal(m.family) ? (m.tensileYield ?? m.compressiveYield ?? null) : null;
  const shearBasis: ShearBasis = m.shearYield != null ? 'yield' : metalYield !== null ? 'von-mises' : 'strength';
  const shearBase = shearBasis === 'yield' ? (m.shearYield as number) : shearBasis === 'von-mises' ? (metalYield as number) * INV_SQRT3 : m.shearStrength;
  const shear = shearBase * temperature;
  return {
    tension: tension * life,
    compression: compression * life,
    shear: shear * life,
    tensionOnYield,
    compressionOnYield,
    shearBasis,
    shortTerm: { tension, compression, shear },
    factors: { temperature, worstTemperature, temperatureSource, sustainedLoad, cyclic, life, lifeBasis },
  };
}

/**
 * computeAllowables, remembered per candidate for the last service conditions it was evaluated
 * under: the allowables depend only on the material and on the temperature range, hours and
 * cycles, not on the geometry or the pressure, so an engineer varying thickness, depth or diameter
 * (or several evaluations of one catalogue) does not recompute them. The candidate objects of the
 * published catalogue live as long as its snapshot; inline candidates are collected with their request.
 */
const REMEMBERED = new WeakMap<CandidateMaterial, { min: number; max: number; hours: number; cycles: number; allowables: Allowables; warnings: string[] }>();

/** `warnings` null: the caller needs the numbers only (the ranking pass). */
export function allowablesFor(m: CandidateMaterial, c: Conditions, warnings: string[] | null): Allowables {
  // Compared number by number: no key is built per candidate (this runs for every candidate of every evaluation).
  const hit = REMEMBERED.get(m);
  if (hit && hit.min === c.temperature.min && hit.max === c.temperature.max && hit.hours === c.sustainedHours && hit.cycles === c.cycles) {
    if (warnings) for (let i = 0; i < hit.warnings.length; i++) warnings.push(hit.warnings[i]);
    return hit.allowables;
  }
  const own: string[] = [];
  const allowables = computeAllowables(m, c, own);
  REMEMBERED.set(m, { min: c.temperature.min, max: c.temperature.max, hours: c.sustainedHours, cycles: c.cycles, allowables, warnings: own });
  if (warnings) for (let i = 0; i < own.length; i++) warnings.push(own[i]);
  return allowables;
}

import type { InputStatus } from '../schemas/provenance';
import type { AppliedFactors, CandidateResult, EvaluateResult, ModeResult, RatingResult, SizedBy, WindowCoverage } from './types';

/**
 * The lean form of an evaluation answer, as `POST /api/evaluate` sends it unless asked for the
 * full form (decision 024). The same model texts, warnings, rating-table notes, factor sets and
 * input statuses recur for most candidates: each is sent once, in a dictionary, and referred to by
 * its index. Candidates and their modes are rows whose columns are named once (`columns`). Numbers
 * that are not whole are sent to 6 significant digits — rounding is relative, so a margin keeps
 * its sign; the screen shows at most 4; the design record is built on the server from its own
 * full-precision evaluation and keeps the full texts. `unpackEvaluation(packEvaluation(r))` equals
 * `r` but for that rounding.
 */
export const LEAN_FORMAT = 'isobath-lean-1';
export const LEAN_DIGITS = 6;

export const LEAN_MODE_COLUMNS = [
  'mode',
  'stress',
  'allowable',
  'safetyFactor',
  'margin',
  'requiredThickness',
  'model (text)',
  'proof.stress',
  'proof.allowable',
  'proof.safetyFactor',
  'check',
  'collapse [elastic, yield, collapse]',
] as const;

export const LEAN_CANDIDATE_COLUMNS = [
  'name',
  'propertySetId',
  'family',
  'governingMode',
  'safetyFactor',
  'margin',
  'requiredThickness',
  'sizedBy (object)',
  'proofSafetyFactor',
  'massPerArea',
  'weightToDisplacement',
  'targetSafetyFactor',
  'factors (object)',
  'modes (rows)',
  'warnings (texts)',
  'inputs (object)',
  'coverage',
  'deflection',
  'rating (source, interpolation and outside as texts)',
] as const;

type Ref = number;
export type LeanMode = [ModeResult['mode'], number, number, number, number, number | null, Ref, number, number, number, (string | null)?, ([number, number, number] | null)?];
type LeanRating = Omit<RatingResult, 'source' | 'interpolation' | 'outside'> & { source: Ref; interpolation: Ref; outside?: Ref };
export type LeanCandidate = [
  string,
  number | null,
  string | null,
  ModeResult['mode'],
  number,
  number,
  number | null,
  Ref | null,
  number,
  number | null,
  number | null,
  number,
  Ref,
  LeanMode[],
  Ref[],
  (Ref | null)?,
  (WindowCoverage | null)?,
  (number | null)?,
  (LeanRating | null)?,
];

export interface LeanEvaluation extends Omit<EvaluateResult, 'results'> {
  format: typeof LEAN_FORMAT;
  columns: { candidate: typeof LEAN_CANDIDATE_COLUMNS; mode: typeof LEAN_MODE_COLUMNS };
  /** Texts referred to by index: models, warnings, rating-table sources and notes. */
  texts: string[];
  /** Objects referred to by index: factor sets, input statuses and what sizes a candidate. */
  objects: (AppliedFactors | InputStatus | SizedBy)[];
  results: LeanCandidate[];
}

/** Powers of ten that are exact doubles (10^0 … 10^22). */
const POW10 = Array.from({ length: 23 }, (_, i) => 10 ** i);

/**
 * `v` to `digits` significant digits, by arithmetic (no string round trip: this runs for every
 * number of every answer). Dividing or multiplying a whole number by an exact power of ten is
 * correctly rounded, so the result prints as the short decimal.
 */
function roundNumber(v: number, digits: number): number {
  if (Number.isInteger(v) || !Number.isFinite(v)) return v;
  const e = digits - 1 - Math.floor(Math.log10(Math.abs(v)));
  if (e >= 0) return e < POW10.length ? Math.round(v * POW10[e]) / POW10[e] : Number(v.toPrecision(digits));
  return -e < POW10.length ? Math.round(v / POW10[-e]) * POW10[-e] : v;
}

/** Rounds what is not a whole number to `digits` significant digits, deep; ids and counts stay exact. */
function rounded<T>(value: T, digits: number): T {
  if (typeof value === 'number') return roundNumber(value, digits) as T;
  if (Array.isArray(value)) return value.map((v) => rounded(v, digits)) as T;
  if (value && typeof value === 'object') {
    const out: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(value)) out[k] = rounded(v, digits);
    return out as T;
  }
  return value;
}

/**
 * The rounded copy and dictionary key of an object the engine shares between answers (a
 * candidate's factors come from its remembered allowables, its input statuses from the catalogue
 * snapshot; neither is changed once made), so repeated answers do not round and serialize them again.
 */
const PACKED = new WeakMap<object, { digits: number; value: object; key: string }>();

function packedObject<T extends object>(o: T, digits: number): { value: T; key: string } {
  const hit = PACKED.get(o);
  if (hit && hit.digits === digits) return hit as unknown as { value: T; key: string };
  const value = rounded(o, digits);
  const entry = { digits, value, key: JSON.stringify(value) };
  PACKED.set(o, entry);
  return entry as { value: T; key: string };
}

class Dictionary<T> {
  readonly items: T[] = [];
  private readonly index = new Map<string, number>();
  constructor(private readonly keyOf: (item: T) => string) {}
  ref(item: T, key: string = this.keyOf(item)): number {
    let i = this.index.get(key);
    if (i === undefined) {
      i = this.items.length;
      this.items.push(item);
      this.index.set(key, i);
    }
    return i;
  }
}

/** Drops trailing nulls (optional columns left empty). */
function trimmed<T extends unknown[]>(row: T): T {
  let end = row.length;
  while (end > 0 && row[end - 1] === null) end--;
  return row.slice(0, end) as T;
}

export function packEvaluation(result: EvaluateResult, digits = LEAN_DIGITS): LeanEvaluation {
  const r = <T>(v: T) => rounded(v, digits);
  const texts = new Dictionary<string>((t) => t);
  const objects = new Dictionary<AppliedFactors | InputStatus | SizedBy>((o) => JSON.stringify(o));
  const modeRow = (m: ModeResult): LeanMode =>
    trimmed<LeanMode>([
      m.mode,
      r(m.stress),
      r(m.allowable),
      r(m.safetyFactor),
      r(m.margin),
      r(m.requiredThickness),
      texts.ref(m.model),
      r(m.proof.stress),
      r(m.proof.allowable),
      r(m.proof.safetyFactor),
      m.check ?? null,
      m.collapse ? [r(m.collapse.elastic), r(m.collapse.yield), r(m.collapse.collapse)] : null,
    ]);
  const ratingOf = (rating: RatingResult): LeanRating => {
    const { source, interpolation, outside, ...numbers } = rating;
    return { ...r(numbers), source: texts.ref(source), interpolation: texts.ref(interpolation), ...(outside !== undefined ? { outside: texts.ref(outside) } : {}) };
  };
  const shared = (o: AppliedFactors | InputStatus) => {
    const p = packedObject(o, digits);
    return objects.ref(p.value, p.key);
  };
  const results = result.results.map((c) =>
    trimmed<LeanCandidate>([
      c.name,
      c.propertySetId ?? null,
      c.family ?? null,
      c.governingMode,
      r(c.safetyFactor),
      r(c.margin),
      r(c.requiredThickness),
      c.sizedBy ? objects.ref(c.sizedBy) : null,
      r(c.proofSafetyFactor),
      r(c.massPerArea),
      r(c.weightToDisplacement),
      r(c.targetSafetyFactor),
      shared(c.factors),
      c.modes.map(modeRow),
      c.warnings.map((w) => texts.ref(w)),
      c.inputs ? shared(c.inputs) : null,
      c.coverage ?? null,
      c.deflection === undefined ? null : r(c.deflection),
      c.rating ? ratingOf(c.rating) : null,
    ]),
  );
  return {
    format: LEAN_FORMAT,
    columns: { candidate: LEAN_CANDIDATE_COLUMNS, mode: LEAN_MODE_COLUMNS },
    pressure: r(result.pressure),
    proofTestPressure: r(result.proofTestPressure),
    pressureMethod: result.pressureMethod,
    total: result.total,
    texts: texts.items,
    objects: objects.items,
    results,
  };
}

export function unpackEvaluation(lean: LeanEvaluation): EvaluateResult {
  const text = (i: Ref) => lean.texts[i];
  const modeOf = ([mode, stress, allowable, safetyFactor, margin, requiredThickness, model, ps, pa, psf, check, collapse]: LeanMode): ModeResult => ({
    mode,
    stress,
    allowable,
    safetyFactor,
    margin,
    requiredThickness,
    model: text(model),
    proof: { stress: ps, allowable: pa, safetyFactor: psf },
    ...(check !== undefined && check !== null ? { check } : {}),
    ...(collapse ? { collapse: { elastic: collapse[0], yield: collapse[1], collapse: collapse[2] } } : {}),
  });
  const results = lean.results.map((row): CandidateResult => {
    const [name, propertySetId, family, governingMode, safetyFactor, margin, requiredThickness, sizedBy, proofSafetyFactor, massPerArea, weightToDisplacement, targetSafetyFactor, factors, modes, warnings, inputs, coverage, deflection, rating] = row;
    const c: CandidateResult = {
      name,
      ...(propertySetId !== null ? { propertySetId } : {}),
      ...(family !== null ? { family: family as CandidateResult['family'] } : {}),
      governingMode,
      safetyFactor,
      margin,
      requiredThickness,
      sizedBy: sizedBy === null ? null : (lean.objects[sizedBy] as SizedBy),
      proofSafetyFactor,
      massPerArea,
      weightToDisplacement,
      targetSafetyFactor,
      factors: lean.objects[factors] as AppliedFactors,
      modes: modes.map(modeOf),
      warnings: warnings.map(text),
    };
    if (inputs !== undefined && inputs !== null) c.inputs = lean.objects[inputs] as InputStatus;
    if (coverage !== undefined && coverage !== null) c.coverage = coverage;
    if (deflection !== undefined && deflection !== null) c.deflection = deflection;
    if (rating) {
      const { source, interpolation, outside, ...numbers } = rating;
      c.rating = { ...numbers, source: text(source), interpolation: text(interpolation), ...(outside !== undefined ? { outside: text(outside) } : {}) };
    }
    return c;
  });
  return { pressure: lean.pressure, proofTestPressure: lean.proofTestPressure, pressureMethod: lean.pressureMethod, total: lean.total, results };
}

/** The same rounding the lean form applies, for comparing a full answer with an unpacked one. */
export const roundedLikeLean = (result: EvaluateResult, digits = LEAN_DIGITS): EvaluateResult => rounded(result, digits);

/**
 * Request schemas of the calculation: the load case and `POST /api/evaluate` (see PRODUCT.md).
 * All values SI: Pa, m, °C, hours. Objects are strict (unknown fields are refused) and every
 * number must be finite. Messages are whole sentences naming the field, for `{ error: { fields } }`.
 * The parts live beside this file by job: fields.ts (the builders), components.ts, load-case.ts
 * and candidates.ts; this file is the request and exports them all.
 */
import { z } from 'zod';
import { familySchema } from './catalogue';
import { num, strict } from './fields';
import { loadCaseSchema, MAX_DEPTH_M, waterSchema } from './load-case';
import { candidateInputSchema } from './candidates';
import type { EvaluateResult } from '../engine/types';
import type { LeanEvaluation } from '../engine/lean';

export * from './components';
export * from './load-case';
export * from './candidates';

// ---------------------------------------------------------------------------------------------
// Request
// ---------------------------------------------------------------------------------------------

export const SORT_KEYS = ['margin', 'requiredThickness', 'massPerArea', 'weightToDisplacement'] as const;
export const sortBySchema = z.enum(SORT_KEYS, {
  error: `Sort must be one of ${SORT_KEYS.map((k) => `"${k}"`).join(', ')}.`,
});
export const MAX_CANDIDATES = 5000;
export const DEFAULT_LIMIT = 100;
/**
 * Results the Evaluate page asks for first, more on demand: building, packing and sending 100
 * full results cost most of an uncached evaluation, and the page shows the first ones.
 */
export const FIRST_PAGE_RESULTS = 25;

/** Narrows the published catalogue when no candidates are given. */
export const evaluateFiltersSchema = strict('Filters', {
  family: familySchema.optional(),
  transparent: z.boolean({ error: 'Transparent must be true or false.' }).optional(),
  /** Only property sets whose service temperature range covers the load case's design range. */
  coversTemperature: z.boolean({ error: 'Covers temperature must be true or false.' }).optional(),
  /** Only property sets all of whose inputs to the calculation are confirmed against their source. */
  confirmedOnly: z.boolean({ error: 'Confirmed inputs only must be true or false.' }).optional(),
  /** Leave out property sets with demo data (the invented Harrow Sound records). */
  excludeDemo: z.boolean({ error: 'Exclude demo data must be true or false.' }).optional(),
});

export const evaluateRequestSchema = strict('Request', {
  loadCase: loadCaseSchema,
  /** Omit to evaluate the published catalogue (narrowed by `filters`). */
  candidates: z
    .array(candidateInputSchema, { error: 'Candidates must be a list.' })
    .min(1, { error: 'Candidates, when given, must list at least one candidate; omit the field to evaluate the published catalogue.' })
    .max(MAX_CANDIDATES, { error: `At most ${MAX_CANDIDATES} candidates can be evaluated at once.` })
    .optional(),
  limit: num('Limit', { min: 1, max: MAX_CANDIDATES, int: true }).default(DEFAULT_LIMIT),
  sortBy: sortBySchema.default('margin'),
  /**
   * For a window under human occupancy: rank the candidates a window rule covers above those it
   * does not (default). False ranks them all together, still with their warnings.
   */
  coveredFirst: z.boolean({ error: 'Covered first must be true or false.' }).default(true),
  filters: evaluateFiltersSchema.optional(),
  /**
   * 'lean' (default): texts and repeated objects sent once and referred to by index, candidates
   * and modes as rows (shared/engine/lean.ts, unpackEvaluation). 'full': every candidate with its
   * texts, as the engine returns it — for scripts.
   */
  form: z.enum(['lean', 'full'], { error: 'Form must be lean or full.' }).default('lean'),
});
export type EvaluateRequest = z.output<typeof evaluateRequestSchema>;
export type EvaluateRequestInput = z.input<typeof evaluateRequestSchema>;

/** Why a published property set was left out of a catalogue evaluation (which filter). */
export type ExclusionReason = 'family' | 'transparency' | 'service-range' | 'unconfirmed' | 'demo';

/** The sets one filter left out: how many, and the first names (at most EXCLUDED_NAMES_SHOWN). */
export interface ExclusionDto {
  reason: ExclusionReason;
  count: number;
  names: string[];
}
export const EXCLUDED_NAMES_SHOWN = 50;

/**
 * The answer of POST /api/evaluate: the engine's ranking, and for a catalogue evaluation (no
 * candidates named) what the filters left out, by reason.
 */
export interface EvaluateAnswerDto extends EvaluateResult {
  excluded: ExclusionDto[];
}

/** The same answer in the lean form (the default): texts once, candidates as rows; `excluded` as is. */
export interface LeanEvaluateAnswerDto extends LeanEvaluation {
  excluded: ExclusionDto[];
}

// ---------------------------------------------------------------------------------------------
// GET /api/pressure query (strings from the URL)
// ---------------------------------------------------------------------------------------------

const queryNumber = (label: string, min: number, max: number, unit: string) =>
  z
    .string({ error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be a number.`) })
    .trim()
    .min(1, { error: `${label} is required.` })
    .transform(Number)
    .pipe(num(label, { min, max, unit }));

/** Query of `GET /api/pressure?depth=&latitude=&water=`; depth may be 0 here (the surface). */
export const pressureQuerySchema = strict('Query', {
  depth: queryNumber('Depth', 0, MAX_DEPTH_M, 'm'),
  latitude: queryNumber('Latitude', -90, 90, '°'),
  water: waterSchema,
});
export type PressureQuery = z.output<typeof pressureQuerySchema>;

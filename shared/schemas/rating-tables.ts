/**
 * Rating tables: the trade's empirical window data for one geometry and material grade, cited
 * and curated like property sets (draft → in review → published → retired, versions, four-eyes).
 * All values SI: pressures in Pa, temperatures in °C, thickness ratios dimensionless (t/Di for
 * flat discs and conical frustums, t/Ri for spherical sectors).
 *
 * The schema refuses tables the engine could not read conservatively: rows and columns must
 * ascend, and the requirement may never fall as pressure or temperature rises (so using the first
 * row or column below the table is on the safe side).
 */
import { z } from 'zod';
import { oneLineText } from './text';
import type { ReviewTrailDto } from './catalogue';

const finite = (label: string) =>
  z.number({ error: (iss) => (iss.input === undefined ? `${label} is required.` : `${label} must be a number.`) }).refine(Number.isFinite, `${label} must be a finite number.`);
const positive = (label: string) => finite(label).refine((v) => v > 0, `${label} must be greater than zero.`);

export const RATING_GEOMETRIES = ['flat-disc', 'conical-frustum', 'spherical-sector'] as const;
export const ratingGeometrySchema = z.enum(RATING_GEOMETRIES, { error: 'Geometry must be "flat-disc", "conical-frustum" or "spherical-sector".' });
export type RatingGeometryValue = z.infer<typeof ratingGeometrySchema>;

export const RATING_GEOMETRY_LABELS: Record<RatingGeometryValue, string> = {
  'flat-disc': 'Flat disc',
  'conical-frustum': 'Conical frustum',
  'spherical-sector': 'Spherical sector',
};

/** The thickness ratio a geometry's table is written in. */
export const RATIO_LABEL: Record<RatingGeometryValue, 't/Di' | 't/Ri'> = {
  'flat-disc': 't/Di',
  'conical-frustum': 't/Di',
  'spherical-sector': 't/Ri',
};

function strictlyAscending(xs: readonly number[]): boolean {
  for (let i = 1; i < xs.length; i++) if (!(xs[i] > xs[i - 1])) return false;
  return true;
}

const MAX_ROWS = 200;
const MAX_COLUMNS = 20;

export const minimumRatioDataSchema = z
  .strictObject({
    form: z.literal('minimum-ratio'),
    pressures: z.array(positive('Design pressure')).min(1, 'Give at least one design pressure row.').max(MAX_ROWS),
    temperatures: z.array(finite('Design temperature').refine((t) => t >= -60 && t <= 200, 'Design temperature must be between -60 and 200 °C.')).min(1, 'Give at least one temperature column.').max(MAX_COLUMNS),
    ratios: z.array(z.array(positive('Thickness ratio').refine((r) => r <= 20, 'Thickness ratio must be at most 20.').nullable()).max(MAX_COLUMNS)).max(MAX_ROWS),
  })
  .superRefine((d, ctx) => {
    if (!strictlyAscending(d.pressures)) ctx.addIssue({ code: 'custom', path: ['pressures'], message: 'Design pressures must rise from row to row.' });
    if (!strictlyAscending(d.temperatures)) ctx.addIssue({ code: 'custom', path: ['temperatures'], message: 'Design temperatures must rise from column to column.' });
    if (d.ratios.length !== d.pressures.length) {
      ctx.addIssue({ code: 'custom', path: ['ratios'], message: `Give one row of ratios per design pressure (${d.pressures.length}).` });
      return;
    }
    d.ratios.forEach((row, i) => {
      if (row.length !== d.temperatures.length) ctx.addIssue({ code: 'custom', path: ['ratios', i], message: `Row ${i + 1} must have one value per temperature column (${d.temperatures.length}).` });
    });
    if (d.ratios[0]?.[0] == null) ctx.addIssue({ code: 'custom', path: ['ratios', 0, 0], message: 'The first row must give a value in the first column.' });
    for (let j = 0; j < d.temperatures.length; j++) {
      let ended = false;
      let last = -Infinity;
      for (let i = 0; i < d.ratios.length; i++) {
        const v = d.ratios[i]?.[j];
        if (v == null) {
          ended = true;
          continue;
        }
        if (ended) ctx.addIssue({ code: 'custom', path: ['ratios', i, j], message: 'A column may only end with empty cells, not have gaps.' });
        else if (v < last) ctx.addIssue({ code: 'custom', path: ['ratios', i, j], message: 'The thickness ratio may not fall as the design pressure rises.' });
        last = v;
      }
    }
    d.ratios.forEach((row, i) => {
      for (let j = 1; j < row.length; j++) {
        const a = row[j - 1];
        const b = row[j];
        if (a != null && b != null && b < a) ctx.addIssue({ code: 'custom', path: ['ratios', i, j], message: 'The thickness ratio may not fall as the design temperature rises.' });
      }
    });
  });

export const criticalPressureDataSchema = z
  .strictObject({
    form: z.literal('critical-pressure'),
    ratios: z.array(positive('Thickness ratio')).min(2, 'Give at least two points of the critical-pressure curve.').max(MAX_ROWS),
    criticalPressures: z.array(positive('Short-term critical pressure')).min(2).max(MAX_ROWS),
    conversionFactors: z
      .array(z.strictObject({ temperature: finite('Temperature'), factor: finite('Conversion factor').refine((f) => f >= 1 && f <= 100, 'Conversion factor must be between 1 and 100.') }))
      .min(1, 'Give at least one conversion factor.')
      .max(MAX_COLUMNS),
  })
  .superRefine((d, ctx) => {
    if (!strictlyAscending(d.ratios)) ctx.addIssue({ code: 'custom', path: ['ratios'], message: 'Thickness ratios must rise from row to row.' });
    if (d.criticalPressures.length !== d.ratios.length) ctx.addIssue({ code: 'custom', path: ['criticalPressures'], message: 'Give one critical pressure per thickness ratio.' });
    else if (!strictlyAscending(d.criticalPressures)) ctx.addIssue({ code: 'custom', path: ['criticalPressures'], message: 'The critical pressure must rise with the thickness ratio.' });
    const temps = d.conversionFactors.map((c) => c.temperature);
    if (!strictlyAscending(temps)) ctx.addIssue({ code: 'custom', path: ['conversionFactors'], message: 'Conversion-factor temperatures must rise.' });
    for (let i = 1; i < d.conversionFactors.length; i++) {
      if (d.conversionFactors[i].factor < d.conversionFactors[i - 1].factor) {
        ctx.addIssue({ code: 'custom', path: ['conversionFactors', i, 'factor'], message: 'The conversion factor may not fall as the temperature rises.' });
      }
    }
  });

export const ratingTableDataSchema = z.discriminatedUnion('form', [minimumRatioDataSchema, criticalPressureDataSchema], {
  error: 'Form must be "minimum-ratio" or "critical-pressure".',
});
export type RatingTableData = z.infer<typeof ratingTableDataSchema>;

const angleRangeSchema = z
  .strictObject({
    min: finite('Smallest included angle').refine((a) => a >= 30 && a <= 180, 'Included angles run from 30 to 180°.'),
    max: finite('Largest included angle').refine((a) => a >= 30 && a <= 180, 'Included angles run from 30 to 180°.'),
  })
  .refine((r) => r.min <= r.max, { path: ['max'], message: 'The largest included angle must not be below the smallest.' });

const limitsSchema = z.strictObject({
  sustainedHours: positive('Sustained-load hours').nullish(),
  cycles: positive('Pressure cycles').nullish(),
});

/** The content of a rating table, as drafted and exchanged (SI). */
export const ratingTableContentSchema = z
  .strictObject({
    name: oneLineText({ min: 1, max: 300, required: 'Name the table.' }),
    geometry: ratingGeometrySchema,
    /** Cones and spherical sectors only: the included angles the table applies to. */
    includedAngle: angleRangeSchema.nullish(),
    /** The service the table's data support (e.g. the tests' 1,000 h); beyond it the table gives no number. */
    limits: limitsSchema.nullish(),
    /** What the grade is, in words (e.g. "cast acrylic meeting the pressure-window standard's lot minimums"). */
    grade: z.string().trim().min(1, 'Say which material grade the table applies to.').max(400),
    /** How the table was taken from its source, per point [pub] / [memory] / inferred. */
    note: z.string().trim().max(8000).nullish(),
    data: ratingTableDataSchema,
  })
  .superRefine((t, ctx) => {
    const angled = t.geometry !== 'flat-disc';
    if (angled && !t.includedAngle) ctx.addIssue({ code: 'custom', path: ['includedAngle'], message: 'Give the included angles the table applies to.' });
    if (!angled && t.includedAngle) ctx.addIssue({ code: 'custom', path: ['includedAngle'], message: 'A flat-disc table has no included angle.' });
  });
export type RatingTableContent = z.infer<typeof ratingTableContentSchema>;

// ---------------------------------------------------------------------------------------------
// API contract
// ---------------------------------------------------------------------------------------------

const id = z.number({ error: 'Must be a whole number.' }).int().positive().max(2_147_483_647);
const lockVersion = z.number({ error: 'The lock version you read is required.' }).int().min(0).max(2_147_483_647);

/** A rating-table draft: the material it is for, the property-set lineages it covers (none: all), its citation and content. */
export const ratingTableDraftSchema = z.strictObject({
  materialId: id,
  referenceId: id.nullish(),
  coversLineageIds: z.array(id).max(200).default([]),
  content: ratingTableContentSchema,
});
export type RatingTableDraftInput = z.input<typeof ratingTableDraftSchema>;
export type RatingTableDraft = z.output<typeof ratingTableDraftSchema>;

export const ratingTableUpdateSchema = z.strictObject({ lockVersion, draft: ratingTableDraftSchema });

/** One review step; approve/return/retire need catalogue:approve, submit/revise catalogue:draft. */
export const ratingTableStepSchema = z.discriminatedUnion(
  'step',
  [
    z.strictObject({ step: z.literal('submit'), lockVersion }),
    z.strictObject({ step: z.literal('approve'), lockVersion }),
    z.strictObject({ step: z.literal('revise'), lockVersion }),
    z.strictObject({ step: z.literal('return'), lockVersion, comment: z.string().trim().min(3, 'Say what the author must change.').max(4000) }),
    z.strictObject({ step: z.literal('retire'), lockVersion, comment: z.string().trim().min(3, 'Give the reason for retiring this table.').max(2000) }),
  ],
  { error: 'Step must be one of "submit", "approve", "return", "revise", "retire".' },
);
export type RatingTableStepInput = z.infer<typeof ratingTableStepSchema>;

const queryId = z.string().trim().regex(/^\d{1,10}$/, 'must be a whole number').transform(Number);
export const ratingTableQuerySchema = z.strictObject({
  materialId: queryId.optional(),
  status: z.enum(['draft', 'in-review', 'published', 'retired', 'open']).optional(),
});

export const ratingTableCsvQuerySchema = z.strictObject({ form: z.enum(['minimum-ratio', 'critical-pressure']).default('minimum-ratio') });

export interface RatingTableDto extends ReviewTrailDto {
  id: number;
  status: 'draft' | 'in-review' | 'published' | 'retired';
  version: number;
  lineageId: number;
  lockVersion: number;
  material: { id: number; name: string; family: string };
  reference: { id: number; title: string; authors: string | null; year: number | null; identifier: string | null; location: string | null; kind: string } | null;
  /** The property sets (their current version in each covered lineage); empty list = every set of the material. */
  covers: { lineageId: number; propertySetId: number; condition: string }[];
  content: RatingTableContent;
  supersedesId: number | null;
  supersededById: number | null;
  updatedAt: string;
}

export interface RatingTableListDto {
  items: RatingTableDto[];
  total: number;
}

/** POST /api/rating-tables/csv: the grid read from the file, for the editor (nothing is saved). */
export interface RatingTableCsvDto {
  data: RatingTableData;
}

/**
 * Contracts of the library desk: drafting, four-eyes review, versions, references, documents,
 * CSV import, and the admin's audit log and caught mail. All values SI.
 */
import { z } from 'zod';
import {
  familySchema,
  materialInputSchema,
  propertyValuesSchema,
  referenceInputSchema,
  type PropertySetDto,
  type ReferenceDto,
} from './catalogue';
import type { ItemsDto, ListDto } from './responses';

const id = z.number().int().positive().max(2_147_483_647);
/** Optimistic lock: the version the client last read; a stale one gets 409. */
export const lockVersionSchema = z.number().int().min(0).max(2_147_483_647);

/**
 * A draft's content. Either an existing material (materialId) or a new one (material), and
 * either an existing reference (referenceId) or a new one (reference). A draft may lack a
 * reference; it cannot be approved without one.
 */
export const draftInputSchema = propertyValuesSchema
  .extend({
    condition: z.string().trim().min(1, 'Describe the condition (form, temper, grade…)').max(300),
    materialId: id.optional(),
    material: materialInputSchema.strict().optional(),
    referenceId: id.nullish(),
    reference: referenceInputSchema.strict().optional(),
  })
  .strict()
  .refine((d) => (d.materialId === undefined) !== (d.material === undefined), {
    message: 'Choose an existing material or describe a new one (not both)',
    path: ['materialId'],
  })
  .refine((d) => !(d.referenceId && d.reference), {
    message: 'Choose an existing reference or describe a new one (not both)',
    path: ['referenceId'],
  })
  .refine((d) => d.tensileYield == null || d.tensileYield <= d.tensileStrength, {
    message: 'Tensile yield cannot exceed tensile strength',
    path: ['tensileYield'],
  });
export type DraftInput = z.input<typeof draftInputSchema>;
export type DraftData = z.output<typeof draftInputSchema>;

/** PUT /api/property-sets/:id — the whole draft again, with the lock version read. */
export const draftUpdateSchema = z.object({ lockVersion: lockVersionSchema, draft: draftInputSchema }).strict();

/** submit / approve / revise: only the lock version. */
export const transitionSchema = z.object({ lockVersion: lockVersionSchema }).strict();
/** return: a comment for the author is required. */
export const returnSchema = z
  .object({ lockVersion: lockVersionSchema, comment: z.string().trim().min(3, 'Say what the author must change').max(4000) })
  .strict();
/** retire: the reason is kept in the audit log. */
export const retireSchema = z
  .object({ lockVersion: lockVersionSchema, reason: z.string().trim().min(3, 'Give the reason for retiring this set').max(2000) })
  .strict();

export const referenceCreateSchema = referenceInputSchema.strict();
export const referenceUpdateSchema = z.object({ lockVersion: lockVersionSchema, reference: referenceInputSchema.strict() }).strict();
export const materialCreateSchema = materialInputSchema.strict();

export const libraryQueueQuerySchema = z
  .object({
    status: z.enum(['draft', 'in-review']).optional(),
    mine: z.enum(['true', 'false']).optional(),
    /** Page size and start (an import can leave tens of thousands of drafts); `total` counts them all. */
    limit: z.coerce.number().int().min(1).max(1000).default(200),
    offset: z.coerce.number().int().min(0).max(10_000_000).default(0),
  })
  .strict();

/** GET /api/references?q= — words matched against title, authors and identifier. */
export const referenceQuerySchema = z.object({ q: z.string().trim().max(200).optional() }).strict();

/** GET /api/admin/mail — newest first, at most `limit` messages. */
export const caughtMailQuerySchema = z.object({ limit: z.coerce.number().int().min(1).max(500).default(100) }).strict();

export const auditQuerySchema = z
  .object({
    entityType: z.enum(['property-set', 'rating-table', 'reference', 'material', 'import', 'user', 'project', 'shortlist']).optional(),
    entityId: z.string().trim().max(40).optional(),
    limit: z.coerce.number().int().min(1).max(500).default(100),
    before: z.coerce.number().int().positive().optional(),
  })
  .strict();

/** Extra fields a librarian sees on a set (beyond PropertySetDto). */
export interface LibrarySetDto extends PropertySetDto {
  lockVersion: number;
  lineageId: number | null;
  supersedesId: number | null;
  supersededById: number | null;
  returnedComment: string | null;
  lastEditedBy: { id: number; name: string } | null;
  submittedAt: string | null;
}

/** GET /api/library/sets: the desk's queue. */
export type LibrarySetListDto = ListDto<LibrarySetDto>;

export interface ReferenceDetailDto extends ReferenceDto {
  lockVersion: number;
  document: { name: string; size: number; uploadedAt: string } | null;
  /** Number of property sets citing it. */
  usedBy: number;
}

/** GET /api/references. */
export type ReferenceListDto = ListDto<ReferenceDetailDto>;

/** One changed value between a set and the version it supersedes. */
export interface ValueChangeDto {
  field: string;
  before: unknown;
  after: unknown;
}

/** GET /api/library/sets/:id/changes: what differs from the version the set supersedes (none: previous is null). */
export interface SetChangesDto {
  previous: LibrarySetDto | null;
  changes: ValueChangeDto[];
}

/** CSV import: one problem in one cell (row is the 1-based data row, header excluded). */
export interface ImportIssueDto {
  row: number;
  field: string;
  message: string;
}

export interface ImportPreviewDto {
  rows: number;
  valid: number;
  /** At most 500 issues are returned; `issueCount` is the total. */
  issues: ImportIssueDto[];
  issueCount: number;
  /** The first rows as they would be saved (SI), for the preview table. */
  sample: { row: number; material: string; family: string; condition: string; reference: string; tensileStrength: number; compressiveStrength: number; shearStrength: number }[];
  newMaterials: string[];
  newReferences: string[];
}

export interface ImportResultDto {
  created: number;
  ids: number[];
}

export interface AuditEntryDto {
  id: number;
  at: string;
  actor: { id: number; name: string } | null;
  action: string;
  entityType: string;
  entityId: string | null;
  before: unknown;
  after: unknown;
}

export interface CaughtMailDto {
  id: string;
  receivedAt: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
}

/** GET /api/admin/audit: one page, newest first. */
export type AuditPageDto = ItemsDto<AuditEntryDto>;

/** GET /api/admin/mail; enabled = the app knows where the local catcher saves mail. */
export interface CaughtMailListDto extends ItemsDto<CaughtMailDto> {
  enabled: boolean;
}

/** The CSV template's columns: units are part of the header, values convert to SI on import. */
export const IMPORT_COLUMNS = [
  { name: 'material', required: true, help: 'Material name; an existing one is matched case-insensitively, otherwise it is created' },
  { name: 'family', required: true, help: `One of: ${familySchema.options.join(', ')}` },
  { name: 'transparent', required: true, help: 'yes or no' },
  { name: 'condition', required: true, help: 'Form, temper, grade or test state' },
  { name: 'reference_title', required: true, help: 'Title of the source; matched with the identifier, otherwise created' },
  { name: 'reference_kind', required: true, help: 'standard, handbook, paper, test-report or supplier-data-sheet' },
  { name: 'reference_authors', required: false, help: 'Authors or issuing body' },
  { name: 'reference_year', required: false, help: 'Year of publication' },
  { name: 'reference_identifier', required: false, help: 'Standard number, DOI or report number' },
  { name: 'reference_location', required: false, help: 'Table or page' },
  { name: 'basis', required: true, help: 'minimum, typical or statistical-allowable (applies to the strengths)' },
  { name: 'density_kg_m3', required: true, help: 'kg/m³' },
  { name: 'youngs_modulus_gpa', required: true, help: 'GPa' },
  { name: 'poissons_ratio', required: true, help: 'dimensionless' },
  { name: 'tensile_strength_mpa', required: true, help: 'MPa' },
  { name: 'tensile_yield_mpa', required: false, help: 'MPa' },
  { name: 'compressive_strength_mpa', required: true, help: 'MPa' },
  { name: 'compressive_yield_mpa', required: false, help: 'MPa' },
  { name: 'shear_strength_mpa', required: true, help: 'MPa' },
  { name: 'elongation_pct', required: false, help: '% at break' },
  { name: 'luminous_transmittance_pct', required: false, help: '%' },
  { name: 'service_temp_min_c', required: true, help: '°C' },
  { name: 'service_temp_max_c', required: true, help: '°C' },
] as const;

export const IMPORT_MAX_BYTES = 20 * 1024 * 1024;
export const IMPORT_MAX_ROWS = 50_000;
export const DOCUMENT_MAX_BYTES = 20 * 1024 * 1024;

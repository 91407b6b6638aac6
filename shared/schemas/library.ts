/**
 * Contracts of the library desk: drafting, four-eyes review, versions, references, documents,
 * CSV import, and the admin's audit log and caught mail. All values SI.
 */
import { z } from 'zod';
import { oneLineText } from './text';
import {
  materialInputSchema,
  propertyValuesSchema,
  referenceInputSchema,
  type PropertySetDto,
  type ReferenceCitationDto,
  type ReferenceDto,
  type ReviewTrailDto,
} from './catalogue';
import type { ItemsDto, ListDto } from './responses';

const id = z.number().int().positive().max(2_147_483_647);
/** Optimistic lock: the version the client last read; a stale one gets 409. */
export const lockVersionSchema = z.number().int().min(0).max(2_147_483_647);

/**
 * Runs a rule across fields whenever the fields it compares are valid, even when others are not,
 * so one check reports every problem (zod skips object refinements after any other issue).
 */
const whenValid = (fields: z.ZodType) => ({ when: (payload: { value: unknown }) => fields.safeParse(payload.value).success });
const yieldAndStrength = propertyValuesSchema.pick({ tensileStrength: true, tensileYield: true });
const anyObject = z.object({});

/**
 * A draft's content. Either an existing material (materialId) or a new one (material), and
 * either an existing reference (referenceId) or a new one (reference). A draft may lack a
 * reference; it cannot be approved without one.
 */
export const draftInputSchema = propertyValuesSchema
  .extend({
    condition: oneLineText({ min: 1, max: 300, required: 'Describe the condition (form, temper, grade…)' }),
    materialId: id.optional(),
    material: materialInputSchema.strict().optional(),
    referenceId: id.nullish(),
    reference: referenceInputSchema.strict().optional(),
  })
  .strict()
  .refine((d) => (d.materialId === undefined) !== (d.material === undefined), {
    message: 'Choose an existing material or describe a new one (not both)',
    path: ['materialId'],
    ...whenValid(anyObject),
  })
  .refine((d) => !(d.referenceId && d.reference), {
    message: 'Choose an existing reference or describe a new one (not both)',
    path: ['referenceId'],
    ...whenValid(anyObject),
  })
  .refine((d) => d.tensileYield == null || d.tensileYield <= d.tensileStrength, {
    message: 'Tensile yield cannot exceed tensile strength',
    path: ['tensileYield'],
    ...whenValid(yieldAndStrength),
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
/** POST /api/references/:id/versions/:version/steps: submit, approve, or return with a comment. */
export const referenceVersionStepSchema = z.discriminatedUnion(
  'step',
  [
    z.strictObject({ step: z.literal('submit'), lockVersion: lockVersionSchema }),
    z.strictObject({ step: z.literal('approve'), lockVersion: lockVersionSchema }),
    z.strictObject({ step: z.literal('return'), lockVersion: lockVersionSchema, comment: z.string().trim().min(3, 'Say what the author must change.').max(4000) }),
  ],
  { error: 'Step must be one of "submit", "approve", "return".' },
);
export type ReferenceVersionStepInput = z.infer<typeof referenceVersionStepSchema>;
/** GET /api/library/reference-versions: proposed reference changes (draft and in review by default). */
export const referenceVersionQuerySchema = z.strictObject({ status: z.enum(['draft', 'in-review']).optional() });
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
    entityType: z.enum(['property-set', 'rating-table', 'reference', 'reference-version', 'value-confirmation', 'material', 'import', 'user', 'project', 'load-case', 'shortlist']).optional(),
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
  /** The current published version (the content above). */
  version: number;
  lockVersion: number;
  /** The latest document, and which version of the reference's documents it is. */
  document: { name: string; size: number; uploadedAt: string; version: number } | null;
  /** Number of property sets and rating tables citing it. */
  usedBy: number;
  /**
   * Cited by a published or retired set or rating table (and so by any design record): a change
   * is a new version reviewed by a second librarian. False: cited by drafts at most, edited in
   * place, and seen only by librarians and administrators.
   */
  inUse: boolean;
}

export type { ReferenceCitationDto };

/** One version of a reference's citation: published, retired (superseded), or a proposed change. */
export interface ReferenceVersionDto extends ReviewTrailDto {
  id: number;
  referenceId: number;
  version: number;
  status: 'draft' | 'in-review' | 'published' | 'retired';
  citation: ReferenceCitationDto;
  lockVersion: number;
  retiredAt: string | null;
  updatedAt: string;
  /** What it changes against the version it supersedes (field, before, after). */
  changes: ValueChangeDto[];
}

/** One uploaded document of a reference; none is ever deleted. */
export interface ReferenceDocumentDto {
  version: number;
  name: string;
  size: number;
  uploadedAt: string;
  uploadedBy: { id: number; name: string } | null;
}

/** GET /api/references/:id: the reference with its versions and documents. */
export interface ReferencePageDto extends ReferenceDetailDto {
  /** Newest first. A proposed change (draft or in review) only for librarians and administrators. */
  versions: ReferenceVersionDto[];
  /** The open proposed change, if any (librarians and administrators). */
  pending: ReferenceVersionDto | null;
  /** Newest first. */
  documents: ReferenceDocumentDto[];
}

/** GET /api/library/reference-versions: a proposed change with the reference it would change. */
export interface PendingReferenceVersionDto extends ReferenceVersionDto {
  current: ReferenceCitationDto & { version: number };
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

/**
 * CSV import: one problem in one cell. `row` is the 1-based data row (header excluded); `field`
 * is the CSV column's name, or "_" for the whole row (e.g. a wrong number of fields).
 */
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
  sample: {
    row: number;
    material: string;
    family: string;
    condition: string;
    reference: string;
    tensileStrength: number;
    compressiveStrength: number;
    shearStrength: number;
    /** How many of the row's values are confirmed, of how many, and whether any is demo data. */
    status: { confirmed: number; total: number; demo: boolean };
  }[];
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

/** A row of GET /api/admin/outbox: a message Isobath sends, and how it fared (never its body). */
export interface OutboxMailDto {
  id: number;
  to: string[];
  subject: string;
  status: 'pending' | 'sent' | 'failed';
  attempts: number;
  lastError: string | null;
  nextAttemptAt: string | null;
  createdAt: string;
  sentAt: string | null;
  /** What it is about, e.g. "invitation:12". */
  ref: string | null;
}

export const outboxQuerySchema = z.strictObject({ status: z.enum(['pending', 'sent', 'failed']).optional() });

/** The CSV import's columns, each declared once (name, draft path, unit, required, help). */
export { PROPERTY_SET_COLUMNS as IMPORT_COLUMNS, PER_VALUE_PARTS as IMPORT_PER_VALUE_PARTS } from '../import/property-set-columns';

export const IMPORT_MAX_BYTES = 20 * 1024 * 1024;
export const IMPORT_MAX_ROWS = 50_000;
export const DOCUMENT_MAX_BYTES = 20 * 1024 * 1024;

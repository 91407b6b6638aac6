import { z } from 'zod';
import { oneLineText } from './text';
import type { ListDto } from './responses';

/** Material families in the catalogue. Slugs are stable API values; labels are for screens. */
export const FAMILIES = [
  'acrylic',
  'polycarbonate',
  'glass',
  'glass-ceramic',
  'sapphire-alumina',
  'titanium-alloy',
  'steel',
  'aluminium-alloy',
  'fibre-composite',
  'syntactic-foam',
] as const;
export const familySchema = z.enum(FAMILIES);
export type Family = z.infer<typeof familySchema>;

export const FAMILY_LABELS: Record<Family, string> = {
  acrylic: 'Acrylic (PMMA)',
  polycarbonate: 'Polycarbonate',
  glass: 'Glass',
  'glass-ceramic': 'Glass-ceramic',
  'sapphire-alumina': 'Sapphire / alumina',
  'titanium-alloy': 'Titanium alloy',
  steel: 'Steel',
  'aluminium-alloy': 'Aluminium alloy',
  'fibre-composite': 'Fibre composite',
  'syntactic-foam': 'Syntactic foam',
};

export const PROPERTY_SET_STATUSES = ['draft', 'in-review', 'published', 'retired'] as const;
export const propertySetStatusSchema = z.enum(PROPERTY_SET_STATUSES);
export type PropertySetStatus = z.infer<typeof propertySetStatusSchema>;

export const REFERENCE_KINDS = ['standard', 'handbook', 'paper', 'test-report', 'supplier-data-sheet'] as const;
export const referenceKindSchema = z.enum(REFERENCE_KINDS);
export type ReferenceKind = z.infer<typeof referenceKindSchema>;

/** How a value was established. */
export const VALUE_BASES = ['minimum', 'typical', 'statistical-allowable'] as const;
export const valueBasisSchema = z.enum(VALUE_BASES);
export type ValueBasis = z.infer<typeof valueBasisSchema>;

export { QUANTITIES, QUANTITY_LABELS, type Quantity } from './quantities';
import { QUANTITIES, type Quantity } from './quantities';
import { provenanceInputSchema, type Provenance } from './provenance';

/** Basis, test method and test temperature of one value. */
export const valueDetailSchema = z.object({
  basis: valueBasisSchema,
  testMethod: z.string().trim().max(120).optional(),
  temperature: z.number().min(-273.15).max(2000).optional(),
});
export type ValueDetail = z.infer<typeof valueDetailSchema>;

const finite = z.number().refine(Number.isFinite, 'must be a finite number');
const positive = finite.refine((v) => v > 0, 'must be greater than zero');
const fraction = finite.refine((v) => v >= 0 && v <= 1, 'must be between 0 and 1 (0 to 100 %)');
const temperatureC = finite.refine((v) => v >= -273.15, 'must not be below absolute zero (-273.15 °C)');

/** Strength factor (multiplier on the reference-condition strength) against a variable. */
export const temperaturePointSchema = z.object({ temperature: temperatureC, factor: positive });
export const hoursPointSchema = z.object({ hours: finite.refine((v) => v >= 0, 'must be zero or more'), factor: positive });
export const cyclesPointSchema = z.object({ cycles: finite.refine((v) => v >= 0, 'must be zero or more'), factor: positive });
export type TemperaturePoint = z.infer<typeof temperaturePointSchema>;
export type HoursPoint = z.infer<typeof hoursPointSchema>;
export type CyclesPoint = z.infer<typeof cyclesPointSchema>;

const bothNumbers = z.object({ min: finite, max: finite });

/** The values of a property set, as stored and exchanged (SI). */
export const propertyValuesSchema = z.object({
  density: positive,
  youngsModulus: positive,
  poissonsRatio: finite.refine((v) => v > -1 && v < 0.5, 'must be between -1 and 0.5'),
  tensileStrength: positive,
  tensileYield: positive.nullish(),
  compressiveStrength: positive,
  compressiveYield: positive.nullish(),
  shearStrength: positive,
  shearYield: positive.nullish(),
  elongation: fraction.nullish(),
  luminousTransmittance: fraction.nullish(),
  serviceTemperature: z.object({ min: temperatureC, max: temperatureC }).refine((r) => r.min <= r.max, {
    message: 'min must not exceed max',
    path: ['max'],
    // Compared whenever both ends are numbers, even if one is below absolute zero.
    when: (payload) => bothNumbers.safeParse(payload.value).success,
  }),
  valueDetails: z.partialRecord(z.enum(QUANTITIES), valueDetailSchema).default({}),
  temperatureFactors: z.array(temperaturePointSchema).max(50).default([]),
  sustainedLoadFactors: z.array(hoursPointSchema).max(50).default([]),
  cyclicFactors: z.array(cyclesPointSchema).max(50).default([]),
  /** The status of each value: confirmed, recalled, derived or demo (shared/schemas/provenance.ts). */
  provenance: provenanceInputSchema,
});
export type PropertyValues = z.infer<typeof propertyValuesSchema>;

export const referenceInputSchema = z.object({
  kind: referenceKindSchema,
  title: oneLineText({ min: 1, max: 400 }),
  authors: z.string().trim().max(400).optional(),
  year: z.number().int().min(1800).max(2100).optional(),
  identifier: z.string().trim().max(200).optional(),
  location: z.string().trim().max(200).optional(),
  note: z.string().trim().max(4000).optional(),
});
export type ReferenceInput = z.infer<typeof referenceInputSchema>;

export const materialInputSchema = z.object({
  name: oneLineText({ min: 1, max: 200 }),
  family: familySchema,
  transparent: z.boolean(),
  description: z.string().trim().max(2000).optional(),
});
export type MaterialInput = z.infer<typeof materialInputSchema>;

/** Query string of GET /api/property-sets. */
const queryBool = z.enum(['true', 'false']).transform((v) => v === 'true');
const queryNumber = z
  .string()
  .trim()
  .min(1, 'must be a number')
  .transform(Number)
  .refine(Number.isFinite, 'must be a finite number');

export const propertySetQuerySchema = z
  .strictObject({
    family: familySchema.optional(),
    transparent: queryBool.optional(),
    tmin: queryNumber.optional(),
    tmax: queryNumber.optional(),
    q: z.string().trim().max(200).optional(),
    status: propertySetStatusSchema.optional(),
    materialId: queryNumber.pipe(z.number().int().positive()).optional(),
  })
  .refine((v) => v.tmin === undefined || v.tmax === undefined || v.tmin <= v.tmax, {
    message: 'tmax must not be below tmin',
    path: ['tmax'],
  });
export type PropertySetQuery = z.infer<typeof propertySetQuerySchema>;

/** A reference's citation fields, as the reference and each of its versions hold them. */
export interface ReferenceCitationDto {
  kind: ReferenceKind;
  title: string;
  authors: string | null;
  year: number | null;
  identifier: string | null;
  location: string | null;
  note: string | null;
}

export interface ReferenceDto extends ReferenceCitationDto {
  id: number;
  /**
   * True when an uploaded document (PDF) can be downloaded from /api/references/:id/document.
   * Optional so older fixtures need not carry it; the server should always send it.
   */
  hasDocument?: boolean;
  /**
   * The version of the citation shown: for a published or retired record the one it was approved
   * with, otherwise the reference's current one. Optional for design records frozen before
   * references were versioned (they cite version 1).
   */
  version?: number;
  /** The reference's current published version (higher than `version` when the citation has changed since). */
  latestVersion?: number;
  /** The latest uploaded document's version (null: none), downloadable from /api/references/:id/documents/:version. */
  documentVersion?: number | null;
}

export interface MaterialDto {
  id: number;
  name: string;
  family: Family;
  transparent: boolean;
  description: string | null;
}

export interface UserRefDto {
  id: number;
  name: string;
}

/** Who drafted, last edited and approved a reviewed record, and when it was submitted and published. */
export interface ReviewTrailDto {
  draftedBy: UserRefDto | null;
  lastEditedBy: UserRefDto | null;
  approvedBy: UserRefDto | null;
  /** The reviewer's comment when it was sent back to its author. */
  returnedComment: string | null;
  submittedAt: string | null;
  publishedAt: string | null;
}

export interface PropertySetDto {
  id: number;
  status: PropertySetStatus;
  version: number;
  /** The id of the first version of this set's lineage (rating tables cover lineages). Optional only for hand-built fixtures. */
  lineageId?: number | null;
  condition: string;
  material: MaterialDto;
  reference: ReferenceDto | null;
  density: number;
  youngsModulus: number;
  poissonsRatio: number;
  tensileStrength: number;
  tensileYield: number | null;
  compressiveStrength: number;
  compressiveYield: number | null;
  shearStrength: number;
  /** Optional: metals without it are given yield/√3 (von Mises) by the calculation. */
  shearYield?: number | null;
  elongation: number | null;
  luminousTransmittance: number | null;
  serviceTemperature: { min: number; max: number };
  valueDetails: Partial<Record<Quantity, ValueDetail>>;
  /** Each value's status; a value with no entry is recalled. Optional only for hand-built fixtures. */
  provenance?: Provenance;
  temperatureFactors: TemperaturePoint[];
  sustainedLoadFactors: HoursPoint[];
  cyclicFactors: CyclesPoint[];
  draftedBy: UserRefDto | null;
  approvedBy: UserRefDto | null;
  publishedAt: string | null;
  updatedAt: string;
  /**
   * The set that replaced this one (a retired set superseded by a newer version), else null.
   * Always sent by the server; optional only so hand-built fixtures need not carry it.
   */
  supersededById?: number | null;
}

export interface PropertySetListDto {
  items: PropertySetDto[];
  total: number;
}

/** GET /api/materials/:id: a material with the property sets the caller may read. */
export interface MaterialDetailDto extends MaterialDto {
  propertySets: PropertySetDto[];
}

/** GET /api/materials: every material, by family then name. */
export type MaterialListDto = ListDto<MaterialDto>;

// CSV import of property sets: read the file (UTF-8 text, comma-separated, the template's
// header), check every cell, match or plan materials and references, and write all rows as
// drafts in one transaction — or nothing at all when any row has a problem.
import Papa from 'papaparse';
import { UniqueConstraintError, type Transaction } from 'sequelize';
import { Material, Reference } from '../../db/models';
import { sequelize } from '../../db/sequelize';
import { AppError, badRequest, conflict } from '../../errors';
import { recordAudit } from '../../services/audit';
import { fileError, readCsvRows, type UploadedFile } from '../../services/csv-text';
import {
  familySchema,
  referenceKindSchema,
  valueBasisSchema,
  type Family,
  type Quantity,
  type ReferenceKind,
  type ValueBasis,
  type ValueDetail,
} from '../../../shared/schemas/catalogue';
import {
  draftInputSchema,
  IMPORT_COLUMNS,
  IMPORT_MAX_BYTES,
  IMPORT_MAX_ROWS,
  type DraftData,
  type ImportIssueDto,
  type ImportPreviewDto,
  type ImportResultDto,
} from '../../../shared/schemas/library';
import { invalidateCatalogueSnapshot } from '../property-sets/snapshot';
import type { Actor } from './service';

type Column = (typeof IMPORT_COLUMNS)[number]['name'];

const REQUIRED: readonly Column[] = IMPORT_COLUMNS.filter((c) => c.required).map((c) => c.name);
const KNOWN = new Set<string>(IMPORT_COLUMNS.map((c) => c.name));
/** Issues reported in full; the count goes on. */
export const MAX_ISSUES = 500;
const SAMPLE_ROWS = 20;
/** Rows per INSERT statement inside the import's one transaction. */
const INSERT_CHUNK = 5_000;

// ---------------------------------------------------------------------------------------------
// Reading the file

export type { UploadedFile };

export interface CsvTable {
  header: Column[];
  /** Data rows (header excluded); row i is data row i + 1. */
  rows: string[][];
}

/** Turns the bytes into a table, or refuses a file that cannot be read at all (400, 413). */
export function readCsv(file: UploadedFile): CsvTable {
  const [rawHeader, ...rows] = readCsvRows(file, IMPORT_MAX_BYTES);
  const header = rawHeader.map((h) => h.trim().toLowerCase());

  const known = header.filter((h) => KNOWN.has(h));
  if (known.length === 0) {
    const hint = rawHeader.length === 1 && /[;\t]/.test(rawHeader[0]) ? ' Separate the columns with commas.' : '';
    throw fileError(
      'not_csv',
      `This does not look like a property-set CSV: the first line must be the template's header (${REQUIRED.slice(0, 4).join(', ')}, …).${hint}`,
      { file: 'has no recognised header' },
    );
  }
  const missing = REQUIRED.filter((c) => !header.includes(c));
  if (missing.length) {
    throw fileError('missing_columns', `The file lacks required columns: ${missing.join(', ')}.`, {
      columns: `missing: ${missing.join(', ')}`,
    });
  }
  const unknown = header.filter((h) => !KNOWN.has(h));
  if (unknown.length) {
    throw fileError('unknown_columns', `The file has columns the template does not: ${unknown.map((u) => u || '(blank)').join(', ')}. Remove them or use the template.`, {
      columns: `unknown: ${unknown.join(', ')}`,
    });
  }
  const duplicates = header.filter((h, i) => header.indexOf(h) !== i);
  if (duplicates.length) {
    throw fileError('duplicate_columns', `Columns appear twice: ${[...new Set(duplicates)].join(', ')}.`, {
      columns: `duplicated: ${[...new Set(duplicates)].join(', ')}`,
    });
  }
  if (rows.length === 0) throw fileError('no_rows', 'The file has a header but no rows.', { file: 'has no rows' });
  if (rows.length > IMPORT_MAX_ROWS) {
    throw fileError(
      'too_many_rows',
      `The file has more than ${IMPORT_MAX_ROWS.toLocaleString('en-GB')} rows. Split it into files of at most ${IMPORT_MAX_ROWS.toLocaleString('en-GB')} rows.`,
      { file: `more than ${IMPORT_MAX_ROWS} rows` },
    );
  }
  return { header: header as Column[], rows };
}

// ---------------------------------------------------------------------------------------------
// Checking the rows

interface PlannedRow {
  row: number;
  materialKey: string;
  referenceKey: string;
  draft: DraftData;
  material: { name: string; family: Family; transparent: boolean };
  reference: { kind: ReferenceKind; title: string; authors?: string; year?: number; identifier?: string; location?: string };
}

export interface Analysis {
  rows: number;
  valid: number;
  issues: ImportIssueDto[];
  issueCount: number;
  planned: PlannedRow[];
  /** lower(name) → existing material. */
  existingMaterials: Map<string, { id: number; name: string; family: Family; transparent: boolean }>;
  existingReferences: Map<string, number>;
  newMaterials: Map<string, PlannedRow['material']>;
  newReferences: Map<string, PlannedRow['reference']>;
}

const NUMBER = /^[+-]?(\d+(\.\d*)?|\.\d+)([eE][+-]?\d+)?$/;

/** Zod paths of a draft → the CSV column a person fixes. */
const COLUMN_OF_PATH: Record<string, Column> = {
  condition: 'condition',
  'material.name': 'material',
  'material.family': 'family',
  'material.transparent': 'transparent',
  'reference.title': 'reference_title',
  'reference.kind': 'reference_kind',
  'reference.authors': 'reference_authors',
  'reference.year': 'reference_year',
  'reference.identifier': 'reference_identifier',
  'reference.location': 'reference_location',
  density: 'density_kg_m3',
  youngsModulus: 'youngs_modulus_gpa',
  poissonsRatio: 'poissons_ratio',
  tensileStrength: 'tensile_strength_mpa',
  tensileYield: 'tensile_yield_mpa',
  compressiveStrength: 'compressive_strength_mpa',
  compressiveYield: 'compressive_yield_mpa',
  shearStrength: 'shear_strength_mpa',
  elongation: 'elongation_pct',
  luminousTransmittance: 'luminous_transmittance_pct',
  'serviceTemperature.min': 'service_temp_min_c',
  'serviceTemperature.max': 'service_temp_max_c',
};

const materialKey = (name: string) => name.toLowerCase();
const referenceKey = (title: string, identifier: string | null | undefined) => `${title.toLowerCase()}\u0000${(identifier ?? '').toLowerCase()}`;

/** One row's cells → a draft, or the problems found, named by column. */
function checkRow(cells: string[], header: Column[], row: number, issues: (field: string, message: string) => void): PlannedRow | null {
  if (cells.length !== header.length) {
    issues('_', `has ${cells.length} field${cells.length === 1 ? '' : 's'}; the header has ${header.length}`);
    return null;
  }
  const cell: Partial<Record<Column, string>> = {};
  header.forEach((h, i) => (cell[h] = cells[i].trim()));
  let ok = true;
  const fail = (column: Column, message: string) => {
    ok = false;
    issues(column, message);
  };

  const text = (column: Column, max: number): string | undefined => {
    const value = cell[column] ?? '';
    if (!value) {
      if (REQUIRED.includes(column)) fail(column, 'is required');
      return undefined;
    }
    if (value.length > max) fail(column, `is longer than ${max} characters`);
    return value;
  };
  /** A number in the column's unit, times `toSi`; undefined when blank (optional columns). */
  const number = (column: Column, toSi: number, check?: (v: number) => string | null): number | undefined => {
    const value = cell[column] ?? '';
    if (!value) {
      if (REQUIRED.includes(column)) fail(column, 'is required');
      return undefined;
    }
    if (!NUMBER.test(value)) {
      fail(column, 'must be a number (use a point for decimals, no thousands separators)');
      return undefined;
    }
    const v = Number(value);
    if (!Number.isFinite(v)) {
      fail(column, 'must be a finite number');
      return undefined;
    }
    const problem = check?.(v);
    if (problem) {
      fail(column, problem);
      return undefined;
    }
    return v * toSi;
  };
  const positive = (v: number) => (v > 0 ? null : 'must be greater than zero');
  const percent = (v: number) => (v >= 0 && v <= 100 ? null : 'must be between 0 and 100 (%)');

  const name = text('material', 200);
  const familyRaw = text('family', 40);
  const family = familyRaw === undefined ? undefined : familySchema.safeParse(familyRaw.toLowerCase());
  if (family && !family.success) fail('family', `must be one of: ${familySchema.options.join(', ')}`);
  const transparentRaw = (cell.transparent ?? '').toLowerCase();
  let transparent: boolean | undefined;
  if (['yes', 'y', 'true', '1'].includes(transparentRaw)) transparent = true;
  else if (['no', 'n', 'false', '0'].includes(transparentRaw)) transparent = false;
  else fail('transparent', transparentRaw ? 'must be yes or no' : 'is required');
  const condition = text('condition', 300);
  const title = text('reference_title', 400);
  const kindRaw = text('reference_kind', 40);
  const kind = kindRaw === undefined ? undefined : referenceKindSchema.safeParse(kindRaw.toLowerCase());
  if (kind && !kind.success) fail('reference_kind', `must be one of: ${referenceKindSchema.options.join(', ')}`);
  const authors = text('reference_authors', 400);
  const year = number('reference_year', 1, (v) => (Number.isInteger(v) && v >= 1800 && v <= 2100 ? null : 'must be a year from 1800 to 2100'));
  const identifier = text('reference_identifier', 200);
  const location = text('reference_location', 200);
  const basisRaw = text('basis', 40);
  const basis = basisRaw === undefined ? undefined : valueBasisSchema.safeParse(basisRaw.toLowerCase());
  if (basis && !basis.success) fail('basis', `must be one of: ${valueBasisSchema.options.join(', ')}`);

  const MPa = 1e6;
  const density = number('density_kg_m3', 1, positive);
  const youngsModulus = number('youngs_modulus_gpa', 1e9, positive);
  const poissonsRatio = number('poissons_ratio', 1, (v) => (v > -1 && v < 0.5 ? null : 'must be between -1 and 0.5'));
  const tensileStrength = number('tensile_strength_mpa', MPa, positive);
  const tensileYield = number('tensile_yield_mpa', MPa, positive);
  const compressiveStrength = number('compressive_strength_mpa', MPa, positive);
  const compressiveYield = number('compressive_yield_mpa', MPa, positive);
  const shearStrength = number('shear_strength_mpa', MPa, positive);
  const elongation = number('elongation_pct', 0.01, percent);
  const luminousTransmittance = number('luminous_transmittance_pct', 0.01, percent);
  const tmin = number('service_temp_min_c', 1, (v) => (v >= -273.15 ? null : 'must be above absolute zero (-273.15 °C)'));
  const tmax = number('service_temp_max_c', 1, (v) => (v >= -273.15 ? null : 'must be above absolute zero (-273.15 °C)'));
  if (!ok) return null;

  const valueBasis = basis!.data as ValueBasis;
  const valueDetails: Partial<Record<Quantity, ValueDetail>> = {
    tensileStrength: { basis: valueBasis },
    compressiveStrength: { basis: valueBasis },
    shearStrength: { basis: valueBasis },
    ...(tensileYield !== undefined ? { tensileYield: { basis: valueBasis } } : {}),
    ...(compressiveYield !== undefined ? { compressiveYield: { basis: valueBasis } } : {}),
  };
  const material = { name: name!, family: family!.data as Family, transparent: transparent! };
  const reference = {
    kind: kind!.data as ReferenceKind,
    title: title!,
    ...(authors ? { authors } : {}),
    ...(year !== undefined ? { year } : {}),
    ...(identifier ? { identifier } : {}),
    ...(location ? { location } : {}),
  };
  // The draft schema is the one rule book: the same checks as a draft saved on the desk.
  const parsed = draftInputSchema.safeParse({
    condition,
    material,
    reference,
    density,
    youngsModulus,
    poissonsRatio,
    tensileStrength,
    tensileYield: tensileYield ?? null,
    compressiveStrength,
    compressiveYield: compressiveYield ?? null,
    shearStrength,
    elongation: elongation ?? null,
    luminousTransmittance: luminousTransmittance ?? null,
    serviceTemperature: { min: tmin, max: tmax },
    valueDetails,
  });
  if (!parsed.success) {
    const seen = new Set<string>();
    for (const issue of parsed.error.issues) {
      const path = issue.path.map(String).join('.');
      const column = COLUMN_OF_PATH[path] ?? '_';
      if (seen.has(column)) continue;
      seen.add(column);
      issues(column, issue.message);
    }
    return null;
  }
  return {
    row,
    materialKey: materialKey(material.name),
    referenceKey: referenceKey(reference.title, reference.identifier),
    draft: parsed.data,
    material,
    reference,
  };
}

/** Checks every row against the rules and the catalogue as it stands (in `transaction` if given). */
export async function analyse(table: CsvTable, transaction?: Transaction): Promise<Analysis> {
  const materials = await Material.findAll({ attributes: ['id', 'name', 'family', 'transparent'], transaction });
  const existingMaterials = new Map(materials.map((m) => [materialKey(m.name), { id: m.id, name: m.name, family: m.family, transparent: m.transparent }]));
  const references = await Reference.findAll({ attributes: ['id', 'title', 'identifier'], order: [['id', 'ASC']], transaction });
  const existingReferences = new Map<string, number>();
  for (const r of references) {
    const key = referenceKey(r.title, r.identifier);
    if (!existingReferences.has(key)) existingReferences.set(key, r.id);
  }

  const issues: ImportIssueDto[] = [];
  let issueCount = 0;
  let valid = 0;
  const planned: PlannedRow[] = [];
  const newMaterials = new Map<string, PlannedRow['material']>();
  const newReferences = new Map<string, PlannedRow['reference']>();

  table.rows.forEach((cells, index) => {
    const row = index + 1;
    let rowHasIssue = false;
    const report = (field: string, message: string) => {
      rowHasIssue = true;
      issueCount++;
      if (issues.length < MAX_ISSUES) issues.push({ row, field, message });
    };
    const plan = checkRow(cells, table.header, row, report);
    if (plan) {
      // A material is one family and one transparency, wherever it is named.
      const known = existingMaterials.get(plan.materialKey) ?? newMaterials.get(plan.materialKey);
      const where = existingMaterials.has(plan.materialKey) ? 'in the catalogue' : 'earlier in this file';
      if (known && known.family !== plan.material.family) {
        report('family', `"${known.name}" is ${known.family} ${where}; use that family or another material name`);
      }
      if (known && known.transparent !== plan.material.transparent) {
        report('transparent', `"${known.name}" is ${known.transparent ? '' : 'not '}transparent ${where}`);
      }
      if (!rowHasIssue) {
        if (!known) newMaterials.set(plan.materialKey, plan.material);
        if (!existingReferences.has(plan.referenceKey) && !newReferences.has(plan.referenceKey)) {
          newReferences.set(plan.referenceKey, plan.reference);
        }
        planned.push(plan);
      }
    }
    if (!rowHasIssue) valid++;
  });

  return { rows: table.rows.length, valid, issues, issueCount, planned, existingMaterials, existingReferences, newMaterials, newReferences };
}

export function previewOf(a: Analysis): ImportPreviewDto {
  return {
    rows: a.rows,
    valid: a.valid,
    issues: a.issues,
    issueCount: a.issueCount,
    sample: a.planned.slice(0, SAMPLE_ROWS).map((p) => ({
      row: p.row,
      material: p.material.name,
      family: p.material.family,
      condition: p.draft.condition,
      reference: p.reference.title,
      tensileStrength: p.draft.tensileStrength,
      compressiveStrength: p.draft.compressiveStrength,
      shearStrength: p.draft.shearStrength,
    })),
    newMaterials: [...a.newMaterials.values()].map((m) => m.name).slice(0, MAX_ISSUES),
    newReferences: [...a.newReferences.values()].map((r) => r.title).slice(0, MAX_ISSUES),
  };
}

// ---------------------------------------------------------------------------------------------
// Entry points

/** What the import would do; writes nothing. */
export async function previewImport(file: UploadedFile): Promise<ImportPreviewDto> {
  return previewOf(await analyse(readCsv(file)));
}

function invalid(a: Analysis): AppError {
  const fields: Record<string, string> = {};
  for (const issue of a.issues) {
    const key = `rows.${issue.row}.${issue.field}`;
    if (!(key in fields)) fields[key] = issue.message;
  }
  const badRows = a.rows - a.valid;
  return badRequest(
    `${a.issueCount} problem${a.issueCount === 1 ? '' : 's'} in ${badRows} row${badRows === 1 ? '' : 's'}; nothing was imported. Fix them and import the file again.`,
    fields,
    'import_invalid',
  );
}

/**
 * Every row becomes a draft drafted by the caller, in ONE transaction with the new materials
 * and references; any problem refuses the whole file. One audit entry records the import.
 */
export async function runImport(file: UploadedFile, actor: Actor): Promise<ImportResultDto> {
  const table = readCsv(file);
  try {
    const ids = await sequelize().transaction(async (transaction) => {
      const a = await analyse(table, transaction);
      if (a.issueCount > 0) throw invalid(a);

      const materialIds = new Map<string, number>();
      for (const [key, m] of a.existingMaterials) materialIds.set(key, m.id);
      if (a.newMaterials.size) {
        const created = await Material.bulkCreate(
          [...a.newMaterials.values()].map((m) => ({ ...m, description: null })),
          { transaction, returning: true },
        );
        for (const m of created) materialIds.set(materialKey(m.name), m.id);
      }
      const referenceIds = new Map(a.existingReferences);
      if (a.newReferences.size) {
        const entries = [...a.newReferences.entries()];
        const created = await Reference.bulkCreate(
          entries.map(([, r]) => ({
            kind: r.kind,
            title: r.title,
            authors: r.authors ?? null,
            year: r.year ?? null,
            identifier: r.identifier ?? null,
            location: r.location ?? null,
            note: null,
            createdById: actor.id,
          })),
          { transaction, returning: true },
        );
        created.forEach((r) => referenceIds.set(referenceKey(r.title, r.identifier), r.id));
      }

      const [idRows] = await sequelize().query(
        `SELECT nextval(pg_get_serial_sequence('property_sets', 'id'))::integer AS id FROM generate_series(1, :count)`,
        { transaction, replacements: { count: a.planned.length } },
      );
      const ids = (idRows as { id: number }[]).map((r) => r.id);
      // One INSERT per chunk: each varying column goes as one array parameter and PostgreSQL
      // zips them with unnest(); what every row shares is a constant in the statement. Building
      // 50,000 model instances for bulkCreate cost seconds more (see DEVELOPERS.md). Raw SQL
      // skips the model hooks, so the catalogue snapshot is dropped by hand after the commit.
      for (let start = 0; start < a.planned.length; start += INSERT_CHUNK) {
        const chunk = a.planned.slice(start, start + INSERT_CHUNK);
        const column = <T>(pick: (p: PlannedRow, i: number) => T) => chunk.map((p, i) => pick(p, i));
        await sequelize().query(
          `INSERT INTO property_sets (
             id, lineage_id, material_id, reference_id, condition, density, youngs_modulus, poissons_ratio,
             tensile_strength, tensile_yield, compressive_strength, compressive_yield, shear_strength,
             elongation, luminous_transmittance, service_temp_min, service_temp_max, value_details,
             status, version, drafted_by_id, last_edited_by_id, lock_version, created_at, updated_at)
           SELECT r.id, r.id, r.material_id, r.reference_id, r.condition, r.density, r.youngs_modulus, r.poissons_ratio,
             r.tensile_strength, r.tensile_yield, r.compressive_strength, r.compressive_yield, r.shear_strength,
             r.elongation, r.luminous_transmittance, r.service_temp_min, r.service_temp_max, r.value_details::jsonb,
             'draft', 1, $actor, $actor, 0, now(), now()
           FROM unnest($id::integer[], $material::integer[], $reference::integer[], $condition::text[],
             $density::float8[], $youngs::float8[], $poissons::float8[], $tensile::float8[], $tensileYield::float8[],
             $compressive::float8[], $compressiveYield::float8[], $shear::float8[], $elongation::float8[],
             $transmittance::float8[], $tmin::float8[], $tmax::float8[], $details::text[])
             AS r(id, material_id, reference_id, condition, density, youngs_modulus, poissons_ratio, tensile_strength,
               tensile_yield, compressive_strength, compressive_yield, shear_strength, elongation,
               luminous_transmittance, service_temp_min, service_temp_max, value_details)`,
          {
            transaction,
            bind: {
              actor: actor.id,
              id: column((_, i) => ids[start + i]),
              material: column((p) => materialIds.get(p.materialKey)!),
              reference: column((p) => referenceIds.get(p.referenceKey)!),
              condition: column((p) => p.draft.condition),
              density: column((p) => p.draft.density),
              youngs: column((p) => p.draft.youngsModulus),
              poissons: column((p) => p.draft.poissonsRatio),
              tensile: column((p) => p.draft.tensileStrength),
              tensileYield: column((p) => p.draft.tensileYield ?? null),
              compressive: column((p) => p.draft.compressiveStrength),
              compressiveYield: column((p) => p.draft.compressiveYield ?? null),
              shear: column((p) => p.draft.shearStrength),
              elongation: column((p) => p.draft.elongation ?? null),
              transmittance: column((p) => p.draft.luminousTransmittance ?? null),
              tmin: column((p) => p.draft.serviceTemperature.min),
              tmax: column((p) => p.draft.serviceTemperature.max),
              details: column((p) => JSON.stringify(p.draft.valueDetails)),
            },
          },
        );
      }
      await recordAudit(transaction, {
        actorId: actor.id,
        action: 'import',
        entityType: 'import',
        entityId: null,
        before: null,
        after: {
          fileName: file.originalname,
          bytes: file.size,
          created: ids.length,
          firstId: ids[0],
          lastId: ids[ids.length - 1],
          newMaterials: [...a.newMaterials.values()].map((m) => m.name),
          newReferences: a.newReferences.size,
        },
      });
      return ids;
    });
    invalidateCatalogueSnapshot();
    return { created: ids.length, ids };
  } catch (err) {
    // Another import or a librarian created the same material between our read and our write.
    if (err instanceof UniqueConstraintError) {
      throw conflict('Someone added a material with the same name while this file was importing. Import it again.', 'duplicate');
    }
    throw err;
  }
}

/**
 * The template: the header and two example rows. The rows are invented Harrow Sound acceptance
 * tests that show the units and formats; they are not data to rely on.
 */
export function templateCsv(): string {
  const header = IMPORT_COLUMNS.map((c) => c.name);
  const example = (values: Partial<Record<Column, string | number>>) => header.map((h) => String(values[h as Column] ?? ''));
  const rows = [
    header,
    example({
      material: 'Cast acrylic (PMMA)',
      family: 'acrylic',
      transparent: 'yes',
      condition: 'Harrow Sound lot 7 cast sheet, 100 mm, as supplied',
      reference_title: 'Harrow Sound Marine Works acceptance tests, viewport sheet lot 7',
      reference_kind: 'test-report',
      reference_authors: 'Harrow Sound Marine Works test laboratory',
      reference_year: 2026,
      reference_identifier: 'HSMW-TR-0007',
      reference_location: 'Table 2',
      basis: 'minimum',
      density_kg_m3: 1190,
      youngs_modulus_gpa: 3.1,
      poissons_ratio: 0.37,
      tensile_strength_mpa: 70,
      compressive_strength_mpa: 110,
      compressive_yield_mpa: 105,
      shear_strength_mpa: 60,
      elongation_pct: 3,
      luminous_transmittance_pct: 91,
      service_temp_min_c: 10,
      service_temp_max_c: 66,
    }),
    example({
      material: 'Titanium alloy Ti-6Al-4V',
      family: 'titanium-alloy',
      transparent: 'no',
      condition: 'Annealed plate, hull ring forging stock',
      reference_title: 'Harrow Sound Marine Works acceptance tests, hull ring forging stock',
      reference_kind: 'test-report',
      reference_year: 2026,
      reference_identifier: 'HSMW-TR-0012',
      basis: 'typical',
      density_kg_m3: 4430,
      youngs_modulus_gpa: 114,
      poissons_ratio: 0.34,
      tensile_strength_mpa: 950,
      tensile_yield_mpa: 880,
      compressive_strength_mpa: 970,
      compressive_yield_mpa: 900,
      shear_strength_mpa: 550,
      elongation_pct: 14,
      service_temp_min_c: -40,
      service_temp_max_c: 300,
    }),
  ];
  return Papa.unparse(rows, { newline: '\r\n' }) + '\r\n';
}


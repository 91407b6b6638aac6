// Step 3 of the property-set import: every row mapped to a draft, then matched against the
// catalogue as it stands and against the rows before it: which materials and references exist,
// which would be created, and whether a material keeps one family and one transparency.
import type { Transaction } from 'sequelize';
import { Material, Reference } from '../../../db/models';
import { materialInputSchema, type Family, type MaterialInput, type ReferenceInput } from '../../../../shared/schemas/catalogue';
import type { DraftData, ImportIssueDto, ImportPreviewDto } from '../../../../shared/schemas/library';
import { inputStatus, presentKeys } from '../../../../shared/schemas/provenance';
import { rowMapper } from './map-rows';
import type { CsvTable } from './read-file';

/** Issues reported in full; the count goes on. */
export const MAX_ISSUES = 500;
const SAMPLE_ROWS = 20;

type NewMaterial = Pick<MaterialInput, 'name' | 'family' | 'transparent'>;
type NewReference = Omit<ReferenceInput, 'note'>;

export interface PlannedRow {
  row: number;
  materialKey: string;
  referenceKey: string;
  draft: DraftData;
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
  newMaterials: Map<string, NewMaterial>;
  newReferences: Map<string, NewReference>;
}

export const materialKey = (name: string) => name.toLowerCase();
export const referenceKey = (title: string, identifier: string | null | undefined) => `${title.toLowerCase()}\u0000${(identifier ?? '').toLowerCase()}`;

/** Checks every row against the draft schema and the catalogue as it stands (in `transaction` if given). */
export async function analyse(table: CsvTable, transaction?: Transaction): Promise<Analysis> {
  const materials = await Material.findAll({ attributes: ['id', 'name', 'family', 'transparent'], transaction });
  const existingMaterials = new Map(materials.map((m) => [materialKey(m.name), { id: m.id, name: m.name, family: m.family, transparent: m.transparent }]));
  const references = await Reference.findAll({ attributes: ['id', 'title', 'identifier'], order: [['id', 'ASC']], transaction });
  const existingReferences = new Map<string, number>();
  for (const r of references) {
    const key = referenceKey(r.title, r.identifier);
    if (!existingReferences.has(key)) existingReferences.set(key, r.id);
  }

  const a: Analysis = { rows: table.rows.length, valid: 0, issues: [], issueCount: 0, planned: [], existingMaterials, existingReferences, newMaterials: new Map(), newReferences: new Map() };

  const mapRow = rowMapper(table.header);
  table.rows.forEach((cells, index) => {
    const row = index + 1;
    const mapped = mapRow(cells);
    const issues = [...mapped.issues];
    const flagged = new Set(issues.map((i) => i.field));

    // A material is one family and one transparency wherever it is named. Checked whenever the
    // row's material is complete, so it comes in the same round as the row's other issues.
    const material = materialInputSchema.safeParse(mapped.input.material);
    if (material.success) {
      const m = material.data;
      const key = materialKey(m.name);
      const known = existingMaterials.get(key) ?? a.newMaterials.get(key);
      const where = existingMaterials.has(key) ? 'in the catalogue' : 'earlier in this file';
      if (known && known.family !== m.family && !flagged.has('family')) {
        issues.push({ field: 'family', message: `"${known.name}" is ${known.family} ${where}; use that family or another material name` });
      }
      if (known && known.transparent !== m.transparent && !flagged.has('transparent')) {
        issues.push({ field: 'transparent', message: `"${known.name}" is ${known.transparent ? '' : 'not '}transparent ${where}` });
      }
    }

    if (issues.length) {
      a.issueCount += issues.length;
      for (const issue of issues) if (a.issues.length < MAX_ISSUES) a.issues.push({ row, ...issue });
      return;
    }
    const draft = mapped.draft!;
    const m = draft.material!;
    const r = draft.reference!;
    const mKey = materialKey(m.name);
    const rKey = referenceKey(r.title, r.identifier);
    if (!existingMaterials.has(mKey) && !a.newMaterials.has(mKey)) a.newMaterials.set(mKey, { name: m.name, family: m.family, transparent: m.transparent });
    if (!existingReferences.has(rKey) && !a.newReferences.has(rKey)) {
      a.newReferences.set(rKey, { kind: r.kind, title: r.title, authors: r.authors, year: r.year, identifier: r.identifier, location: r.location });
    }
    a.planned.push({ row, materialKey: mKey, referenceKey: rKey, draft });
    a.valid++;
  });
  return a;
}

export function previewOf(a: Analysis): ImportPreviewDto {
  return {
    rows: a.rows,
    valid: a.valid,
    issues: a.issues,
    issueCount: a.issueCount,
    sample: a.planned.slice(0, SAMPLE_ROWS).map(({ row, draft }) => ({
      row,
      material: draft.material!.name,
      family: draft.material!.family,
      condition: draft.condition,
      reference: draft.reference!.title,
      tensileStrength: draft.tensileStrength,
      compressiveStrength: draft.compressiveStrength,
      shearStrength: draft.shearStrength,
      status: (({ confirmed, total, demo }) => ({ confirmed, total, demo }))(inputStatus(draft.provenance, presentKeys(draft))),
    })),
    newMaterials: [...a.newMaterials.values()].map((m) => m.name).slice(0, MAX_ISSUES),
    newReferences: [...a.newReferences.values()].map((r) => r.title).slice(0, MAX_ISSUES),
  };
}

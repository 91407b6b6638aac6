// Step 4 of the property-set import: inside the caller's transaction, create the planned
// materials and references, then every row as a draft with one INSERT … SELECT … FROM unnest()
// per chunk. The statement's columns are not listed by hand: each row's draft goes through the
// desk's own draft → table mapping (valuesOf), so whatever the CSV columns fill reaches the table,
// and the SQL names and types come from the PropertySet model.
import type { Transaction } from 'sequelize';
import { Material, PropertySet, Reference } from '../../../db/models';
import { referenceFields } from '../../references/service';
import { sequelize } from '../../../db/sequelize';
import { nextSetIds, valuesOf, type Actor } from '../service';
import { materialKey, referenceKey, type Analysis, type PlannedRow } from './plan';

/** Rows per INSERT statement inside the import's one transaction. */
export const INSERT_CHUNK = 5_000;

type Values = ReturnType<typeof valuesOf>;

/** PostgreSQL array element type of each model data type the drafts use. */
const SQL_TYPE: Record<string, string> = { 'DOUBLE PRECISION': 'float8', TEXT: 'text', INTEGER: 'integer', JSONB: 'jsonb' };

interface Bound {
  /** Bind parameter and unnest() column name. */
  name: string;
  /** Column of property_sets. */
  field: string;
  sqlType: string;
  /** The value for one planned row; `index` counts the planned rows of the whole file. */
  pick: (row: PlannedRow, values: Values, index: number) => unknown;
}

/** One array parameter per table column the drafts fill, built from the stored values of a draft. */
function boundColumns(sample: Values, ids: number[], materialIds: Map<string, number>, referenceIds: Map<string, number>): Bound[] {
  const attributes = PropertySet.getAttributes();
  const fromDraft = (Object.keys(sample) as (keyof Values)[]).map((key): Bound => {
    const attribute = attributes[key];
    const typeKey = (attribute.type as { key?: string }).key ?? String(attribute.type);
    const sqlType = SQL_TYPE[typeKey];
    if (!sqlType) throw new Error(`CSV import: no SQL array type for ${key} (${typeKey})`);
    const field = attribute.field ?? key;
    return { name: field, field, sqlType, pick: (_, v) => (sqlType === 'jsonb' ? v[key] : (v[key] ?? null)) };
  });
  return [
    { name: 'id', field: 'id', sqlType: 'integer', pick: (_, __, i) => ids[i] },
    { name: 'material_id', field: 'material_id', sqlType: 'integer', pick: (p) => materialIds.get(p.materialKey)! },
    { name: 'reference_id', field: 'reference_id', sqlType: 'integer', pick: (p) => referenceIds.get(p.referenceKey)! },
    ...fromDraft,
  ];
}

/** Writes the analysis's new materials, references and drafts; returns the new set ids in row order. */
export async function insertPlanned(a: Analysis, actor: Actor, transaction: Transaction): Promise<number[]> {
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
    const created = await Reference.bulkCreate(
      [...a.newReferences.values()].map((r) => ({ ...referenceFields({ ...r, note: undefined }), createdById: actor.id })),
      { transaction, returning: true },
    );
    for (const r of created) referenceIds.set(referenceKey(r.title, r.identifier), r.id);
  }

  const ids = await nextSetIds(transaction, a.planned.length);
  if (!ids.length) return ids;
  const values = a.planned.map((p) => valuesOf(p.draft));
  const columns = boundColumns(values[0], ids, materialIds, referenceIds);
  // A JSON column goes as ONE JSON array document per chunk, parsed once and read by position
  // (the row's ordinality): as a text[] of documents, the array literal's quoting of every JSON
  // quote cost several times more (about 350 against 70 ms per 5,000 provenance documents here).
  const scalar = columns.filter((c) => c.sqlType !== 'jsonb');
  const elementOf = (c: Bound) => (c.sqlType === 'jsonb' ? `($${c.name}::jsonb -> (r.ord - 1)::integer)` : `r.${c.field}`);
  // One INSERT per chunk: each varying column goes as one array parameter and PostgreSQL zips
  // them with unnest(); what every row shares is a constant in the statement. Building 50,000
  // model instances for bulkCreate cost seconds more (see DEVELOPERS.md). Raw SQL skips the
  // model hooks, so the caller drops the catalogue snapshot after the commit.
  const sql = `INSERT INTO property_sets (lineage_id, ${columns.map((c) => c.field).join(', ')},
       status, version, drafted_by_id, last_edited_by_id, lock_version, created_at, updated_at)
     SELECT r.id, ${columns.map(elementOf).join(', ')}, 'draft', 1, $actor, $actor, 0, now(), now()
     FROM unnest(${scalar.map((c) => `$${c.name}::${c.sqlType}[]`).join(', ')}) WITH ORDINALITY AS r(${scalar.map((c) => c.field).join(', ')}, ord)`;

  for (let offset = 0; offset < a.planned.length; offset += INSERT_CHUNK) {
    const rows = a.planned.slice(offset, offset + INSERT_CHUNK);
    const bind: Record<string, unknown> = { actor: actor.id };
    for (const c of columns) {
      const picked = rows.map((p, i) => c.pick(p, values[offset + i], offset + i));
      bind[c.name] = c.sqlType === 'jsonb' ? JSON.stringify(picked) : picked;
    }
    await sequelize().query(sql, { transaction, bind });
  }
  return ids;
}

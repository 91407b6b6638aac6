import { readFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import type { Transaction } from 'sequelize';
import { ROOT_DIR } from '../../config/env';
import { Material, PropertySet, RatingTable, Reference } from '../models';
import { ratingTableContentSchema } from '../../../shared/schemas/rating-tables';
import { citedVersionId } from '../../modules/references/versions';
import type { Provenance, ProvenanceInput } from '../../../shared/schemas/provenance';
import {
  materialInputSchema,
  propertyValuesSchema,
  referenceInputSchema,
} from '../../../shared/schemas/catalogue';

const seedFileSchema = z.object({
  references: z.array(referenceInputSchema.extend({ key: z.string().min(1) })),
  materials: z.array(materialInputSchema.extend({ key: z.string().min(1) })),
  propertySets: z.array(
    propertyValuesSchema.extend({ material: z.string(), reference: z.string(), condition: z.string().min(1) }),
  ),
});
export type SeedCatalogue = z.infer<typeof seedFileSchema>;

export function readSeedCatalogue(file = path.join(ROOT_DIR, 'data', 'catalogue.json')): SeedCatalogue {
  return seedFileSchema.parse(JSON.parse(readFileSync(file, 'utf8')));
}

/**
 * The seed's confirmations were made by checking each value against a public source (who and
 * where are in data/README.md); no librarian of this installation approved them, so none is named.
 */
const SEED_CHECK = { name: 'Seed catalogue check, 2 Dec 2026 (data/README.md)' };
const seedProvenance = (p: ProvenanceInput): Provenance =>
  Object.fromEntries(Object.entries(p).map(([k, v]) => [k, v.status === 'confirmed' ? { ...v, confirmedBy: SEED_CHECK, confirmedAt: '2026-12-02T00:00:00.000Z' } : v]));

/** Loads data/catalogue.json as published, version-1 sets. Runs only on an empty catalogue. */
export async function seedCatalogue(transaction: Transaction): Promise<number> {
  if ((await Material.count({ transaction })) > 0) return 0;
  const data = readSeedCatalogue();
  const referenceIds = new Map<string, number>();
  for (const { key, ...ref } of data.references) {
    const row = await Reference.create({ ...ref, authors: ref.authors ?? null, year: ref.year ?? null, identifier: ref.identifier ?? null, location: ref.location ?? null, note: ref.note ?? null, createdById: null }, { transaction });
    referenceIds.set(key, row.id);
  }
  const materialIds = new Map<string, number>();
  for (const { key, ...m } of data.materials) {
    const row = await Material.create({ ...m, description: m.description ?? null }, { transaction });
    materialIds.set(key, row.id);
  }
  const now = new Date();
  for (const { material, reference, serviceTemperature, ...values } of data.propertySets) {
    const materialId = materialIds.get(material);
    const referenceId = referenceIds.get(reference);
    if (!materialId || !referenceId) throw new Error(`Seed set "${values.condition}" names unknown material or reference`);
    const row = await PropertySet.create(
      {
        ...values,
        tensileYield: values.tensileYield ?? null,
        compressiveYield: values.compressiveYield ?? null,
        shearYield: values.shearYield ?? null,
        elongation: values.elongation ?? null,
        luminousTransmittance: values.luminousTransmittance ?? null,
        materialId,
        referenceId,
        referenceVersionId: await citedVersionId(referenceId, transaction),
        status: 'published',
        version: 1,
        lineageId: null,
        supersedesId: null,
        supersededById: null,
        serviceTempMin: serviceTemperature.min,
        serviceTempMax: serviceTemperature.max,
        draftedById: null,
        approvedById: null,
        publishedAt: now,
        retiredAt: null,
        provenance: seedProvenance(values.provenance),
      },
      { transaction },
    );
    await row.update({ lineageId: row.id }, { transaction });
  }
  return data.propertySets.length;
}

const ratingSeedSchema = z.object({
  ratingTables: z.array(
    z.looseObject({ key: z.string().min(1), reference: z.string().min(1), material: z.string().min(1), covers: z.array(z.string().min(1)) }),
  ),
});

/**
 * Loads data/rating-tables.json as published, version-1 tables, once (when no rating table
 * exists yet, so it also reaches a database seeded before rating tables existed). References a
 * table cites are found by title, or created from catalogue.json.
 */
export async function seedRatingTables(transaction: Transaction): Promise<number> {
  if ((await RatingTable.count({ transaction })) > 0 || (await Material.count({ transaction })) === 0) return 0;
  const file = ratingSeedSchema.parse(JSON.parse(readFileSync(path.join(ROOT_DIR, 'data', 'rating-tables.json'), 'utf8')));
  const catalogue = readSeedCatalogue();
  const now = new Date();
  for (const t of file.ratingTables) {
    const { key: _key, reference, material, covers, ...rest } = t;
    const content = ratingTableContentSchema.parse(rest);
    const refSeed = catalogue.references.find((r) => r.key === reference);
    const materialSeed = catalogue.materials.find((m) => m.key === material);
    if (!refSeed || !materialSeed) throw new Error(`Seed rating table "${content.name}" names an unknown reference or material`);
    const { key: _refKey, ...refValues } = refSeed;
    const [ref] = await Reference.findOrCreate({
      where: { title: refSeed.title },
      defaults: { ...refValues, authors: refValues.authors ?? null, year: refValues.year ?? null, identifier: refValues.identifier ?? null, location: refValues.location ?? null, note: refValues.note ?? null, createdById: null },
      transaction,
    });
    const mat = await Material.findOne({ where: { name: materialSeed.name }, transaction });
    if (!mat) throw new Error(`Seed rating table "${content.name}": material ${materialSeed.name} is not in the catalogue`);
    const sets = await PropertySet.findAll({ where: { materialId: mat.id, condition: covers }, attributes: ['id', 'lineageId'], transaction });
    if (sets.length !== new Set(covers).size) throw new Error(`Seed rating table "${content.name}" covers a set that is not in the catalogue`);
    const row = await RatingTable.create(
      {
        materialId: mat.id,
        referenceId: ref.id,
        referenceVersionId: await citedVersionId(ref.id, transaction),
        coversLineageIds: sets.map((s) => s.lineageId ?? s.id).sort((a, b) => a - b),
        name: content.name,
        geometry: content.geometry,
        includedAngle: content.includedAngle ?? null,
        limits: content.limits ?? null,
        grade: content.grade,
        note: content.note ?? null,
        data: content.data,
        status: 'published',
        version: 1,
        lineageId: null,
        supersedesId: null,
        supersededById: null,
        draftedById: null,
        lastEditedById: null,
        approvedById: null,
        publishedAt: now,
        retiredAt: null,
      },
      { transaction },
    );
    await row.update({ lineageId: row.id }, { transaction });
  }
  return file.ratingTables.length;
}

import { readFileSync } from 'node:fs';
import path from 'node:path';
import { z } from 'zod';
import type { Transaction } from 'sequelize';
import { ROOT_DIR } from '../../config/env';
import { Material, PropertySet, Reference } from '../models';
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
        elongation: values.elongation ?? null,
        luminousTransmittance: values.luminousTransmittance ?? null,
        materialId,
        referenceId,
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
      },
      { transaction },
    );
    await row.update({ lineageId: row.id }, { transaction });
  }
  return data.propertySets.length;
}

import { Material, PropertySet, Reference } from '../../db/models';
import type { PropertySetDto } from '../../../shared/schemas/catalogue';
import { candidateFromPropertySet } from '../../../shared/engine';
import type { CandidateMaterial } from '../../../shared/engine';
import { propertySetDto } from './service';

export interface CatalogueEntry {
  set: PropertySetDto;
  candidate: CandidateMaterial;
}

/**
 * The published catalogue, read once and kept in memory until a property set changes.
 * Model hooks on PropertySet (any save, update or destroy in this process) invalidate it,
 * so the library desk never has to remember to.
 */
let snapshot: Promise<CatalogueEntry[]> | undefined;
let generation = 0;

export function invalidateCatalogueSnapshot(): void {
  generation++;
  snapshot = undefined;
}

export function publishedCatalogue(): Promise<CatalogueEntry[]> {
  if (!snapshot) {
    const started = generation;
    const loading = PropertySet.findAll({
      where: { status: 'published' },
      include: [
        { model: Material, as: 'material', required: true },
        { model: Reference, as: 'reference' },
      ],
      order: [['id', 'ASC']],
    }).then((rows) =>
      rows.map((row) => {
        const set = propertySetDto(row);
        return { set, candidate: candidateFromPropertySet(set) };
      }),
    );
    snapshot = loading;
    // A failed read is not cached; a read that raced an invalidation is not kept either.
    loading.then(
      () => {
        if (generation !== started && snapshot === loading) snapshot = undefined;
      },
      () => {
        if (snapshot === loading) snapshot = undefined;
      },
    );
  }
  return snapshot;
}

let hooked = false;
export function watchPropertySetChanges(): void {
  if (hooked) return;
  for (const hook of ['afterSave', 'afterDestroy', 'afterBulkUpdate', 'afterBulkDestroy', 'afterBulkCreate'] as const) {
    PropertySet.addHook(hook, 'invalidate-catalogue-snapshot', () => invalidateCatalogueSnapshot());
  }
  hooked = true;
}

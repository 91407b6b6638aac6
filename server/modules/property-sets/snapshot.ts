import { Material, PropertySet, RatingTable, Reference, User } from '../../db/models';
import type { PropertySetDto } from '../../../shared/schemas/catalogue';
import { candidateFromPropertySet } from '../../../shared/engine';
import type { CandidateMaterial } from '../../../shared/engine';
import { citedVersionInclude, propertySetDto } from './service';
import { publishedRatingTables, tablesCovering, type PublishedRatingTable } from '../rating-tables/service';
import { announce, cachesUsable, onChange } from '../../services/change-feed';
import type { Transaction } from 'sequelize';

export interface CatalogueEntry {
  set: PropertySetDto;
  candidate: CandidateMaterial;
}

/**
 * The published catalogue, read once and kept in memory until it changes. Model hooks on the
 * models it is built from (property sets, rating tables, references, materials) announce every
 * write on the change feed in the write's transaction, so every process drops it after the
 * commit and the library desk never has to remember to. While the feed is not listening it is
 * read afresh for every use.
 */
let snapshot: Promise<{ entries: CatalogueEntry[]; tables: PublishedRatingTable[] }> | undefined;
let generation = 0;

/** Changes whenever the published catalogue may have changed; part of every cache key built on it. */
export const catalogueGeneration = (): number => generation;

export function invalidateCatalogueSnapshot(): void {
  generation++;
  snapshot = undefined;
}

onChange((change) => {
  if (change.kind === 'catalogue' || change.kind === 'everything') invalidateCatalogueSnapshot();
});

export function publishedCatalogue(): Promise<CatalogueEntry[]> {
  return loadSnapshot().then((s) => s.entries);
}

/** The published rating tables, from the same snapshot. */
export function publishedRatingTablesSnapshot(): Promise<PublishedRatingTable[]> {
  return loadSnapshot().then((s) => s.tables);
}

/** A property set as an engine candidate, with the published rating tables that cover it. */
export async function candidateForSet(set: PropertySetDto): Promise<CandidateMaterial> {
  const tables = await publishedRatingTablesSnapshot();
  return candidateFromPropertySet(set, tablesCovering(tables, set.material.id, set.lineageId ?? set.id));
}

function loadSnapshot(): Promise<{ entries: CatalogueEntry[]; tables: PublishedRatingTable[] }> {
  if (!cachesUsable()) return readSnapshot();
  if (!snapshot) {
    const started = generation;
    const loading = readSnapshot();
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

function readSnapshot(): Promise<{ entries: CatalogueEntry[]; tables: PublishedRatingTable[] }> {
  return Promise.all([
    PropertySet.findAll({
      where: { status: 'published' },
      include: [
        { model: Material, as: 'material', required: true },
        { model: Reference, as: 'reference' },
        citedVersionInclude(),
        { model: User, as: 'draftedBy', attributes: ['id', 'name'] },
        { model: User, as: 'approvedBy', attributes: ['id', 'name'] },
      ],
      order: [['id', 'ASC']],
    }),
    publishedRatingTables(),
  ]).then(([rows, tables]) => ({
    tables,
    entries: rows.map((row) => {
      const set = propertySetDto(row);
      return { set, candidate: candidateFromPropertySet(set, tablesCovering(tables, row.materialId, row.lineageId ?? row.id)) };
    }),
  }));
}

let hooked = false;
export function watchPropertySetChanges(): void {
  if (hooked) return;
  const announceCatalogue = (...args: unknown[]) => {
    // Instance hooks get (instance, options), bulk hooks (options): the options come last.
    const options = args[args.length - 1] as { transaction?: Transaction | null } | undefined;
    return announce({ kind: 'catalogue' }, options?.transaction);
  };
  for (const model of [PropertySet, RatingTable, Reference, Material]) {
    for (const hook of ['afterSave', 'afterDestroy', 'afterBulkUpdate', 'afterBulkDestroy', 'afterBulkCreate'] as const) {
      (model as unknown as { addHook(h: string, name: string, fn: (...args: unknown[]) => unknown): void }).addHook(hook, 'announce-catalogue', announceCatalogue);
    }
  }
  hooked = true;
}

const byText = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/**
 * The published sets matching a catalogue query, from the snapshot: the same filters and order
 * as the database path (family, material name, condition), without a query.
 */
export async function filterPublished(query: {
  family?: string;
  transparent?: boolean;
  tmin?: number;
  tmax?: number;
  q?: string;
  materialId?: number;
}): Promise<PropertySetDto[]> {
  const words = (query.q ?? '').toLowerCase().split(/\s+/).filter(Boolean).slice(0, 8);
  const out: PropertySetDto[] = [];
  for (const { set } of await publishedCatalogue()) {
    const m = set.material;
    if (query.family !== undefined && m.family !== query.family) continue;
    if (query.transparent !== undefined && m.transparent !== query.transparent) continue;
    if (query.materialId !== undefined && m.id !== query.materialId) continue;
    const st = set.serviceTemperature;
    if (query.tmin !== undefined && (st.min > query.tmin || st.max < query.tmin)) continue;
    if (query.tmax !== undefined && (st.max < query.tmax || st.min > query.tmax)) continue;
    if (words.length) {
      const fields = [set.condition, m.name, m.family, set.reference?.title ?? '', set.reference?.identifier ?? ''].map((f) => f.toLowerCase());
      if (!words.every((w) => fields.some((f) => f.includes(w)))) continue;
    }
    out.push(set);
  }
  return out.sort(
    (a, b) =>
      byText(a.material.family, b.material.family) ||
      byText(a.material.name, b.material.name) ||
      byText(a.condition, b.condition) ||
      b.version - a.version,
  );
}

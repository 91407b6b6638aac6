import { queryKeys } from '@/lib/query-keys';

/** GET /api/library/sets filters: no status = drafts and in-review; mine = drafted or last edited by me. */
export interface LibraryQueueFilters {
  status?: 'draft' | 'in-review';
  mine?: boolean;
}

/** Query keys of the library desk: one factory per kind of data. */
export const librarySetKeys = {
  ...queryKeys<LibraryQueueFilters>('library-sets'),
  changes: (id: number) => [...librarySetKeys.all, 'changes', id] as const,
  published: () => [...librarySetKeys.all, 'published'] as const,
};

export const libraryMaterialKeys = {
  all: ['library-materials'] as const,
  list: () => [...libraryMaterialKeys.all, 'list'] as const,
};

export const referenceKeys = {
  ...queryKeys('references'),
  list: (q: string) => [...referenceKeys.lists(), { q }] as const,
  /** Proposed changes waiting on the desk (GET /api/library/reference-versions). */
  proposed: (status?: 'draft' | 'in-review') => [...referenceKeys.all, 'proposed', { status }] as const,
};

/**
 * Roots of the catalogue feature's keys (its list and material pages). A desk step can change
 * what they show, so they are invalidated by prefix without importing across features.
 */
export const CATALOGUE_KEY_ROOTS = [['property-sets'], ['materials']] as const;

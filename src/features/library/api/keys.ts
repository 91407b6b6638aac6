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

/** GET /api/library/confirmations filters: the review queue (status), or one set's confirmations. */
export interface ConfirmationFilters {
  status?: 'proposed' | 'approved' | 'rejected';
  propertySetId?: number;
}

/** Proposed confirmations of published sets' values, and their decisions. */
export const confirmationKeys = {
  all: ['value-confirmations'] as const,
  list: (filters: ConfirmationFilters) => [...confirmationKeys.all, 'list', filters] as const,
};

/**
 * Roots of other features' keys that read the published catalogue: the catalogue's list and
 * material pages, and Evaluate's rankings (their inputs marks) and candidate sets. A desk step can
 * change what they show, so they are invalidated by prefix without importing across features.
 */
export const CATALOGUE_KEY_ROOTS = [['property-sets'], ['materials'], ['evaluate']] as const;

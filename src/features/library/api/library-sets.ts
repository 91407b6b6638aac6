import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DraftInput, LibrarySetDto, LibrarySetListDto, SetChangesDto } from '@shared/schemas/library';
import type { MaterialListDto, PropertySetListDto } from '@shared/schemas/catalogue';
import { CATALOGUE_KEY_ROOTS, libraryMaterialKeys, librarySetKeys, referenceKeys, type LibraryQueueFilters } from './keys';

export type { LibraryQueueFilters };

export const fetchLibrarySets = (filters: LibraryQueueFilters) =>
  api.get<LibrarySetListDto>('/library/sets', { status: filters.status, mine: filters.mine === undefined ? undefined : String(filters.mine) });

export const librarySetsQueryOptions = (filters: LibraryQueueFilters) =>
  queryOptions({ queryKey: librarySetKeys.list(filters), queryFn: () => fetchLibrarySets(filters), staleTime: 10_000 });

export const librarySetQueryOptions = (id: number) =>
  queryOptions({ queryKey: librarySetKeys.detail(id), queryFn: () => api.get<LibrarySetDto>(`/library/sets/${id}`), staleTime: 10_000 });

export const setChangesQueryOptions = (id: number) =>
  queryOptions({ queryKey: librarySetKeys.changes(id), queryFn: () => api.get<SetChangesDto>(`/library/sets/${id}/changes`) });

/** Published sets, for starting a revision from the desk. */
export const publishedSetsQueryOptions = () =>
  queryOptions({ queryKey: librarySetKeys.published(), queryFn: () => api.get<PropertySetListDto>('/property-sets', { status: 'published' }) });

export const materialsQueryOptions = () =>
  queryOptions({
    queryKey: libraryMaterialKeys.list(),
    queryFn: () => api.get<MaterialListDto>('/materials'),
    staleTime: 5 * 60_000,
  });

export const useLibrarySets = (filters: LibraryQueueFilters) => useQuery(librarySetsQueryOptions(filters));
export const useLibrarySet = (id: number) => useQuery(librarySetQueryOptions(id));
export const useSetChanges = (id: number, enabled = true) => useQuery({ ...setChangesQueryOptions(id), enabled });
export const usePublishedSets = (enabled = true) => useQuery({ ...publishedSetsQueryOptions(), enabled });
export const useMaterials = () => useQuery(materialsQueryOptions());

/** After any step the desk lists, the catalogue and the materials may all have changed. */
function useSettle() {
  const qc = useQueryClient();
  return (set?: LibrarySetDto) => {
    if (set) qc.setQueryData(librarySetKeys.detail(set.id), set);
    void qc.invalidateQueries({ queryKey: librarySetKeys.lists() });
    void qc.invalidateQueries({ queryKey: librarySetKeys.published() });
    void qc.invalidateQueries({ queryKey: libraryMaterialKeys.all });
    void qc.invalidateQueries({ queryKey: referenceKeys.all });
    for (const root of CATALOGUE_KEY_ROOTS) void qc.invalidateQueries({ queryKey: root });
  };
}

export function useCreateDraft() {
  const settle = useSettle();
  return useMutation({
    mutationFn: (draft: DraftInput) => api.post<LibrarySetDto>('/library/sets', draft),
    onSuccess: (set) => settle(set),
  });
}

export function useSaveDraft() {
  const settle = useSettle();
  return useMutation({
    mutationFn: ({ id, ...body }: { id: number; lockVersion: number; draft: DraftInput }) => api.put<LibrarySetDto>(`/library/sets/${id}`, body),
    onSuccess: (set) => settle(set),
  });
}

/** The review steps; each sends the lock version read, and the comment or reason where asked. */
export type SetStep =
  | { step: 'submit' | 'approve' | 'revise'; id: number; lockVersion: number }
  | { step: 'return'; id: number; lockVersion: number; comment: string }
  | { step: 'retire'; id: number; lockVersion: number; reason: string };

export function useSetStep() {
  const settle = useSettle();
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ step, id, ...body }: SetStep) => api.post<LibrarySetDto | undefined>(`/library/sets/${id}/${step}`, body),
    onSuccess: (result, { id }) => {
      // revise answers with the new draft; the other steps with the set itself (or nothing).
      settle(result && typeof result === 'object' && 'id' in result ? result : undefined);
      void qc.invalidateQueries({ queryKey: librarySetKeys.detail(id) });
      void qc.invalidateQueries({ queryKey: librarySetKeys.changes(id) });
    },
  });
}

/** Outcome of submitting several drafts: each is its own step (its own lock and audit entry). */
export interface BulkSubmitResult {
  submitted: number[];
  failed: { id: number; title: string; message: string }[];
}

/**
 * Submits drafts for review one after another, as the set page would one by one; a refusal
 * (stale, incomplete) is reported for that draft and the rest go on.
 */
export function useBulkSubmit() {
  const settle = useSettle();
  return useMutation({
    mutationFn: async (sets: readonly LibrarySetDto[]): Promise<BulkSubmitResult> => {
      const result: BulkSubmitResult = { submitted: [], failed: [] };
      for (const set of sets) {
        try {
          await api.post<LibrarySetDto>(`/library/sets/${set.id}/submit`, { lockVersion: set.lockVersion });
          result.submitted.push(set.id);
        } catch (err) {
          result.failed.push({ id: set.id, title: `${set.material.name} — ${set.condition}`, message: err instanceof Error ? err.message : 'The server did not answer.' });
        }
      }
      return result;
    },
    onSettled: () => settle(),
  });
}

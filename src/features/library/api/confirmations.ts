import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ConfirmationProposal, ConfirmationStepInput, ValueConfirmationDto } from '@shared/schemas/provenance';
import type { ItemsDto } from '@shared/schemas/responses';
import { CATALOGUE_KEY_ROOTS, confirmationKeys, librarySetKeys, type ConfirmationFilters } from './keys';

export type { ConfirmationFilters };

export const confirmationsQueryOptions = (filters: ConfirmationFilters) =>
  queryOptions({
    queryKey: confirmationKeys.list(filters),
    queryFn: () => api.get<ItemsDto<ValueConfirmationDto>>('/library/confirmations', { status: filters.status, propertySetId: filters.propertySetId }),
    staleTime: 10_000,
  });

export const useConfirmations = (filters: ConfirmationFilters) => useQuery(confirmationsQueryOptions(filters));

/** Proposes that one value of a published set stands in its source at the location given. */
export function useProposeConfirmation(setId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ConfirmationProposal) => api.post<ValueConfirmationDto>(`/library/sets/${setId}/confirmations`, input),
    // Only the queues change: the set's values and statuses stay as they are until approval.
    onSuccess: () => void qc.invalidateQueries({ queryKey: confirmationKeys.all }),
    // A refusal (already proposed by someone, the set no longer published) also means the list read is old.
    onError: () => void qc.invalidateQueries({ queryKey: confirmationKeys.all }),
  });
}

/**
 * Approves or rejects a confirmation. An approval marks the value confirmed on the set, so the
 * set page, the catalogue's material page and Evaluate's inputs marks are refreshed with it.
 */
export function useConfirmationStep() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: ConfirmationStepInput }) => api.post<ValueConfirmationDto>(`/library/confirmations/${id}/steps`, input),
    onSuccess: (done) => {
      void qc.invalidateQueries({ queryKey: confirmationKeys.all });
      if (done.status !== 'approved') return;
      void qc.invalidateQueries({ queryKey: librarySetKeys.detail(done.propertySetId) });
      void qc.invalidateQueries({ queryKey: librarySetKeys.lists() });
      void qc.invalidateQueries({ queryKey: librarySetKeys.published() });
      for (const root of CATALOGUE_KEY_ROOTS) void qc.invalidateQueries({ queryKey: root });
    },
  });
}

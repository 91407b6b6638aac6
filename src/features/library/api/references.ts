import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { ReferenceInput } from '@shared/schemas/catalogue';
import type { ReferenceDetailDto, ReferenceListDto } from '@shared/schemas/library';
import { CATALOGUE_KEY_ROOTS, librarySetKeys, referenceKeys } from './keys';

export const referencesQueryOptions = (q: string) =>
  queryOptions({ queryKey: referenceKeys.list(q), queryFn: () => api.get<ReferenceListDto>('/references', { q }), staleTime: 30_000 });

export const useReferences = (q: string) => useQuery({ ...referencesQueryOptions(q), placeholderData: keepPreviousData });

/** Where a signed-in user downloads a reference's document (a plain link: the browser saves it). */
export const documentUrl = (referenceId: number) => `/api/references/${referenceId}/document`;

function useSettle() {
  const qc = useQueryClient();
  return (ref: ReferenceDetailDto) => {
    qc.setQueryData(referenceKeys.detail(ref.id), ref);
    void qc.invalidateQueries({ queryKey: referenceKeys.lists() });
    // Sets show their reference, so the catalogue and desk views refresh too.
    void qc.invalidateQueries({ queryKey: librarySetKeys.all });
    for (const root of CATALOGUE_KEY_ROOTS) void qc.invalidateQueries({ queryKey: root });
  };
}

export function useCreateReference() {
  const settle = useSettle();
  return useMutation({ mutationFn: (input: ReferenceInput) => api.post<ReferenceDetailDto>('/references', input), onSuccess: settle });
}

export function useUpdateReference(id: number) {
  const settle = useSettle();
  return useMutation({
    mutationFn: (body: { lockVersion: number; reference: ReferenceInput }) => api.put<ReferenceDetailDto>(`/references/${id}`, body),
    onSuccess: settle,
  });
}

export function useUploadDocument(id: number) {
  const settle = useSettle();
  return useMutation({
    mutationFn: ({ file, onProgress, signal }: { file: File; onProgress: (loaded: number, total: number) => void; signal?: AbortSignal }) => {
      const form = new FormData();
      form.append('file', file, file.name);
      return api.upload<ReferenceDetailDto>(`/references/${id}/document`, form, { onProgress, signal });
    },
    onSuccess: settle,
  });
}

export const referenceQueryOptions = (id: number) =>
  queryOptions({ queryKey: referenceKeys.detail(id), queryFn: () => api.get<ReferenceDetailDto>(`/references/${id}`) });

export const useReference = (id: number | null) => useQuery({ ...referenceQueryOptions(id ?? 0), enabled: id !== null });

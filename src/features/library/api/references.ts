import { keepPreviousData, queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { useSaveMutation } from '@/lib/query-client';
import { api } from '@/lib/api-client';
import type { ReferenceInput } from '@shared/schemas/catalogue';
import type { ReferenceListDto, ReferencePageDto, ReferenceVersionStepInput, PendingReferenceVersionDto } from '@shared/schemas/library';
import type { ItemsDto } from '@shared/schemas/responses';
import { CATALOGUE_KEY_ROOTS, librarySetKeys, referenceKeys } from './keys';

export const referencesQueryOptions = (q: string) =>
  queryOptions({ queryKey: referenceKeys.list(q), queryFn: () => api.get<ReferenceListDto>('/references', { q }), staleTime: 30_000 });

export const useReferences = (q: string) => useQuery({ ...referencesQueryOptions(q), placeholderData: keepPreviousData });

/** Where a signed-in user downloads a reference's latest document (a plain link: the browser saves it). */
export const documentUrl = (referenceId: number) => `/api/references/${referenceId}/document`;
/** Where one document version is downloaded. */
export const documentVersionUrl = (referenceId: number, version: number) => `/api/references/${referenceId}/documents/${version}`;

/** The saved reference page goes into the cache; the lists, the proposed changes and the sets that show it refresh. */
function referenceSaved(qc: QueryClient, ref: ReferencePageDto) {
  qc.setQueryData(referenceKeys.detail(ref.id), ref);
  void qc.invalidateQueries({ queryKey: referenceKeys.lists() });
  void qc.invalidateQueries({ queryKey: [...referenceKeys.all, 'proposed'] });
  // Sets show their reference, so the catalogue and desk views refresh too.
  void qc.invalidateQueries({ queryKey: librarySetKeys.all });
  for (const root of CATALOGUE_KEY_ROOTS) void qc.invalidateQueries({ queryKey: root });
}

const useReferenceMutation = <V>(mutationFn: (vars: V) => Promise<ReferencePageDto>) => useSaveMutation(mutationFn, referenceSaved);

export const useCreateReference = () => useReferenceMutation((input: ReferenceInput) => api.post<ReferencePageDto>('/references', input));

/** Saves a reference: in place when not in use; otherwise the server keeps it as a proposed new version. */
export const useUpdateReference = (id: number) =>
  useReferenceMutation((body: { lockVersion: number; reference: ReferenceInput }) => api.put<ReferencePageDto>(`/references/${id}`, body));

/** Saves a proposed change (a version in draft) again. */
export const useUpdateProposedVersion = (id: number) =>
  useReferenceMutation(({ version, ...body }: { version: number; lockVersion: number; reference: ReferenceInput }) =>
    api.put<ReferencePageDto>(`/references/${id}/versions/${version}`, body),
  );

/** Submits, approves or returns a proposed change. */
export const useReferenceVersionStep = (id: number) =>
  useReferenceMutation(({ version, input }: { version: number; input: ReferenceVersionStepInput }) =>
    api.post<ReferencePageDto>(`/references/${id}/versions/${version}/steps`, input),
  );

export const useUploadDocument = (id: number) =>
  useReferenceMutation(({ file, onProgress, signal }: { file: File; onProgress: (loaded: number, total: number) => void; signal?: AbortSignal }) => {
    const form = new FormData();
    form.append('file', file, file.name);
    return api.upload<ReferencePageDto>(`/references/${id}/document`, form, { onProgress, signal });
  });

export const referenceQueryOptions = (id: number) =>
  queryOptions({ queryKey: referenceKeys.detail(id), queryFn: () => api.get<ReferencePageDto>(`/references/${id}`) });

export const useReference = (id: number | null) => useQuery({ ...referenceQueryOptions(id ?? 0), enabled: id !== null });

/** Proposed reference changes on the desk: in review (the review queue), or drafts and reviews. */
export const proposedVersionsQueryOptions = (status?: 'draft' | 'in-review') =>
  queryOptions({
    queryKey: referenceKeys.proposed(status),
    queryFn: () => api.get<ItemsDto<PendingReferenceVersionDto>>('/library/reference-versions', status ? { status } : {}),
  });

export const useProposedVersions = (status?: 'draft' | 'in-review') => useQuery(proposedVersionsQueryOptions(status));

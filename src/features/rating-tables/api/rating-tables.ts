import { queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { useSaveMutation } from '@/lib/query-client';
import { api, upload } from '@/lib/api-client';
import type { RatingTableCsvDto, RatingTableData, RatingTableDraftInput, RatingTableDto, RatingTableListDto, RatingTableStepInput } from '@shared/schemas/rating-tables';
import { queryKeys } from '@/lib/query-keys';

export interface RatingTableFilters {
  materialId?: number;
  status?: 'draft' | 'in-review' | 'published' | 'retired' | 'open';
}

/** Query keys of rating tables: one factory. */
export const ratingTableKeys = queryKeys<RatingTableFilters>('rating-tables');

export const ratingTablesQueryOptions = (filters: RatingTableFilters) =>
  queryOptions({ queryKey: ratingTableKeys.list(filters), queryFn: () => api.get<RatingTableListDto>('/rating-tables', { ...filters }), staleTime: 30_000 });

export const ratingTableQueryOptions = (id: number) =>
  queryOptions({ queryKey: ratingTableKeys.detail(id), queryFn: () => api.get<RatingTableDto>(`/rating-tables/${id}`), staleTime: 10_000 });

export const useRatingTables = (filters: RatingTableFilters, enabled = true) => useQuery({ ...ratingTablesQueryOptions(filters), enabled });
export const useRatingTable = (id: number) => useQuery(ratingTableQueryOptions(id));

/** Evaluations and the catalogue read published tables: a step refreshes them all. */
const EVALUATION_KEY_ROOTS = [['evaluate'], ['property-sets'], ['materials']] as const;

/** The saved table goes into the cache; the lists and what evaluates with published tables refresh. */
function ratingTableSaved(qc: QueryClient, table: RatingTableDto) {
  qc.setQueryData(ratingTableKeys.detail(table.id), table);
  void qc.invalidateQueries({ queryKey: ratingTableKeys.lists() });
  for (const root of EVALUATION_KEY_ROOTS) void qc.invalidateQueries({ queryKey: root });
}

const useRatingTableMutation = <V>(mutationFn: (vars: V) => Promise<RatingTableDto>) => useSaveMutation(mutationFn, ratingTableSaved);

export const useCreateRatingTable = () => useRatingTableMutation((draft: RatingTableDraftInput) => api.post<RatingTableDto>('/rating-tables', draft));

export const useUpdateRatingTable = (id: number) =>
  useRatingTableMutation((body: { lockVersion: number; draft: RatingTableDraftInput }) => api.put<RatingTableDto>(`/rating-tables/${id}`, body));

export const useRatingTableStep = (id: number) => useRatingTableMutation((input: RatingTableStepInput) => api.post<RatingTableDto>(`/rating-tables/${id}/steps`, input));

/** Reads a CSV grid on the server (nothing is written) and hands it to the editor. */
export function readRatingCsv(file: File, form: RatingTableData['form']): Promise<RatingTableCsvDto> {
  const body = new FormData();
  body.append('file', file);
  return upload<RatingTableCsvDto>(`/rating-tables/csv?form=${form}`, body);
}

export const ratingCsvTemplateUrl = (form: RatingTableData['form']) => `/api/rating-tables/csv-template?form=${form}`;

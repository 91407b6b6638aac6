import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { AwaitingCheckDto, DesignRecordDto, ShortlistDto } from '@shared/schemas/projects';
import type { ItemsDto } from '@shared/schemas/responses';
import { projectKeys, recordKeys, shortlistKeys } from './keys';

export const shortlistQueryOptions = (id: number) =>
  queryOptions({ queryKey: shortlistKeys.detail(id), queryFn: () => api.get<ShortlistDto>(`/shortlists/${id}`), staleTime: 5_000 });

export const designRecordQueryOptions = (id: number) =>
  queryOptions({ queryKey: recordKeys.detail(id), queryFn: () => api.get<DesignRecordDto>(`/records/${id}`), staleTime: 60_000 });

export const awaitingCheckQueryOptions = () =>
  queryOptions({ queryKey: shortlistKeys.awaitingCheck(), queryFn: () => api.get<ItemsDto<AwaitingCheckDto>>('/shortlists/awaiting-check'), staleTime: 10_000 });

export const useShortlist = (id: number) => useQuery(shortlistQueryOptions(id));
export const useAwaitingCheck = (enabled = true) => useQuery({ ...awaitingCheckQueryOptions(), enabled });
export const useDesignRecord = (id: number) => useQuery(designRecordQueryOptions(id));

/** The link the browser follows to download a record's PDF (the session cookie goes with it). */
export const designRecordPdfUrl = (id: number) => `/api/records/${id}/pdf`;

/** Every shortlist step answers with the whole shortlist: cache it and refresh its project's lists. */
function useSettleShortlist() {
  const qc = useQueryClient();
  return (shortlist: ShortlistDto) => {
    qc.setQueryData(shortlistKeys.detail(shortlist.id), shortlist);
    void qc.invalidateQueries({ queryKey: projectKeys.detail(shortlist.projectId) });
    void qc.invalidateQueries({ queryKey: projectKeys.list() });
    void qc.invalidateQueries({ queryKey: shortlistKeys.awaitingCheck() });
  };
}

export type ShortlistStep =
  | { step: 'note'; itemId: number; note: string; lockVersion: number }
  | { step: 'remove'; itemId: number }
  | { step: 'reorder'; lockVersion: number; itemIds: number[] }
  | { step: 'submit'; lockVersion: number }
  | { step: 'check'; lockVersion: number; comment?: string }
  | { step: 'return'; lockVersion: number; comment: string };

function send(id: number, s: ShortlistStep): Promise<ShortlistDto> {
  switch (s.step) {
    case 'note':
      return api.patch<ShortlistDto>(`/shortlists/${id}/items/${s.itemId}`, { note: s.note, lockVersion: s.lockVersion });
    case 'remove':
      return api.delete<ShortlistDto>(`/shortlists/${id}/items/${s.itemId}`);
    case 'reorder':
      return api.post<ShortlistDto>(`/shortlists/${id}/reorder`, { lockVersion: s.lockVersion, itemIds: s.itemIds });
    case 'submit':
      return api.post<ShortlistDto>(`/shortlists/${id}/submit`, { lockVersion: s.lockVersion });
    case 'check':
      return api.post<ShortlistDto>(`/shortlists/${id}/check`, { lockVersion: s.lockVersion, ...(s.comment ? { comment: s.comment } : {}) });
    case 'return':
      return api.post<ShortlistDto>(`/shortlists/${id}/return`, { lockVersion: s.lockVersion, comment: s.comment });
  }
}

export function useShortlistStep(id: number) {
  const settle = useSettleShortlist();
  return useMutation({ mutationFn: (s: ShortlistStep) => send(id, s), onSuccess: settle });
}

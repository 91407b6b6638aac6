import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { EvaluateRequest } from '@shared/schemas/evaluate';
import type { LoadCaseDto, ProjectDto, ShortlistDto, ShortlistSummaryDto } from '@shared/schemas/projects';
import type { ItemsDto } from '@shared/schemas/responses';
import { evaluateKeys } from './evaluate';

/**
 * What Evaluate needs of projects: open a saved load case, save one, and add a candidate to a
 * shortlist. The projects pages cache the same data under their own keys; their roots are
 * refreshed by prefix after a change here, without importing that feature.
 */
export const PROJECT_KEY_ROOTS = [['projects'], ['shortlists']] as const;

export const evaluateProjectKeys = {
  all: [...evaluateKeys.all, 'projects'] as const,
  list: () => [...evaluateProjectKeys.all, 'list'] as const,
  shortlists: (projectId: number) => [...evaluateProjectKeys.all, projectId, 'shortlists'] as const,
  loadCase: (id: number) => [...evaluateKeys.all, 'load-case', id] as const,
};

export const savedLoadCaseQueryOptions = (id: number) =>
  queryOptions({ queryKey: evaluateProjectKeys.loadCase(id), queryFn: () => api.get<LoadCaseDto>(`/load-cases/${id}`), staleTime: 30_000 });

export const myProjectsQueryOptions = () =>
  queryOptions({ queryKey: evaluateProjectKeys.list(), queryFn: () => api.get<ItemsDto<ProjectDto>>('/projects').then((r) => r.items), staleTime: 0 });

export const useSavedLoadCase = (id: number | null) => useQuery({ ...savedLoadCaseQueryOptions(id ?? 0), enabled: id !== null });
export const useMyProjects = (enabled = true) => useQuery({ ...myProjectsQueryOptions(), enabled });

/** Shortlists of a project the caller may still add to: their own, open or returned, for this load case. */
export function useShortlistChoices(projectId: number, loadCaseId: number, authorId: number, enabled: boolean) {
  return useQuery({
    queryKey: evaluateProjectKeys.shortlists(projectId),
    queryFn: () => api.get<ItemsDto<ShortlistSummaryDto>>(`/projects/${projectId}/shortlists`).then((r) => r.items),
    staleTime: 0,
    enabled,
    select: (items) => items.filter((s) => s.author.id === authorId && s.loadCaseId === loadCaseId && (s.status === 'open' || s.status === 'returned')),
  });
}

function useSettle() {
  const qc = useQueryClient();
  return () => {
    void qc.invalidateQueries({ queryKey: evaluateProjectKeys.all });
    for (const root of PROJECT_KEY_ROOTS) void qc.invalidateQueries({ queryKey: root });
  };
}

export type SaveLoadCase =
  | { mode: 'new'; projectId: number; name: string; notes: string; request: EvaluateRequest }
  | { mode: 'update'; loadCase: LoadCaseDto; name: string; notes: string; request: EvaluateRequest };

export function useSaveLoadCase() {
  const qc = useQueryClient();
  const settle = useSettle();
  return useMutation({
    mutationFn: (s: SaveLoadCase) => {
      const body = { name: s.name, notes: s.notes, loadCase: s.request.loadCase, ...(s.request.filters ? { filters: s.request.filters } : {}) };
      return s.mode === 'new'
        ? api.post<LoadCaseDto>(`/projects/${s.projectId}/load-cases`, body)
        : api.put<LoadCaseDto>(`/load-cases/${s.loadCase.id}`, { ...body, lockVersion: s.loadCase.lockVersion });
    },
    onSuccess: (lc) => {
      qc.setQueryData(evaluateProjectKeys.loadCase(lc.id), lc);
      settle();
    },
  });
}

export type AddToShortlist =
  | { to: 'existing'; shortlistId: number; propertySetId: number; note: string }
  | { to: 'new'; projectId: number; loadCaseId: number; name: string; propertySetId: number; note: string };

/** Adds a catalogue candidate to a shortlist, creating the shortlist first when asked. */
export function useAddToShortlist() {
  const settle = useSettle();
  return useMutation({
    mutationFn: async (a: AddToShortlist): Promise<ShortlistDto> => {
      const shortlistId =
        a.to === 'existing' ? a.shortlistId : (await api.post<ShortlistDto>(`/projects/${a.projectId}/shortlists`, { loadCaseId: a.loadCaseId, name: a.name })).id;
      return api.post<ShortlistDto>(`/shortlists/${shortlistId}/items`, { propertySetId: a.propertySetId, note: a.note });
    },
    onSettled: settle,
  });
}

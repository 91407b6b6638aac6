import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DesignRecordSummaryDto, LoadCaseDto, ProjectDto, ShortlistSummaryDto, UserSummaryDto } from '@shared/schemas/projects';
import type { ItemsDto } from '@shared/schemas/responses';
import { peopleKeys, projectKeys } from './keys';

export const projectsQueryOptions = () =>
  queryOptions({ queryKey: projectKeys.list(), queryFn: () => api.get<ItemsDto<ProjectDto>>('/projects').then((r) => r.items), staleTime: 10_000 });

export const projectQueryOptions = (id: number) =>
  queryOptions({ queryKey: projectKeys.detail(id), queryFn: () => api.get<ProjectDto>(`/projects/${id}`), staleTime: 10_000 });

export const projectLoadCasesQueryOptions = (id: number) =>
  queryOptions({
    queryKey: projectKeys.loadCases(id),
    queryFn: () => api.get<ItemsDto<LoadCaseDto>>(`/projects/${id}/load-cases`).then((r) => r.items),
    staleTime: 10_000,
  });

export const projectShortlistsQueryOptions = (id: number) =>
  queryOptions({
    queryKey: projectKeys.shortlists(id),
    queryFn: () => api.get<ItemsDto<ShortlistSummaryDto>>(`/projects/${id}/shortlists`).then((r) => r.items),
    staleTime: 10_000,
  });

export const projectRecordsQueryOptions = (id: number) =>
  queryOptions({
    queryKey: projectKeys.records(id),
    queryFn: () => api.get<ItemsDto<DesignRecordSummaryDto>>(`/projects/${id}/records`).then((r) => r.items),
    staleTime: 10_000,
  });

/** Active accounts that can be added to a project (needs project:write). */
export const peopleQueryOptions = () =>
  queryOptions({ queryKey: peopleKeys.list(), queryFn: () => api.get<ItemsDto<UserSummaryDto>>('/people').then((r) => r.items), staleTime: 60_000 });

export const useProjects = () => useQuery(projectsQueryOptions());
/** A project; pass 0 while its id is not known yet. */
export const useProject = (id: number) => useQuery({ ...projectQueryOptions(id), enabled: id > 0 });
export const useProjectLoadCases = (id: number) => useQuery(projectLoadCasesQueryOptions(id));
export const useProjectShortlists = (id: number) => useQuery(projectShortlistsQueryOptions(id));
export const useProjectRecords = (id: number) => useQuery(projectRecordsQueryOptions(id));
export const usePeople = (enabled: boolean) => useQuery({ ...peopleQueryOptions(), enabled });

/** A project answer replaces the cached project and refreshes the list (its counts and order). */
function useSettleProject() {
  const qc = useQueryClient();
  return (project: ProjectDto) => {
    qc.setQueryData(projectKeys.detail(project.id), project);
    void qc.invalidateQueries({ queryKey: projectKeys.list() });
  };
}

export function useCreateProject() {
  const settle = useSettleProject();
  return useMutation({
    mutationFn: (input: { name: string; description: string }) => api.post<ProjectDto>('/projects', input),
    onSuccess: settle,
  });
}

export function useUpdateProject(id: number) {
  const settle = useSettleProject();
  return useMutation({
    mutationFn: (input: { name: string; description: string; lockVersion: number }) => api.patch<ProjectDto>(`/projects/${id}`, input),
    onSuccess: settle,
  });
}

export function useAddMember(projectId: number) {
  const settle = useSettleProject();
  return useMutation({
    mutationFn: (userId: number) => api.post<ProjectDto>(`/projects/${projectId}/members`, { userId }),
    onSuccess: settle,
  });
}

export function useRemoveMember(projectId: number) {
  const settle = useSettleProject();
  return useMutation({
    mutationFn: (userId: number) => api.delete<ProjectDto>(`/projects/${projectId}/members/${userId}`),
    onSuccess: settle,
  });
}

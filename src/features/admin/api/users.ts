import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Role } from '@shared/schemas/auth';
import type { AdminUserDto, InvitationCreatedDto, InvitationDto } from '@shared/schemas/projects';
import type { ItemsDto } from '@shared/schemas/responses';

export const teamKeys = {
  all: ['team'] as const,
  users: () => [...teamKeys.all, 'users'] as const,
  invitations: () => [...teamKeys.all, 'invitations'] as const,
};

export const usersQueryOptions = () =>
  queryOptions({ queryKey: teamKeys.users(), queryFn: () => api.get<ItemsDto<AdminUserDto>>('/admin/users').then((r) => r.items), staleTime: 0 });

export const invitationsQueryOptions = () =>
  queryOptions({
    queryKey: teamKeys.invitations(),
    queryFn: () => api.get<ItemsDto<InvitationDto>>('/admin/invitations').then((r) => r.items),
    staleTime: 0,
  });

export const useUsers = () => useQuery(usersQueryOptions());
export const useInvitations = () => useQuery(invitationsQueryOptions());

export function useUpdateUser() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, ...change }: { id: number; role?: Role; active?: boolean }) => api.patch<AdminUserDto>(`/admin/users/${id}`, change),
    onSuccess: (user) => {
      qc.setQueryData<AdminUserDto[]>(teamKeys.users(), (list) => list?.map((u) => (u.id === user.id ? user : u)));
      void qc.invalidateQueries({ queryKey: teamKeys.users() });
    },
  });
}

export function useInvite() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: { email: string; role: Role }) => api.post<InvitationCreatedDto>('/admin/invitations', input),
    onSuccess: () => void qc.invalidateQueries({ queryKey: teamKeys.invitations() }),
  });
}

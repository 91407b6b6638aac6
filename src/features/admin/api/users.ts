import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Role } from '@shared/schemas/auth';
import type { AdminUserDto, InvitationCreatedDto, InvitationDto, SignInLockDto } from '@shared/schemas/projects';
import type { ItemsDto } from '@shared/schemas/responses';

export const teamKeys = {
  all: ['team'] as const,
  users: () => [...teamKeys.all, 'users'] as const,
  invitations: () => [...teamKeys.all, 'invitations'] as const,
  signInLocks: () => [...teamKeys.all, 'sign-in-locks'] as const,
};

export const usersQueryOptions = () =>
  queryOptions({ queryKey: teamKeys.users(), queryFn: () => api.get<ItemsDto<AdminUserDto>>('/admin/users').then((r) => r.items), staleTime: 0 });

export const invitationsQueryOptions = () =>
  queryOptions({
    queryKey: teamKeys.invitations(),
    queryFn: () => api.get<ItemsDto<InvitationDto>>('/admin/invitations').then((r) => r.items),
    staleTime: 0,
  });

export const signInLocksQueryOptions = () =>
  queryOptions({
    queryKey: teamKeys.signInLocks(),
    queryFn: () => api.get<ItemsDto<SignInLockDto>>('/admin/sign-in-locks').then((r) => r.items),
    staleTime: 0,
  });

export const useUsers = () => useQuery(usersQueryOptions());
export const useSignInLocks = () => useQuery(signInLocksQueryOptions());
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

export function useInvitationStep() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, step }: { id: number; step: 'revoke' | 'resend' }): Promise<InvitationDto | InvitationCreatedDto> =>
      step === 'revoke' ? api.post<InvitationDto>(`/admin/invitations/${id}/revoke`, {}) : api.post<InvitationCreatedDto>(`/admin/invitations/${id}/resend`, {}),
    onSuccess: () => void qc.invalidateQueries({ queryKey: teamKeys.invitations() }),
  });
}

export function useClearSignInLock() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => api.delete<void>(`/admin/sign-in-locks/${id}`),
    onSettled: () => void qc.invalidateQueries({ queryKey: teamKeys.signInLocks() }),
  });
}

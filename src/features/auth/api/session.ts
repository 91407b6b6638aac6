import { queryOptions, useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { LoginInput, Permission, SessionDto, SessionUserDto } from '@shared/schemas/auth';

export const authKeys = {
  all: ['auth'] as const,
  me: () => [...authKeys.all, 'me'] as const,
};

export async function fetchMe(): Promise<SessionUserDto | null> {
  try {
    const { user } = await api.get<SessionDto>('/auth/me');
    return user;
  } catch (err) {
    if (err instanceof ApiError && err.status === 401) return null;
    throw err;
  }
}

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: fetchMe, staleTime: 5 * 60_000 });

export const useMe = () => useQuery(meQueryOptions());

/** True when the signed-in user's role grants the permission (the server checks again). */
export function useCan(permission: Permission): boolean {
  const { data } = useMe();
  return !!data?.permissions.includes(permission);
}

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: LoginInput) => api.post<SessionDto>('/auth/login', input),
    onSuccess: ({ user }) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), user);
    },
  });
}

export function useSignOut() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api.post<void>('/auth/logout'),
    onSettled: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}

import { useMutation } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { SessionDto } from '@shared/schemas/auth';
import type { MessageDto } from '@shared/schemas/responses';

/** Account steps: all answer with a message or the new session's user; none is cached. */
export const useChangePassword = () =>
  useMutation({ mutationFn: (input: { currentPassword: string; newPassword: string }) => api.post<MessageDto>('/auth/password', input) });

export const useAcceptInvitation = () =>
  useMutation({ mutationFn: (input: { token: string; name: string; password: string }) => api.post<SessionDto>('/auth/invitations/accept', input) });

export const useRequestPasswordReset = () =>
  useMutation({ mutationFn: (input: { email: string }) => api.post<MessageDto>('/auth/password-reset/request', input) });

export const useResetPassword = () =>
  useMutation({ mutationFn: (input: { token: string; password: string }) => api.post<MessageDto>('/auth/password-reset', input) });

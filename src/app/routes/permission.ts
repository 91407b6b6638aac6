import type { Permission } from '@shared/schemas/auth';
import { queryClient } from '@/lib/query-client';
import { ApiError } from '@/lib/api-client';
import { meQueryOptions } from '@/features/auth/api/session';

/**
 * Loader guard for pages one role may not use (the server refuses their data anyway). Without a
 * session it does nothing: the shell's loader sends the visitor to sign-in.
 */
export async function requirePermission(permission: Permission): Promise<void> {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (me && !me.permissions.includes(permission)) {
    throw new ApiError(403, 'forbidden', 'Your role cannot open this page. An administrator can change roles.');
  }
}

import { ROLES, ROLE_LABELS, ROLE_PERMISSIONS, type Permission } from '@shared/schemas/auth';
import { queryClient } from '@/lib/query-client';
import { ApiError } from '@/lib/api-client';
import { meQueryOptions } from '@/features/auth/api/session';

/** What each guarded page is for, in the words of the refusal. */
const PURPOSE: Record<Permission, string> = {
  'catalogue:read': 'The catalogue',
  evaluate: 'Evaluating load cases',
  'project:read': 'Projects',
  'project:write': 'Creating and changing projects',
  'design-record:export': 'Exporting design records',
  'shortlist:check': 'Checking shortlists',
  'catalogue:draft': 'The Library desk',
  'catalogue:approve': 'Approving drafts',
  'users:manage': 'Team administration',
  'audit:read': 'The audit log',
  'mail:read': 'The caught e-mail',
};

/** "Evaluating load cases is for engineers, checkers, librarians and administrators; your role is Viewer." */
export function refusalText(permission: Permission, role: keyof typeof ROLE_LABELS): string {
  const allowed = ROLES.filter((r) => ROLE_PERMISSIONS[r].includes(permission)).map((r) => `${ROLE_LABELS[r].toLowerCase()}s`);
  const list = allowed.length > 1 ? `${allowed.slice(0, -1).join(', ')} and ${allowed[allowed.length - 1]}` : allowed.join('');
  return `${PURPOSE[permission]} is for ${list}; your role is ${ROLE_LABELS[role]}. An administrator can change roles.`;
}

/**
 * Loader guard for pages one role may not use (the server refuses their data anyway). Without a
 * session it does nothing: the shell's loader sends the visitor to sign-in. The refusal shows
 * inside the app's frame (the router's errorElement below the shell), saying who may use the page.
 */
export async function requirePermission(permission: Permission): Promise<void> {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (me && !me.permissions.includes(permission)) throw new ApiError(403, 'forbidden', refusalText(permission, me.role));
}

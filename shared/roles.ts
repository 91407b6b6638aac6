/**
 * Roles and what each may do, without any dependency: the client's first page imports this, so it
 * stays free of the validation library. The server checks these on every route; the client uses
 * the same table only to hide what the server would refuse.
 */
export const ROLES = ['viewer', 'engineer', 'checker', 'librarian', 'admin'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  viewer: 'Viewer',
  engineer: 'Engineer',
  checker: 'Checker',
  librarian: 'Librarian',
  admin: 'Administrator',
};

/**
 * What each role may do. The server checks these on every route; the client uses the
 * same table only to hide what the server would refuse.
 */
export const PERMISSIONS = [
  'catalogue:read',
  'evaluate',
  'project:read',
  'project:write',
  'design-record:export',
  'shortlist:check',
  'catalogue:draft',
  'catalogue:approve',
  'users:manage',
  'audit:read',
  'mail:read',
] as const;
export type Permission = (typeof PERMISSIONS)[number];

const VIEWER: Permission[] = ['catalogue:read', 'project:read'];
const ENGINEER: Permission[] = [...VIEWER, 'evaluate', 'project:write', 'design-record:export'];

export const ROLE_PERMISSIONS: Record<Role, readonly Permission[]> = {
  viewer: VIEWER,
  engineer: ENGINEER,
  checker: [...ENGINEER, 'shortlist:check'],
  librarian: [...VIEWER, 'evaluate', 'catalogue:draft', 'catalogue:approve'],
  admin: [...PERMISSIONS],
};

export function can(role: Role | undefined | null, permission: Permission): boolean {
  return !!role && ROLE_PERMISSIONS[role].includes(permission);
}


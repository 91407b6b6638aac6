import { z } from 'zod';

export { ROLES, ROLE_LABELS, PERMISSIONS, ROLE_PERMISSIONS, can } from '../roles';
export type { Role, Permission } from '../roles';
import { ROLES, type Permission, type Role } from '../roles';

export const roleSchema = z.enum(ROLES);

export const loginSchema = z.strictObject({
  email: z.string().trim().toLowerCase().pipe(z.email('Enter a valid e-mail address')).pipe(z.string().max(254)),
  password: z.string().min(1, 'Enter your password').max(200),
});
export type LoginInput = z.infer<typeof loginSchema>;

export interface SessionUserDto {
  id: number;
  email: string;
  name: string;
  role: Role;
  permissions: Permission[];
}

/** The answer to sign-in, GET /api/auth/me and accepting an invitation. */
export interface SessionDto {
  user: SessionUserDto;
}

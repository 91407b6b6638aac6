import { AuditPage } from '@/features/admin/components/audit-page';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('audit:read');
  return null;
}

export const Component = AuditPage;

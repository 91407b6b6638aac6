import { MailPage } from '@/features/admin/components/mail-page';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('mail:read');
  return null;
}

export const Component = MailPage;

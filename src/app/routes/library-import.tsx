import { ImportPage } from '@/features/library/components/import-page';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('catalogue:draft');
  return null;
}

export const Component = ImportPage;

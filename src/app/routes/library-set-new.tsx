import { queryClient } from '@/lib/query-client';
import { materialsQueryOptions } from '@/features/library/api/library-sets';
import { referencesQueryOptions } from '@/features/library/api/references';
import { NewSetPage } from '@/features/library/components/set-page';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('catalogue:draft');
  void queryClient.prefetchQuery(materialsQueryOptions());
  void queryClient.prefetchQuery(referencesQueryOptions(''));
  return null;
}

export const Component = NewSetPage;

import { queryClient } from '@/lib/query-client';
import { useCan } from '@/features/auth/api/session';
import { referencesQueryOptions } from '@/features/library/api/references';
import { ReferencesPage } from '@/features/library/components/references-page';
import { requirePermission } from './permission';

// Everyone who can read the catalogue may list references and download documents.
export async function loader() {
  await requirePermission('catalogue:read');
  void queryClient.prefetchQuery(referencesQueryOptions(''));
  return null;
}

export function Component() {
  return <ReferencesPage canDraft={useCan('catalogue:draft')} />;
}

import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { librarySetsQueryOptions } from '@/features/library/api/library-sets';
import { proposedVersionsQueryOptions } from '@/features/library/api/references';
import { LibraryHome } from '@/features/library/components/library-home';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('catalogue:draft');
  void queryClient.prefetchQuery(librarySetsQueryOptions({ mine: true }));
  void queryClient.prefetchQuery(librarySetsQueryOptions({ status: 'in-review' }));
  void queryClient.prefetchQuery(proposedVersionsQueryOptions());
  return null;
}

export function Component() {
  return <LibraryHome me={useMe().data} />;
}

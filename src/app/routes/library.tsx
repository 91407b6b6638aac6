import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { librarySetsQueryOptions } from '@/features/library/api/library-sets';
import { proposedVersionsQueryOptions } from '@/features/library/api/references';
import { confirmationsQueryOptions } from '@/features/library/api/confirmations';
import { LibraryHome } from '@/features/library/components/library-home';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('catalogue:draft');
  void queryClient.prefetchQuery(librarySetsQueryOptions({ mine: true }));
  void queryClient.prefetchQuery(librarySetsQueryOptions({ status: 'in-review' }));
  void queryClient.prefetchQuery(proposedVersionsQueryOptions());
  void queryClient.prefetchQuery(confirmationsQueryOptions({ status: 'proposed' }));
  return null;
}

export function Component() {
  return <LibraryHome me={useMe().data} />;
}

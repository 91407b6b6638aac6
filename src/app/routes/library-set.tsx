import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { librarySetQueryOptions } from '@/features/library/api/library-sets';
import { confirmationsQueryOptions } from '@/features/library/api/confirmations';
import { SetPage } from '@/features/library/components/set-page';
import { detailLoader } from './detail-loader';

export const loader = detailLoader('catalogue:draft', (id) => {
  void queryClient.prefetchQuery(librarySetQueryOptions(id));
  void queryClient.prefetchQuery(confirmationsQueryOptions({ propertySetId: id }));
});

export function Component() {
  return <SetPage me={useMe().data} />;
}

import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { librarySetQueryOptions } from '@/features/library/api/library-sets';
import { SetPage } from '@/features/library/components/set-page';
import { detailLoader } from './detail-loader';

export const loader = detailLoader('catalogue:draft', (id) => void queryClient.prefetchQuery(librarySetQueryOptions(id)));

export function Component() {
  return <SetPage me={useMe().data} />;
}

import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { ratingTableQueryOptions } from '@/features/rating-tables/api/rating-tables';
import { RatingTablePage } from '@/features/rating-tables/components/rating-table-pages';
import { detailLoader } from './detail-loader';

export const loader = detailLoader('catalogue:draft', (id) => void queryClient.prefetchQuery(ratingTableQueryOptions(id)));

export function Component() {
  return <RatingTablePage me={useMe().data} />;
}

import type { LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { ratingTableQueryOptions } from '@/features/rating-tables/api/rating-tables';
import { RatingTablePage } from '@/features/rating-tables/components/rating-table-pages';
import { requirePermission } from './permission';

export async function loader({ params }: LoaderFunctionArgs) {
  await requirePermission('catalogue:draft');
  const id = Number(params.id);
  if (!Number.isSafeInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  void queryClient.prefetchQuery(ratingTableQueryOptions(id));
  return null;
}

export function Component() {
  return <RatingTablePage me={useMe().data} />;
}

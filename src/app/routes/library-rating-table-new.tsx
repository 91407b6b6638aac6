import { NewRatingTablePage } from '@/features/rating-tables/components/rating-table-pages';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('catalogue:draft');
  return null;
}

export function Component() {
  return <NewRatingTablePage />;
}

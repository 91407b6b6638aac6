import type { LoaderFunctionArgs } from 'react-router-dom';
import { useCan } from '@/features/auth/api/session';
import { queryClient } from '@/lib/query-client';
import { propertySetsQueryOptions } from '@/features/catalogue/api/property-sets';
import { filtersFromSearch, serverFilters } from '@/features/catalogue/filters';
import { CataloguePage } from '@/features/catalogue/components/catalogue-page';

export async function loader({ request }: LoaderFunctionArgs) {
  const filters = serverFilters(filtersFromSearch(new URL(request.url).searchParams));
  void queryClient.prefetchQuery(propertySetsQueryOptions(filters));
  return null;
}

export function Component() {
  return <CataloguePage canEvaluate={useCan('evaluate')} />;
}

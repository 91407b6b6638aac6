import type { LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { materialQueryOptions } from '@/features/catalogue/api/property-sets';
import { MaterialPage } from '@/features/catalogue/components/material-page';

export async function loader({ params }: LoaderFunctionArgs) {
  const id = Number(params.id);
  if (Number.isSafeInteger(id) && id > 0) void queryClient.prefetchQuery(materialQueryOptions(id));
  return null;
}

export const Component = MaterialPage;

import type { LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { librarySetQueryOptions } from '@/features/library/api/library-sets';
import { confirmationsQueryOptions } from '@/features/library/api/confirmations';
import { SetPage } from '@/features/library/components/set-page';
import { requirePermission } from './permission';

export async function loader({ params }: LoaderFunctionArgs) {
  await requirePermission('catalogue:draft');
  const id = Number(params.id);
  if (!Number.isSafeInteger(id) || id <= 0) throw new Response('Not found', { status: 404 });
  void queryClient.prefetchQuery(librarySetQueryOptions(id));
  void queryClient.prefetchQuery(confirmationsQueryOptions({ propertySetId: id }));
  return null;
}

export function Component() {
  return <SetPage me={useMe().data} />;
}

import type { LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { referenceQueryOptions } from '@/features/library/api/references';
import { ReferencePage } from '@/features/library/components/reference-page';
import { requirePermission } from './permission';
import { routeId } from './route-id';

// Everyone who can read the catalogue may open a reference in use; the server answers 404 for one
// cited only by drafts unless the caller may draft.
export async function loader({ params }: LoaderFunctionArgs) {
  await requirePermission('catalogue:read');
  void queryClient.prefetchQuery(referenceQueryOptions(routeId(params.id)));
  return null;
}

export function Component() {
  return <ReferencePage me={useMe().data} />;
}

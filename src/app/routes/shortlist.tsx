import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { shortlistQueryOptions } from '@/features/projects/api/shortlists';
import { ShortlistPage } from '@/features/projects/components/shortlist-page';
import { requirePermission } from './permission';
import { routeId } from './route-id';

export async function loader({ params }: LoaderFunctionArgs) {
  await requirePermission('project:read');
  void queryClient.prefetchQuery(shortlistQueryOptions(routeId(params.id)));
  return null;
}

export function Component() {
  const me = useMe().data;
  const id = routeId(useParams().id);
  return me ? <ShortlistPage key={id} id={id} me={me} /> : null;
}

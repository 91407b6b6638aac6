import { useParams } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { shortlistQueryOptions } from '@/features/projects/api/shortlists';
import { ShortlistPage } from '@/features/projects/components/shortlist-page';
import { detailLoader } from './detail-loader';
import { routeId } from './route-id';

export const loader = detailLoader('project:read', (id) => void queryClient.prefetchQuery(shortlistQueryOptions(id)));

export function Component() {
  const me = useMe().data;
  const id = routeId(useParams().id);
  return me ? <ShortlistPage key={id} id={id} me={me} /> : null;
}

import { useParams } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import {
  projectLoadCasesQueryOptions,
  projectQueryOptions,
  projectRecordsQueryOptions,
  projectShortlistsQueryOptions,
} from '@/features/projects/api/projects';
import { ProjectPage } from '@/features/projects/components/project-page';
import { detailLoader } from './detail-loader';
import { routeId } from './route-id';

export const loader = detailLoader('project:read', (id) => {
  void queryClient.prefetchQuery(projectQueryOptions(id));
  void queryClient.prefetchQuery(projectLoadCasesQueryOptions(id));
  void queryClient.prefetchQuery(projectShortlistsQueryOptions(id));
  void queryClient.prefetchQuery(projectRecordsQueryOptions(id));
});

export function Component() {
  const me = useMe().data;
  const id = routeId(useParams().id);
  return me ? <ProjectPage key={id} id={id} me={me} /> : null;
}

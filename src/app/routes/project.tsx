import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import {
  projectLoadCasesQueryOptions,
  projectQueryOptions,
  projectRecordsQueryOptions,
  projectShortlistsQueryOptions,
} from '@/features/projects/api/projects';
import { ProjectPage } from '@/features/projects/components/project-page';
import { requirePermission } from './permission';
import { routeId } from './route-id';

export async function loader({ params }: LoaderFunctionArgs) {
  await requirePermission('project:read');
  const id = routeId(params.id);
  void queryClient.prefetchQuery(projectQueryOptions(id));
  void queryClient.prefetchQuery(projectLoadCasesQueryOptions(id));
  void queryClient.prefetchQuery(projectShortlistsQueryOptions(id));
  void queryClient.prefetchQuery(projectRecordsQueryOptions(id));
  return null;
}

export function Component() {
  const me = useMe().data;
  const id = routeId(useParams().id);
  return me ? <ProjectPage key={id} id={id} me={me} /> : null;
}

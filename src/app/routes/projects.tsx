import { queryClient } from '@/lib/query-client';
import { useCan } from '@/features/auth/api/session';
import { projectsQueryOptions } from '@/features/projects/api/projects';
import { ProjectsPage } from '@/features/projects/components/projects-page';
import { requirePermission } from './permission';

export async function loader() {
  await requirePermission('project:read');
  void queryClient.prefetchQuery(projectsQueryOptions());
  return null;
}

export function Component() {
  return <ProjectsPage canCreate={useCan('project:write')} />;
}

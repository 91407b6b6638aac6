import { useParams, type LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useCan } from '@/features/auth/api/session';
import { designRecordQueryOptions } from '@/features/projects/api/shortlists';
import { RecordPage } from '@/features/projects/components/record-page';
import { requirePermission } from './permission';
import { routeId } from './route-id';

export async function loader({ params }: LoaderFunctionArgs) {
  await requirePermission('project:read');
  void queryClient.prefetchQuery(designRecordQueryOptions(routeId(params.id)));
  return null;
}

export function Component() {
  const canExport = useCan('design-record:export');
  const id = routeId(useParams().id);
  return <RecordPage key={id} id={id} canExport={canExport} />;
}

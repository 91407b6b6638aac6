import { useParams } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useCan } from '@/features/auth/api/session';
import { designRecordQueryOptions } from '@/features/projects/api/shortlists';
import { RecordPage } from '@/features/projects/components/record-page';
import { detailLoader } from './detail-loader';
import { routeId } from './route-id';

export const loader = detailLoader('project:read', (id) => void queryClient.prefetchQuery(designRecordQueryOptions(id)));

export function Component() {
  const canExport = useCan('design-record:export');
  const id = routeId(useParams().id);
  return <RecordPage key={id} id={id} canExport={canExport} />;
}

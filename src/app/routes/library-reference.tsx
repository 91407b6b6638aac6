import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { referenceQueryOptions } from '@/features/library/api/references';
import { ReferencePage } from '@/features/library/components/reference-page';
import { detailLoader } from './detail-loader';

// Everyone who can read the catalogue may open a reference in use; the server answers 404 for one
// cited only by drafts unless the caller may draft.
export const loader = detailLoader('catalogue:read', (id) => void queryClient.prefetchQuery(referenceQueryOptions(id)));

export function Component() {
  return <ReferencePage me={useMe().data} />;
}

import { Navigate } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { meQueryOptions, useMe } from '@/features/auth/api/session';
import { awaitingCheckQueryOptions } from '@/features/projects/api/shortlists';
import { WaitingPage } from '@/features/projects/components/waiting-page';

// Checkers land on what waits for them; everyone else on the catalogue.
export async function loader() {
  const me = await queryClient.ensureQueryData(meQueryOptions());
  if (me?.permissions.includes('shortlist:check')) void queryClient.prefetchQuery(awaitingCheckQueryOptions());
  return null;
}

export function Component() {
  const me = useMe().data;
  if (!me?.permissions.includes('shortlist:check')) return <Navigate to="/catalogue" replace />;
  return <WaitingPage name={me.name} />;
}

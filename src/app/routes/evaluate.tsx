import type { LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { savedLoadCaseQueryOptions } from '@/features/evaluate/api/project-links';
import { EvaluatePage } from '@/features/evaluate/components/evaluate-page';

// ?loadCase=<id> opens a load case saved in a project; start fetching it with the page.
export async function loader({ request }: LoaderFunctionArgs) {
  const raw = new URL(request.url).searchParams.get('loadCase');
  if (raw && /^[1-9]\d{0,9}$/.test(raw)) void queryClient.prefetchQuery(savedLoadCaseQueryOptions(Number(raw)));
  return null;
}

export function Component() {
  const me = useMe().data;
  return <EvaluatePage canSave={!!me?.permissions.includes('project:write')} meId={me?.id ?? 0} />;
}

import type { LoaderFunctionArgs } from 'react-router-dom';
import { queryClient } from '@/lib/query-client';
import { useMe } from '@/features/auth/api/session';
import { savedLoadCaseQueryOptions } from '@/features/evaluate/api/project-links';
import { EvaluatePage } from '@/features/evaluate/components/evaluate-page';
import { evaluateQueryOptions } from '@/features/evaluate/api/evaluate';
import { exampleRequest } from '@/features/evaluate/saved-load-case';
import { requirePermission } from './permission';

// ?loadCase=<id> opens a load case saved in a project; otherwise the example load case is ranked.
// Either way the request starts with the page, not after it renders.
export async function loader({ request }: LoaderFunctionArgs) {
  // A role that may not evaluate gets the refusal in place of the form, not a form that cannot work.
  await requirePermission('evaluate');
  const raw = new URL(request.url).searchParams.get('loadCase');
  if (raw && /^[1-9]\d{0,9}$/.test(raw)) void queryClient.prefetchQuery(savedLoadCaseQueryOptions(Number(raw)));
  else if (raw === null) void queryClient.prefetchQuery(evaluateQueryOptions(exampleRequest()));
  return null;
}

export function Component() {
  const me = useMe().data;
  return <EvaluatePage canSave={!!me?.permissions.includes('project:write')} meId={me?.id ?? 0} />;
}

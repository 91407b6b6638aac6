import { queryClient } from '@/lib/query-client';
import { openApiQueryOptions } from '@/features/api-docs/api/openapi';
import { ApiDocsPage } from '@/features/api-docs/components/api-docs-page';

// Every signed-in account may read how to call the API (the shell's loader ensures a session).
export async function loader() {
  void queryClient.prefetchQuery(openApiQueryOptions());
  return null;
}

export const Component = ApiDocsPage;

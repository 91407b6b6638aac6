import { QueryClient, useMutation, useQueryClient } from '@tanstack/react-query';
import { ApiError } from './api-client';

export const queryClient = new QueryClient({
  defaultOptions: {
    queries: {
      staleTime: 60_000,
      refetchOnWindowFocus: false,
      // Client errors will not go away by asking again.
      retry: (count, error) => !(error instanceof ApiError && error.status >= 400 && error.status < 500) && count < 2,
    },
  },
});

/**
 * A mutation answered with what was saved: `saved` puts it into the cache and refreshes what shows
 * it (the answer comes after the server's commit, so nothing is refreshed before it).
 */
export function useSaveMutation<V, D>(mutationFn: (vars: V) => Promise<D>, saved: (qc: QueryClient, data: D) => void) {
  const qc = useQueryClient();
  return useMutation({ mutationFn, onSuccess: (data: D) => saved(qc, data) });
}

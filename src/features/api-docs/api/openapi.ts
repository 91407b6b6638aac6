import { queryOptions, useQuery } from '@tanstack/react-query';
import { api, ApiError } from '@/lib/api-client';
import type { OpenApiDoc } from '../openapi-model';

export const apiDocKeys = {
  all: ['openapi'] as const,
  document: () => [...apiDocKeys.all, 'document'] as const,
};

/** The server's OpenAPI document; null when this server does not publish one (404). */
export const openApiQueryOptions = () =>
  queryOptions({
    queryKey: apiDocKeys.document(),
    queryFn: async (): Promise<OpenApiDoc | null> => {
      try {
        return await api.get<OpenApiDoc>('/openapi.json');
      } catch (err) {
        if (err instanceof ApiError && err.status === 404) return null;
        throw err;
      }
    },
    staleTime: 5 * 60_000,
  });

export const useOpenApi = () => useQuery(openApiQueryOptions());

/** Where a script can fetch the document itself. */
export const OPENAPI_URL = '/api/openapi.json';

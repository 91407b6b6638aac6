import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { EvaluateRequestInput } from '@shared/schemas/evaluate';
import { postEvaluation } from '@/lib/evaluate-client';
import type { PropertySetDto } from '@shared/schemas/catalogue';

export const evaluateKeys = {
  all: ['evaluate'] as const,
  run: (request: EvaluateRequestInput) => [...evaluateKeys.all, 'run', request] as const,
};

export const evaluateQueryOptions = (request: EvaluateRequestInput) =>
  queryOptions({
    queryKey: evaluateKeys.run(request),
    queryFn: () => postEvaluation(request),
    staleTime: 5 * 60_000,
  });

/** The ranked evaluation for a submitted request; keeps the last table while a new one loads. */
export function useEvaluation(request: EvaluateRequestInput | null) {
  return useQuery({
    ...evaluateQueryOptions(request ?? ({} as EvaluateRequestInput)),
    enabled: request !== null,
    placeholderData: keepPreviousData,
  });
}

/** A candidate's full property set, for the thickness sweep drawn in the browser. */
export const candidateSetQueryOptions = (propertySetId: number) =>
  queryOptions({
    queryKey: [...evaluateKeys.all, 'candidate-set', propertySetId] as const,
    queryFn: () => api.get<PropertySetDto>(`/property-sets/${propertySetId}`),
    staleTime: 10 * 60_000,
  });

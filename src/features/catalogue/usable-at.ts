import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ComponentType, EvaluateRequestInput } from '@shared/schemas/evaluate';
import { postEvaluation } from '@/lib/evaluate-client';
import { MAX_CANDIDATES } from '@shared/schemas/evaluate';
import { COMPONENT_LABELS } from '@shared/labels';

/**
 * "Usable at": a depth or pressure and a component, for which the catalogue keeps only the sets
 * with a finite required thickness there, worked out by the same evaluation the Evaluate page
 * runs (rating tables included). The component takes the Harrow Sound demo's dimensions.
 */
export interface UsableAt {
  component: Exclude<ComponentType, 'ring-stiffened-cylinder'>;
  depth?: number;
  pressure?: number;
}

export const USABLE_COMPONENTS: UsableAt['component'][] = ['flat-disc', 'conical-frustum', 'spherical-sector', 'sphere', 'cylinder'];

/** Harrow Sound's demo sizes (shared/demo-load-cases.ts and the Evaluate example), in SI. */
const GEOMETRY: Record<UsableAt['component'], EvaluateRequestInput['loadCase']['component']> = {
  'flat-disc': { type: 'flat-disc', diameter: 0.2, thickness: 0.05, edge: 'simply-supported' },
  'conical-frustum': { type: 'conical-frustum', minorDiameter: 0.15, thickness: 0.1, includedAngle: 90 },
  'spherical-sector': { type: 'spherical-sector', innerRadius: 0.1, thickness: 0.05, includedAngle: 90 },
  sphere: { type: 'sphere', innerRadius: 0.8, thickness: 0.05 },
  cylinder: { type: 'cylinder', innerRadius: 0.8, thickness: 0.05, length: 1.2 },
};

export const geometryText = (c: UsableAt['component']): string => {
  const g = GEOMETRY[c];
  const mm = (m: number) => `${Math.round(m * 1000)} mm`;
  const size =
    g.type === 'flat-disc' ? `${mm(g.diameter)} unsupported diameter, simply supported` : g.type === 'conical-frustum' ? `${mm(g.minorDiameter)} minor diameter, 90°` : g.type === 'spherical-sector' ? `${mm(g.innerRadius)} inner radius, 90°` : g.type === 'sphere' ? `${mm(g.innerRadius)} inner radius` : g.type === 'cylinder' ? `${mm(g.innerRadius)} inner radius, ${mm(g.length)} between stiffeners` : '';
  return `${COMPONENT_LABELS[c]}, ${size}`;
};

export function usableAtRequest(u: UsableAt, temperature: { min: number; max: number }): EvaluateRequestInput {
  return {
    loadCase: {
      pressure: u.depth !== undefined ? { depth: u.depth, latitude: 57, water: 'sea' } : { value: u.pressure ?? 0 },
      temperature,
      sustainedHours: 1000,
      cycles: 2000,
      component: GEOMETRY[u.component],
    },
    limit: MAX_CANDIDATES,
    sortBy: 'requiredThickness',
  };
}

export const usableAtKeys = {
  all: ['catalogue', 'usable-at'] as const,
  at: (request: EvaluateRequestInput) => [...usableAtKeys.all, request] as const,
};

/** Required thickness by property set id (null: no thickness suffices), or null while not asked. */
export function useUsableAt(u: UsableAt | null, temperature: { min: number; max: number }) {
  const request = u ? usableAtRequest(u, temperature) : null;
  return useQuery({
    ...queryOptions({
      queryKey: usableAtKeys.at(request ?? ({} as EvaluateRequestInput)),
      queryFn: async () => {
        const answer = await postEvaluation(request!);
        return new Map(answer.results.filter((r) => r.propertySetId !== undefined).map((r) => [r.propertySetId!, r.requiredThickness]));
      },
      staleTime: 5 * 60_000,
    }),
    enabled: request !== null,
  });
}

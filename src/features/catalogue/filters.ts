import { FAMILIES, type Family } from '@shared/schemas/catalogue';
import type { CatalogueFilters } from './api/property-sets';
import { USABLE_COMPONENTS, type UsableAt } from './usable-at';

/** Catalogue filters live in the URL so a filtered view can be shared and reloaded. */
export function filtersFromSearch(params: URLSearchParams): CatalogueFilters & { q?: string } {
  const family = params.get('family');
  const transparent = params.get('transparent');
  const num = (key: string) => {
    const raw = params.get(key);
    if (raw === null || raw.trim() === '') return undefined;
    const v = Number(raw);
    return Number.isFinite(v) ? v : undefined;
  };
  return {
    family: family && (FAMILIES as readonly string[]).includes(family) ? (family as Family) : undefined,
    transparent: transparent === 'true' ? true : transparent === 'false' ? false : undefined,
    tmin: num('tmin'),
    tmax: num('tmax'),
    q: params.get('q') ?? undefined,
  };
}

export function serverFilters(f: CatalogueFilters & { q?: string }): CatalogueFilters {
  const { family, transparent, tmin, tmax } = f;
  // A reversed range would be refused by the server; drop the upper bound until it is fixed.
  const validRange = tmin === undefined || tmax === undefined || tmin <= tmax;
  return { family, transparent, tmin, tmax: validRange ? tmax : undefined };
}

/** The "usable at" filter from the URL: ?usable=<component>&atDepth=<m> or &atPressure=<Pa>. */
export function usableFromSearch(params: URLSearchParams): UsableAt | null {
  const component = params.get('usable');
  if (!component || !(USABLE_COMPONENTS as readonly string[]).includes(component)) return null;
  const depth = Number(params.get('atDepth'));
  const pressure = Number(params.get('atPressure'));
  if (params.get('atDepth') && Number.isFinite(depth) && depth > 0 && depth <= 12_000) return { component: component as UsableAt['component'], depth };
  if (params.get('atPressure') && Number.isFinite(pressure) && pressure > 0 && pressure <= 2e9) return { component: component as UsableAt['component'], pressure };
  return null;
}

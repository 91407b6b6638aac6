import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Family, MaterialDetailDto, PropertySetListDto } from '@shared/schemas/catalogue';
import { queryKeys } from '@/lib/query-keys';

export interface CatalogueFilters {
  family?: Family;
  transparent?: boolean;
  tmin?: number;
  tmax?: number;
}

export const propertySetKeys = queryKeys<CatalogueFilters>('property-sets');

export const materialKeys = queryKeys('materials');

export const fetchPropertySets = (filters: CatalogueFilters) =>
  api.get<PropertySetListDto>('/property-sets', { ...filters });

export const propertySetsQueryOptions = (filters: CatalogueFilters) =>
  queryOptions({ queryKey: propertySetKeys.list(filters), queryFn: () => fetchPropertySets(filters) });

export const usePropertySets = (filters: CatalogueFilters) => useQuery(propertySetsQueryOptions(filters));

export const materialQueryOptions = (id: number) =>
  queryOptions({ queryKey: materialKeys.detail(id), queryFn: () => api.get<MaterialDetailDto>(`/materials/${id}`) });

export const useMaterial = (id: number) => useQuery(materialQueryOptions(id));

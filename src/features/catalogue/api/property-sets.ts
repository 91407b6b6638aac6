import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { Family, MaterialDetailDto, PropertySetListDto } from '@shared/schemas/catalogue';

export interface CatalogueFilters {
  family?: Family;
  transparent?: boolean;
  tmin?: number;
  tmax?: number;
}

export const propertySetKeys = {
  all: ['property-sets'] as const,
  lists: () => [...propertySetKeys.all, 'list'] as const,
  list: (filters: CatalogueFilters) => [...propertySetKeys.lists(), filters] as const,
  detail: (id: number) => [...propertySetKeys.all, 'detail', id] as const,
};

export const materialKeys = {
  all: ['materials'] as const,
  detail: (id: number) => [...materialKeys.all, 'detail', id] as const,
};

export const fetchPropertySets = (filters: CatalogueFilters) =>
  api.get<PropertySetListDto>('/property-sets', { ...filters });

export const propertySetsQueryOptions = (filters: CatalogueFilters) =>
  queryOptions({ queryKey: propertySetKeys.list(filters), queryFn: () => fetchPropertySets(filters) });

export const usePropertySets = (filters: CatalogueFilters) => useQuery(propertySetsQueryOptions(filters));

export const materialQueryOptions = (id: number) =>
  queryOptions({ queryKey: materialKeys.detail(id), queryFn: () => api.get<MaterialDetailDto>(`/materials/${id}`) });

export const useMaterial = (id: number) => useQuery(materialQueryOptions(id));

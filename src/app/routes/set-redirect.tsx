import { redirect, type LoaderFunctionArgs } from 'react-router-dom';
import { api } from '@/lib/api-client';
import type { PropertySetDto } from '@shared/schemas/catalogue';

/** /sets/:id → the material page with that set selected. */
export async function loader({ params }: LoaderFunctionArgs) {
  const set = await api.get<PropertySetDto>(`/property-sets/${encodeURIComponent(params.id ?? '')}`);
  return redirect(`/materials/${set.material.id}?set=${set.id}`);
}

export function Component() {
  return null;
}

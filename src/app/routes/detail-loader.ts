import type { LoaderFunctionArgs } from 'react-router-dom';
import type { Permission } from '@shared/schemas/auth';
import { requirePermission } from './permission';
import { routeId } from './route-id';

/**
 * The loader of a page about one thing: the permission guard, the id from the route (a 404 for
 * anything but a positive whole number), then `prefetch` starts the page's queries ahead of its render.
 */
export const detailLoader =
  (permission: Permission, prefetch: (id: number) => unknown) =>
  async ({ params }: LoaderFunctionArgs) => {
    await requirePermission(permission);
    prefetch(routeId(params.id));
    return null;
  };

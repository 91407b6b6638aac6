import type { Express, Router } from 'express';
import type { Access, Guard } from '../auth/authorize';

export interface ApiRoute {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete';
  /** Express form, e.g. /api/shortlists/:id/items/:itemId */
  path: string;
  /** The guard found on the route; null means the route declares none (a defect the tests catch). */
  access: Access | null;
}

interface Mount {
  base: string;
  router: Router;
}

type RouterLayer = { route?: { path: string; methods: Record<string, boolean>; stack: { handle: Partial<Guard> }[] } };

/** Mounts a feature router under /api and remembers it, so the route table can be read back. */
export function mountApi(app: Express, api: Router, base: string, router: Router): void {
  const mounts: Mount[] = (app.locals.apiMounts ??= []);
  mounts.push({ base, router });
  api.use(base, router);
}

/** Every API route with its method and guard, read from the mounted routers themselves. */
export function apiRoutes(app: Express): ApiRoute[] {
  const mounts: Mount[] = app.locals.apiMounts ?? [];
  const out: ApiRoute[] = [];
  for (const { base, router } of mounts) {
    for (const layer of (router as unknown as { stack: RouterLayer[] }).stack) {
      const route = layer.route;
      if (!route) continue;
      const guard = route.stack.find((l) => typeof l.handle?.access === 'string')?.handle?.access ?? null;
      for (const method of Object.keys(route.methods)) {
        if (method === '_all') continue;
        const path = `/api${base}${route.path === '/' ? '' : route.path}`;
        out.push({ method: method as ApiRoute['method'], path, access: guard });
      }
    }
  }
  return out;
}

/** /api/shortlists/:id → /api/shortlists/{id} */
export const openApiPath = (expressPath: string) => expressPath.replace(/:([A-Za-z]+)/g, '{$1}');

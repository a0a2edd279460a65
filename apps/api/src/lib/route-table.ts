import type { Express } from 'express';
import { guardOf, type RouteGuard } from '../middleware/require-role.ts';

export type RouteEntry = { method: string; path: string; guard: RouteGuard | null };

type Layer = {
  rawPath?: string | string[];
  route?: { path: string; methods: Record<string, boolean>; stack: Layer[] };
  handle: { stack?: Layer[] } & object;
};

/**
 * Every route the app serves, with the guard that admits its callers: the router's own middleware
 * (`router.use(requirePermission(…))`) or the route's (`r.get(path, requirePermission(…), …)`). The
 * access-control tests are generated from this, so they follow the routes as written.
 * Reads Express 5's router stack (router 2.x keeps each layer's path as `rawPath`).
 */
export function routeTable(app: Express): RouteEntry[] {
  const out: RouteEntry[] = [];
  const walk = (stack: Layer[], prefix: string, inherited: RouteGuard | null) => {
    let guard = inherited;
    for (const layer of stack) {
      if (layer.route) {
        const own = layer.route.stack.map((l) => guardOf(l.handle)).find(Boolean) ?? null;
        const path = (prefix + layer.route.path).replace(/(.)\/$/, '$1');
        for (const method of Object.keys(layer.route.methods))
          out.push({ method, path, guard: own ?? guard });
      } else if (layer.handle.stack) {
        const mount = Array.isArray(layer.rawPath) ? layer.rawPath[0] : layer.rawPath;
        walk(layer.handle.stack, prefix + (mount && mount !== '/' ? mount : ''), guard);
      } else {
        guard = guardOf(layer.handle) ?? guard;
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '', null);
  return out;
}

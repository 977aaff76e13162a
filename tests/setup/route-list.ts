import type { Express } from 'express';

export interface ListedRoute {
  method: string;
  /** The full path as mounted, with Express parameters (`/api/account/addresses/:id`). */
  path: string;
}

interface RouterLayer {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: RouterLayer[] };
}

const joined = (prefix: string, path: string) => `${prefix}/${path}`.replace(/\/{2,}/g, '/').replace(/(.)\/$/, '$1');

/** Every method and path the app answers, read from Express's own router stack (HEAD comes with GET). */
export function listRoutes(app: Express): ListedRoute[] {
  const routes: ListedRoute[] = [];
  const walk = (stack: RouterLayer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        if (typeof layer.route.path !== 'string') throw new Error(`route under ${prefix} has a non-string path`);
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== 'head') routes.push({ method: method === '_all' ? 'ALL' : method.toUpperCase(), path: joined(prefix, layer.route.path) });
        }
      } else if (layer.handle?.stack) {
        if (typeof layer.rawPath !== 'string') throw new Error(`router under ${prefix} is mounted on a non-string path`);
        walk(layer.handle.stack, joined(prefix, layer.rawPath));
      }
    }
  };
  walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack, '');
  return routes;
}

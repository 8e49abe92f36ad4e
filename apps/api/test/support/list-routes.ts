import type { Express } from 'express';
import type { GuardMarker } from '../../src/auth/guard';

export interface ListedRoute {
  method: string;
  path: string;
  guard: GuardMarker | undefined;
}

interface LayerLike {
  route?: { path: string | string[]; methods: Record<string, boolean>; stack: Array<{ handle: { guard?: GuardMarker } }> };
  handle?: { stack?: LayerLike[] };
  rawPath?: unknown;
  name?: string;
}

/**
 * Every route of the Express 5 app, read from the router itself: route layers directly, and
 * mounted routers recursively (their mount path is the layer's rawPath). The guard is the
 * marker on the route's FIRST handler (allow(...) / open() must come first).
 */
export function listRoutes(app: Express): ListedRoute[] {
  const root = (app as unknown as { router: { stack: LayerLike[] } }).router;
  if (!root?.stack) throw new Error('Cannot read app.router.stack (Express 5 expected)');
  const routes: ListedRoute[] = [];
  walk(root.stack, '', routes);
  return routes;
}

function walk(stack: LayerLike[], prefix: string, out: ListedRoute[]): void {
  for (const layer of stack) {
    if (layer.route) {
      const paths = Array.isArray(layer.route.path) ? layer.route.path : [layer.route.path];
      for (const p of paths) {
        if (typeof p !== 'string') throw new Error(`Route with a non-string path under "${prefix}": use string paths`);
        for (const method of Object.keys(layer.route.methods).filter((m) => layer.route!.methods[m])) {
          out.push({ method: method.toUpperCase(), path: joinPath(prefix, p), guard: layer.route.stack[0]?.handle.guard });
        }
      }
    } else if (layer.handle?.stack) {
      const mount = layer.rawPath;
      if (mount !== undefined && typeof mount !== 'string') {
        throw new Error(`A router is mounted under a non-string path (${String(mount)}); mount routers at string paths`);
      }
      walk(layer.handle.stack, joinPath(prefix, mount ?? ''), out);
    }
  }
}

function joinPath(prefix: string, path: string): string {
  const joined = `${prefix}/${path}`.replace(/\/+/g, '/');
  return joined.length > 1 ? joined.replace(/\/$/, '') : joined;
}

import type { Express } from 'express';

/** The part of Express 5's router layers the walk reads (router 2.x keeps each layer's own path as rawPath). */
type Layer = {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
};

/**
 * Every route the app answers, as "METHOD /path/:param", read from the app's own router: nested
 * routers are walked with their mount paths, so a route added anywhere shows up here.
 */
export function listRoutes(app: Express): string[] {
  const routes: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods).filter((m) => m !== '_all'))
          routes.push(`${method.toUpperCase()} ${prefix}${String(layer.route.path)}`);
      } else if (layer.handle?.stack) {
        const mount = typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + mount);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return [...new Set(routes)].sort();
}

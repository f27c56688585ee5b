import type { Express } from 'express';

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: Layer[] };
  rawPath?: string | RegExp;
}

/** Every route the app has, as "METHOD /path", read from Express's router stack. */
export function listRoutes(app: Express): string[] {
  const routes: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods)) {
          routes.push(
            `${method.toUpperCase()} ${prefix}${layer.route.path === '/' ? '' : layer.route.path}`,
          );
        }
      } else if (layer.handle?.stack) {
        const path =
          typeof layer.rawPath === 'string' && layer.rawPath !== '/' ? layer.rawPath : '';
        walk(layer.handle.stack, prefix + path);
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return routes.filter((r) => r.includes('/api'));
}

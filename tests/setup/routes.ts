import type { Express } from 'express';

type Layer = { route?: { path: string; methods: Record<string, boolean> }; handle?: { stack?: Layer[] } };

/** Every route the app registers, as "METHOD /path" (routers are mounted at /api), read from Express's stack. */
export function registeredRoutes(app: Express): string[] {
  const out: string[] = [];
  const walk = (stack: Layer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        for (const method of Object.keys(layer.route.methods))
          out.push(`${method.toUpperCase()} ${layer.route.path.startsWith('/api/') ? '' : prefix}${layer.route.path}`);
      } else if (layer.handle?.stack) {
        walk(layer.handle.stack, '/api');
      }
    }
  };
  walk((app as unknown as { router: { stack: Layer[] } }).router.stack, '');
  return out.filter((r) => !r.includes('/api/auth/') && !r.startsWith('GET /{*splat}'));
}

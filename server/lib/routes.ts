import type { Router } from 'express';

/** A router and the path it is mounted at, kept so the app can list its own routes. */
export interface Mount {
  prefix: string;
  router: Router;
}

interface Layer {
  route?: { path: string; methods: Record<string, boolean> };
}

/**
 * Every `METHOD /path` the mounted routers answer, in Express's own `:param` form.
 * Express 5 does not keep mount paths on its layers, so the app records them as it mounts.
 */
export function listRoutes(mounts: readonly Mount[]): string[] {
  const out = new Set<string>();
  for (const { prefix, router } of mounts) {
    for (const layer of router.stack as Layer[]) {
      if (!layer.route) continue;
      const path = layer.route.path === '/' ? prefix : `${prefix}${layer.route.path}`;
      for (const [method, on] of Object.entries(layer.route.methods)) {
        if (on && method !== '_all') out.add(`${method.toUpperCase()} ${path}`);
      }
    }
  }
  return [...out].sort();
}

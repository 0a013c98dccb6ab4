// The routes an Express app mounts, read off its own router ("GET /api/networks/:networkId").
import type { Express } from "express";

interface RouterLayer {
  rawPath?: unknown;
  route?: { path: unknown; methods: Record<string, boolean> };
  handle?: { stack?: RouterLayer[] };
}

export function mountedRoutes(app: Express): string[] {
  const walk = (stack: RouterLayer[], prefix: string): string[] =>
    stack.flatMap((layer) => {
      // The client's catch-all shell (a regular expression) is not a route of the API.
      if (layer.route && typeof layer.route.path === "string") {
        const path = `${prefix}${layer.route.path}`.replace(/(.)\/$/, "$1");
        return Object.keys(layer.route.methods).filter((m) => m !== "_all").map((m) => `${m.toUpperCase()} ${path}`);
      }
      if (layer.handle?.stack && typeof layer.rawPath === "string") return walk(layer.handle.stack, layer.rawPath === "/" ? prefix : `${prefix}${layer.rawPath}`);
      return [];
    });
  return walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack, "");
}

import type { Express } from "express";

export interface RegisteredRoute {
  method: string;
  /** the full path as Express holds it, e.g. "/api/cases/:id/attempts" */
  path: string;
}

interface RouterLayer {
  name?: string;
  route?: { path: string; methods: Record<string, boolean> };
  handle?: { stack?: RouterLayer[] };
  match?: (path: string) => { path: string } | false;
}

const PROBES = ["/api/__route_probe__", "/__route_probe__"];

/**
 * Every route the app registers, read from Express's own router stack (so a route added
 * tomorrow is listed without touching this file). Catch-all routes (the web fallback, the
 * better-auth mount) are left out: they are not ours to enumerate.
 */
export function registeredRoutes(app: Express): RegisteredRoute[] {
  const out: RegisteredRoute[] = [];
  const walk = (stack: RouterLayer[], prefix: string) => {
    for (const layer of stack) {
      if (layer.route) {
        const path = prefix + layer.route.path;
        if (path.includes("*")) continue;
        for (const [method, on] of Object.entries(layer.route.methods)) {
          if (on && method !== "_all") out.push({ method: method.toUpperCase(), path });
        }
      } else if (layer.handle?.stack) {
        const hit = PROBES.map((p) => layer.match?.(prefix ? p.replace(/^\/api/, "") : p)).find((m) => m);
        const mount = hit ? hit.path : "";
        walk(layer.handle.stack, prefix + mount);
      }
    }
  };
  walk((app as unknown as { router: { stack: RouterLayer[] } }).router.stack, "");
  const seen = new Set<string>();
  return out.filter((r) => {
    const key = `${r.method} ${r.path}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

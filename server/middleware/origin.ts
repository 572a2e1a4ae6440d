import type { RequestHandler } from "express";
import { HttpError } from "./errors";

const SAFE_METHODS = new Set(["GET", "HEAD", "OPTIONS"]);

/**
 * Refuses cross-site writes to our /api routes (better-auth guards its own /api/auth routes).
 * A browser always sends Origin on a cross-origin POST/PATCH/DELETE and on same-origin ones too,
 * so a write must name one of our origins. A request without Origin is accepted only when it
 * carries no cookie: without ambient credentials a forged request has nothing to ride on (that is
 * how scripts and the public layer check are called).
 */
export function sameOriginWrites(trustedOrigins: readonly string[]): RequestHandler {
  const allowed = new Set(trustedOrigins.map((o) => normaliseOrigin(o)).filter((o): o is string => o !== null));
  return (req, _res, next) => {
    if (SAFE_METHODS.has(req.method)) return next();
    const origin = req.headers.origin;
    if (origin === undefined) {
      if (req.headers.cookie) throw crossSite("A signed-in change must come from the Phasewise page (no Origin header).");
      return next();
    }
    const normal = normaliseOrigin(origin);
    if (normal === null || !allowed.has(normal)) throw crossSite("Changes are accepted only from the Phasewise page itself.");
    next();
  };
}

const crossSite = (message: string) => new HttpError(403, "cross_origin", message);

/** "https://Lab.example:443/" → "https://lab.example"; "null" or junk → null. */
export function normaliseOrigin(value: string): string | null {
  try {
    const url = new URL(value);
    if (url.protocol !== "http:" && url.protocol !== "https:") return null;
    return url.origin;
  } catch {
    return null;
  }
}

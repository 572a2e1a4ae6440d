import type { Request } from "express";
import { SHIPPED_REFERENCE } from "../knowledge/reference";
import type { ReferenceData } from "../knowledge/types";
import type { AppDeps } from "./deps";

/**
 * The reference tables a request is answered from: the one seam for a lab group's corrections.
 * Today every request gets the shipped tables. When groups keep overrides, this looks up the
 * caller's active group (`req.activeGroupId`, set by loadSession; anonymous callers keep the
 * shipped tables), loads its overrides from `deps.db` and returns
 * `applyOverrides(SHIPPED_REFERENCE, overrides)` from knowledge/overrides.ts. Cache the result
 * per group and overrides version: the look-up indexes are cached per ReferenceData object, so a
 * fresh object per request would rebuild them every time.
 */
export async function referenceFor(_req: Request, _deps: AppDeps): Promise<ReferenceData> {
  return SHIPPED_REFERENCE;
}

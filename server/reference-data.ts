import type { Request } from "express";
import { SHIPPED_REFERENCE } from "../knowledge/reference";
import type { ReferenceData } from "../knowledge/types";
import type { AppDeps } from "./deps";
import { computingGroupOf, groupReference } from "./group-reference";

/**
 * The reference tables a request is answered from: the one seam for a lab group's corrections.
 * Anonymous callers get the shipped tables; a signed-in member gets their active group's
 * (server/group-reference.ts applies its corrections and caches the result per group).
 */
export async function referenceFor(req: Request, deps: AppDeps): Promise<ReferenceData> {
  if (!req.user) return SHIPPED_REFERENCE;
  const groupId = req.group?.id ?? (await computingGroupOf(deps.db, req.user.id, req.activeGroupId));
  return groupId ? groupReference(deps.db, groupId) : SHIPPED_REFERENCE;
}

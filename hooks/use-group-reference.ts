import { useMemo } from "react";
import { applyCorrections } from "../knowledge/contracts/reference-overrides";
import { SHIPPED_REFERENCE } from "../knowledge/reference";
import type { ReferenceData } from "../knowledge/types";
import { useActiveGroup } from "./use-me";
import { useOverridesQuery } from "./use-reference-overrides";

/**
 * The reference tables the signed-in member's group computes with (shipped tables plus the
 * group's active corrections), for screens that compute in the browser. The same result the
 * server's referenceFor(req) gives; the shipped tables while loading, offline or signed out.
 */
export function useGroupReference(): ReferenceData {
  const group = useActiveGroup();
  const q = useOverridesQuery("active", !!group);
  const rows = q.data?.overrides;
  const ids = rows?.map((o) => o.id).join(",") ?? "";
  return useMemo(
    () => (rows && rows.length ? applyCorrections(SHIPPED_REFERENCE, rows.filter((o) => o.applies)).ref : SHIPPED_REFERENCE),
    // The ids fix the result: corrections are never edited, only added or retired.
    [ids],
  );
}

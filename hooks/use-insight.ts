import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { InsightResponse } from "../knowledge/contracts/insight";
import { api } from "./api";
import { STALE } from "./query-client";

/* The group's insight over a period (any member). */

export interface InsightPeriod {
  /** YYYY-MM-DD, both inclusive; the server's default (12 months) when absent */
  from?: string;
  to?: string;
}

export const insightKeys = {
  all: ["insight"] as const,
  period: (p: InsightPeriod) => [...insightKeys.all, { from: p.from ?? null, to: p.to ?? null }] as const,
};

export function insightSearch(p: InsightPeriod): string {
  const q = new URLSearchParams();
  if (p.from) q.set("from", p.from);
  if (p.to) q.set("to", p.to);
  const s = q.toString();
  return s ? `?${s}` : "";
}

export const insightQuery = (p: InsightPeriod) =>
  queryOptions({
    queryKey: insightKeys.period(p),
    queryFn: ({ signal }) => api<InsightResponse>(`/api/insight${insightSearch(p)}`, { signal }),
    staleTime: STALE.shared,
    placeholderData: keepPreviousData,
  });

export function useInsightQuery(p: InsightPeriod) {
  return useQuery(insightQuery(p));
}

import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type {
  RemedyCatalogueEntry,
  RemedyCatalogueResponse,
  TroubleshootRequest,
  TroubleshootResponse,
} from "../knowledge/contracts/emulsion";
import { api } from "./api";
import { STALE } from "./query-client";

/*
 * Emulsion help from the server: the same ranking the screen computes offline, plus the group's
 * own cases ("cleared n of m"). POST /api/troubleshoot changes nothing, so it is a query keyed
 * by the answers, not a mutation.
 */

export const emulsionKeys = {
  all: ["emulsion"] as const,
  troubleshoots: () => [...emulsionKeys.all, "troubleshoot"] as const,
  /** per group: another group's evidence gives another answer */
  troubleshoot: (groupId: string | null, request: TroubleshootRequest) => [...emulsionKeys.troubleshoots(), groupId, request] as const,
  remedies: () => [...emulsionKeys.all, "remedies"] as const,
  remedyList: () => [...emulsionKeys.remedies(), "list"] as const,
  remedy: (id: string) => [...emulsionKeys.remedies(), "detail", id] as const,
};

export const troubleshootQuery = (groupId: string | null, request: TroubleshootRequest) =>
  queryOptions({
    queryKey: emulsionKeys.troubleshoot(groupId, request),
    queryFn: ({ signal }) => api<TroubleshootResponse>("/api/troubleshoot", { method: "POST", body: request, signal }),
    // Group evidence changes as cases are logged, like any shared record.
    staleTime: STALE.shared,
    placeholderData: keepPreviousData,
  });

export const remediesQuery = () =>
  queryOptions({
    queryKey: emulsionKeys.remedyList(),
    queryFn: ({ signal }) => api<RemedyCatalogueResponse>("/api/remedies", { signal }),
    staleTime: STALE.reference,
  });

export const remedyQuery = (id: string) =>
  queryOptions({
    queryKey: emulsionKeys.remedy(id),
    queryFn: ({ signal }) => api<RemedyCatalogueEntry & { scaleNote: string }>(`/api/remedies/${encodeURIComponent(id)}`, { signal }),
    staleTime: STALE.reference,
  });

/** The server's answer with group evidence; off while there is no valid request or no group. */
export function useTroubleshootQuery(groupId: string | null, request: TroubleshootRequest | null) {
  return useQuery({ ...troubleshootQuery(groupId, request ?? ({} as TroubleshootRequest)), enabled: request !== null && groupId !== null });
}

export function useRemediesQuery() {
  return useQuery(remediesQuery());
}

export function useRemedyQuery(id: string | undefined) {
  return useQuery({ ...remedyQuery(id ?? ""), enabled: !!id });
}

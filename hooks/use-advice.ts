import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { AdviceCreateBody, AdviceListResponse, AdviceNote, AdvicePatchBody } from "../knowledge/contracts/advice";
import { api } from "./api";
import { auditKeys } from "./use-audit";
import { emulsionKeys } from "./use-emulsion";
import { STALE } from "./query-client";

/* The group's advice notes on remedies. */

export const adviceKeys = {
  all: ["advice"] as const,
  lists: () => [...adviceKeys.all, "list"] as const,
  list: (includeRetired: boolean) => [...adviceKeys.lists(), { includeRetired }] as const,
};

export const adviceListQuery = (includeRetired: boolean) =>
  queryOptions({
    queryKey: adviceKeys.list(includeRetired),
    queryFn: ({ signal }) => api<AdviceListResponse>(`/api/advice${includeRetired ? "?includeRetired=true" : ""}`, { signal }),
    staleTime: STALE.shared,
  });

export function useAdviceQuery(includeRetired = false) {
  return useQuery(adviceListQuery(includeRetired));
}

/** A note shows in the desk, in the emulsion help's answers and in the audit log. */
function useAdviceInvalidation() {
  const qc = useQueryClient();
  return () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: adviceKeys.all }),
      qc.invalidateQueries({ queryKey: emulsionKeys.troubleshoots() }),
      qc.invalidateQueries({ queryKey: auditKeys.all }),
    ]);
}

export function useCreateAdviceMutation() {
  const invalidate = useAdviceInvalidation();
  return useMutation({
    mutationFn: (body: AdviceCreateBody) => api<AdviceNote>("/api/advice", { body }),
    onSuccess: invalidate,
  });
}

export function usePatchAdviceMutation() {
  const invalidate = useAdviceInvalidation();
  return useMutation({
    mutationFn: (v: { id: string } & AdvicePatchBody) => {
      const { id, ...body } = v;
      return api<AdviceNote>(`/api/advice/${encodeURIComponent(id)}`, { method: "PATCH", body });
    },
    onSuccess: invalidate,
  });
}

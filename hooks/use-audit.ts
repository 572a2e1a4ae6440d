import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { AuditListResponse, AuditRestoreBody, AuditRestoreResponse } from "../knowledge/contracts/audit";
import { api } from "./api";
import { STALE } from "./query-client";

/* The group's audit log (leads and owners). */

export interface AuditFilters {
  entity?: string;
  actor?: string;
  action?: string;
  /** YYYY-MM-DD */
  from?: string;
  to?: string;
  sort?: "newest" | "oldest";
  limit?: number;
  offset?: number;
}

export const auditKeys = {
  all: ["audit"] as const,
  lists: () => [...auditKeys.all, "list"] as const,
  list: (f: AuditFilters) => [...auditKeys.lists(), f] as const,
};

/** The end of the `to` day counts: the server compares instants. */
export function auditSearch(f: AuditFilters): string {
  const p = new URLSearchParams();
  if (f.entity) p.set("entity", f.entity);
  if (f.actor) p.set("actor", f.actor);
  if (f.action) p.set("action", f.action);
  if (f.from) p.set("from", f.from);
  if (f.to) p.set("to", /^\d{4}-\d{2}-\d{2}$/.test(f.to) ? `${f.to}T23:59:59.999Z` : f.to);
  if (f.sort) p.set("sort", f.sort);
  if (f.limit) p.set("limit", String(f.limit));
  if (f.offset) p.set("offset", String(f.offset));
  const s = p.toString();
  return s ? `?${s}` : "";
}

export const auditListQuery = (f: AuditFilters) =>
  queryOptions({
    queryKey: auditKeys.list(f),
    queryFn: ({ signal }) => api<AuditListResponse>(`/api/audit${auditSearch(f)}`, { signal }),
    staleTime: STALE.shared,
    placeholderData: keepPreviousData,
  });

export function useAuditQuery(f: AuditFilters, enabled = true) {
  return useQuery({ ...auditListQuery(f), enabled });
}

/** A restore can change any curated record (a correction, a case, a note): it invalidates every query. */
export function useAuditRestoreMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id: string } & Partial<AuditRestoreBody>) =>
      api<AuditRestoreResponse>(`/api/audit/${v.id}/restore`, { body: { version: v.version ?? "before", reason: v.reason } }),
    onSuccess: () => qc.invalidateQueries(),
  });
}

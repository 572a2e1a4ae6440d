import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type {
  CreateOverrideBody,
  OverrideListResponse,
  OverrideView,
  SoluteComparison,
  SolventComparison,
} from "../knowledge/contracts/reference-overrides";
import { api } from "./api";
import { STALE } from "./query-client";
import { solventKeys } from "./use-solvents";

/* A group's corrections to the reference tables, and the shipped-vs-group comparisons. */

export type OverrideStatus = "active" | "retired" | "all";

export const overrideKeys = {
  all: ["reference-overrides"] as const,
  lists: () => [...overrideKeys.all, "list"] as const,
  list: (status: OverrideStatus) => [...overrideKeys.lists(), status] as const,
  solvent: (key: string) => [...overrideKeys.all, "solvent", key] as const,
  solute: (key: string) => [...overrideKeys.all, "solute", key] as const,
};

export const overrideListQuery = (status: OverrideStatus) =>
  queryOptions({
    queryKey: overrideKeys.list(status),
    queryFn: ({ signal }) => api<OverrideListResponse>(`/api/reference/overrides?status=${status}`, { signal }),
    staleTime: STALE.shared,
  });

export const solventComparisonQuery = (key: string) =>
  queryOptions({
    queryKey: overrideKeys.solvent(key),
    queryFn: ({ signal }) => api<SolventComparison>(`/api/reference/solvents/${encodeURIComponent(key)}`, { signal }),
    staleTime: STALE.reference,
  });

export const soluteComparisonQuery = (key: string) =>
  queryOptions({
    queryKey: overrideKeys.solute(key),
    queryFn: ({ signal }) => api<SoluteComparison>(`/api/reference/solutes/${encodeURIComponent(key)}`, { signal }),
    staleTime: STALE.reference,
  });

export function useOverridesQuery(status: OverrideStatus, enabled = true) {
  return useQuery({ ...overrideListQuery(status), enabled });
}

/** Shipped and group values of one solvent; pass null to wait. */
export function useSolventComparisonQuery(key: string | null) {
  return useQuery({ ...solventComparisonQuery(key ?? ""), enabled: !!key });
}

export function useSoluteComparisonQuery(key: string | null) {
  return useQuery({ ...soluteComparisonQuery(key ?? ""), enabled: !!key });
}

/** A correction changes what the group computes with: the corrections, comparisons and solvent tables. */
function invalidateReference(qc: ReturnType<typeof useQueryClient>) {
  return Promise.all([qc.invalidateQueries({ queryKey: overrideKeys.all }), qc.invalidateQueries({ queryKey: solventKeys.all })]);
}

export function useCreateOverrideMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateOverrideBody) => api<OverrideView>("/api/reference/overrides", { body }),
    onSuccess: () => invalidateReference(qc),
  });
}

export function useRetireOverrideMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id: string; reason: string }) => api<OverrideView>(`/api/reference/overrides/${v.id}`, { method: "DELETE", body: { reason: v.reason } }),
    onSuccess: () => invalidateReference(qc),
  });
}

import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { AqueousSolutionEntry, SolventDetail, SolventListItem } from "../knowledge/contracts/solvents";
import { api } from "./api";
import { STALE } from "./query-client";

/*
 * The public reference tables: solvents (list, search, detail) and aqueous solutions.
 * Read-only here; when leads can correct values, their mutations invalidate solventKeys.all.
 */

export const solventKeys = {
  all: ["solvents"] as const,
  lists: () => [...solventKeys.all, "list"] as const,
  list: (q: string) => [...solventKeys.lists(), q.trim()] as const,
  details: () => [...solventKeys.all, "detail"] as const,
  detail: (key: string) => [...solventKeys.details(), key] as const,
  aqueous: () => [...solventKeys.all, "aqueous-solutions"] as const,
};

export const solventListQuery = (q: string) =>
  queryOptions({
    queryKey: solventKeys.list(q),
    queryFn: ({ signal }) =>
      api<{ solvents: SolventListItem[] }>(`/api/solvents${q.trim() ? `?q=${encodeURIComponent(q.trim())}` : ""}`, { signal }),
    staleTime: STALE.reference,
    // Keep the last results on screen while the next search runs.
    placeholderData: keepPreviousData,
  });

export const solventDetailQuery = (key: string) =>
  queryOptions({
    queryKey: solventKeys.detail(key),
    queryFn: ({ signal }) => api<SolventDetail>(`/api/solvents/${encodeURIComponent(key)}`, { signal }),
    staleTime: STALE.reference,
  });

export const aqueousSolutionsQuery = () =>
  queryOptions({
    queryKey: solventKeys.aqueous(),
    queryFn: ({ signal }) => api<{ solutes: AqueousSolutionEntry[] }>("/api/aqueous-solutions", { signal }),
    staleTime: STALE.reference,
  });

/** Solvents matching a search (fuzzy, on the server); every solvent for an empty search. */
export function useSolventsQuery(q: string) {
  return useQuery(solventListQuery(q));
}

/** One solvent with every value and its source; pass null to wait. */
export function useSolventQuery(key: string | null) {
  return useQuery({ ...solventDetailQuery(key ?? ""), enabled: !!key });
}

export function useAqueousSolutionsQuery() {
  return useQuery(aqueousSolutionsQuery());
}

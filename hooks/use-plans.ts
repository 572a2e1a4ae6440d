import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { CreatePlanBody, PatchPlanBody, SavedPlan, SavedPlanList } from "../knowledge/contracts/plans";
import { api } from "./api";
import { STALE } from "./query-client";

/** Saved extraction plans of the active group. The computation itself runs in the browser. */
export const planKeys = {
  all: ["plans"] as const,
  lists: () => [...planKeys.all, "list"] as const,
  list: () => [...planKeys.lists(), "group"] as const,
  details: () => [...planKeys.all, "detail"] as const,
  detail: (id: string) => [...planKeys.details(), id] as const,
};

export const plansListQuery = () =>
  queryOptions({
    queryKey: planKeys.list(),
    queryFn: ({ signal }) => api<SavedPlanList>("/api/plans", { signal }),
    staleTime: STALE.shared,
  });

export const planDetailQuery = (id: string) =>
  queryOptions({
    queryKey: planKeys.detail(id),
    queryFn: ({ signal }) => api<SavedPlan>(`/api/plans/${encodeURIComponent(id)}`, { signal }),
    staleTime: STALE.shared,
  });

export function usePlansQuery() {
  return useQuery(plansListQuery());
}

export function usePlanQuery(id: string | undefined) {
  return useQuery({ ...planDetailQuery(id ?? ""), enabled: !!id });
}

/** Invalidates: the plan list (a new row). Seeds the new plan's detail. */
export function useCreatePlanMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreatePlanBody) => api<SavedPlan>("/api/plans", { body }),
    onSuccess: (created) => {
      qc.setQueryData(planKeys.detail(created.id), created);
      return qc.invalidateQueries({ queryKey: planKeys.lists() });
    },
  });
}

/** Invalidates: the plan's detail and the list (title, solvent and "changed by" show there). */
export function usePatchPlanMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PatchPlanBody) => api<SavedPlan>(`/api/plans/${encodeURIComponent(id)}`, { method: "PATCH", body }),
    onSuccess: (updated) => {
      qc.setQueryData(planKeys.detail(id), updated);
      return qc.invalidateQueries({ queryKey: planKeys.lists() });
    },
  });
}

/** Invalidates: the list; drops the plan's detail. */
export function useDeletePlanMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<void>(`/api/plans/${encodeURIComponent(id)}`, { method: "DELETE" }),
    onSuccess: () => {
      qc.removeQueries({ queryKey: planKeys.detail(id) });
      return qc.invalidateQueries({ queryKey: planKeys.lists() });
    },
  });
}

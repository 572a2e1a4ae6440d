import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type {
  BulkVerifyResponse,
  CaseRequest,
  CaseRequestList,
  CurationState,
  MergeBody,
  MergeResponse,
  RequestPatchBody,
  RetireBody,
  ReviewKind,
  ReviewResponse,
  VerifyBody,
} from "../knowledge/contracts/curation";
import { api } from "./api";
import { auditKeys } from "./use-audit";
import { caseKeys } from "./use-cases";
import { STALE } from "./query-client";

/* The lead's curation of cases: the review queue, verify, requests, merge, retire and restore. */

export const curationKeys = {
  all: ["curation"] as const,
  reviews: () => [...curationKeys.all, "review"] as const,
  review: (kind: ReviewKind) => [...curationKeys.reviews(), kind] as const,
  requests: () => [...curationKeys.all, "requests"] as const,
  caseRequests: (caseId: string) => [...curationKeys.requests(), "case", caseId] as const,
  myRequests: (status: "open" | "answered" | "all") => [...curationKeys.requests(), "mine", status] as const,
};

export const reviewQuery = (kind: ReviewKind) =>
  queryOptions({
    queryKey: curationKeys.review(kind),
    queryFn: ({ signal }) => api<ReviewResponse>(`/api/review?kind=${kind}`, { signal }),
    staleTime: STALE.shared,
    placeholderData: keepPreviousData,
  });

export function useReviewQuery(kind: ReviewKind, enabled = true) {
  return useQuery({ ...reviewQuery(kind), enabled });
}

export function useCaseRequestsQuery(caseId: string | undefined) {
  return useQuery({
    queryKey: curationKeys.caseRequests(caseId ?? ""),
    queryFn: ({ signal }) => api<CaseRequestList>(`/api/cases/${encodeURIComponent(caseId!)}/requests`, { signal }),
    staleTime: STALE.shared,
    enabled: !!caseId,
  });
}

export function useMyRequestsQuery(status: "open" | "answered" | "all" = "open") {
  return useQuery({
    queryKey: curationKeys.myRequests(status),
    queryFn: ({ signal }) => api<CaseRequestList>(`/api/my-requests?status=${status}`, { signal }),
    staleTime: STALE.shared,
  });
}

/** A curation change shows in the queue, the case pages and lists, and the audit log. */
function useCurationInvalidation() {
  const qc = useQueryClient();
  return () =>
    Promise.all([
      qc.invalidateQueries({ queryKey: curationKeys.all }),
      qc.invalidateQueries({ queryKey: caseKeys.all }),
      qc.invalidateQueries({ queryKey: auditKeys.all }),
    ]);
}

export function useVerifyMutation() {
  const invalidate = useCurationInvalidation();
  return useMutation({
    mutationFn: (v: { caseId: string } & VerifyBody) => {
      const { caseId, ...body } = v;
      return api<CurationState>(`/api/cases/${encodeURIComponent(caseId)}/verify`, { body });
    },
    onSuccess: invalidate,
  });
}

export function useBulkVerifyMutation() {
  const invalidate = useCurationInvalidation();
  return useMutation({
    mutationFn: (ids: string[]) => api<BulkVerifyResponse>("/api/review/verify", { body: { ids } }),
    onSuccess: invalidate,
  });
}

export function useRetireMutation() {
  const invalidate = useCurationInvalidation();
  return useMutation({
    mutationFn: (v: { caseId: string } & RetireBody) => {
      const { caseId, ...body } = v;
      return api<CurationState>(`/api/cases/${encodeURIComponent(caseId)}/retire`, { body });
    },
    onSuccess: invalidate,
  });
}

export function useRestoreCaseMutation() {
  const invalidate = useCurationInvalidation();
  return useMutation({
    mutationFn: (v: { caseId: string; reason?: string }) =>
      api<CurationState>(`/api/cases/${encodeURIComponent(v.caseId)}/restore`, { body: v.reason ? { reason: v.reason } : {} }),
    onSuccess: invalidate,
  });
}

export function useMergeMutation() {
  const invalidate = useCurationInvalidation();
  return useMutation({
    mutationFn: (v: { caseId: string } & MergeBody) => {
      const { caseId, ...body } = v;
      return api<MergeResponse>(`/api/cases/${encodeURIComponent(caseId)}/merge`, { body });
    },
    onSuccess: invalidate,
  });
}

/** Asking for more changes the case's requests, the author's list and the queue's "asked" count. */
export function useAskMutation() {
  const invalidate = useCurationInvalidation();
  return useMutation({
    mutationFn: (v: { caseId: string; text: string }) => api<CaseRequest>(`/api/cases/${encodeURIComponent(v.caseId)}/requests`, { body: { text: v.text } }),
    onSuccess: invalidate,
  });
}

export function useAnswerRequestMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { id: string } & RequestPatchBody) => {
      const { id, ...body } = v;
      return api<CaseRequest>(`/api/requests/${encodeURIComponent(id)}`, { method: "PATCH", body });
    },
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: curationKeys.all }), qc.invalidateQueries({ queryKey: auditKeys.all })]),
  });
}

import { keepPreviousData, queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useCallback, useState } from "react";
import type {
  AttemptBody,
  AttemptPatchBody,
  CaseAttempt,
  CaseDetail,
  CaseListQuery,
  CaseListResponse,
  CasePhoto,
  CreateCaseBody,
  FollowResponse,
  PatchCaseBody,
} from "../knowledge/contracts/cases";
import { api, ApiError, apiUrl } from "./api";
import { STALE } from "./query-client";

/** List filters as the screens hold them: the contract's query, everything optional. */
export type CaseFilters = Partial<Record<keyof CaseListQuery, string | number | boolean | undefined>>;

/** Drop empty filters and fix the key order, so equal filters share one cache entry and one URL. */
export function normaliseFilters(filters: CaseFilters): Record<string, string> {
  const out: Record<string, string> = {};
  for (const key of Object.keys(filters).sort()) {
    const v = filters[key as keyof CaseListQuery];
    if (v === undefined || v === null || v === "" || v === false) continue;
    out[key] = typeof v === "string" ? v.trim() : String(v);
    if (out[key] === "") delete out[key];
  }
  return out;
}

export function caseQueryString(filters: CaseFilters): string {
  const qs = new URLSearchParams(normaliseFilters(filters)).toString();
  return qs ? `?${qs}` : "";
}

export const caseKeys = {
  all: ["cases"] as const,
  lists: () => [...caseKeys.all, "list"] as const,
  list: (filters: CaseFilters) => [...caseKeys.lists(), normaliseFilters(filters)] as const,
  details: () => [...caseKeys.all, "detail"] as const,
  detail: (id: string) => [...caseKeys.details(), id] as const,
};

export const casesListQuery = (filters: CaseFilters) =>
  queryOptions({
    queryKey: caseKeys.list(filters),
    queryFn: ({ signal }) => api<CaseListResponse>(`/api/cases${caseQueryString(filters)}`, { signal }),
    staleTime: STALE.shared,
    // Keep the last results on screen while the next search runs.
    placeholderData: keepPreviousData,
  });

export const caseDetailQuery = (id: string) =>
  queryOptions({
    queryKey: caseKeys.detail(id),
    queryFn: ({ signal }) => api<CaseDetail>(`/api/cases/${encodeURIComponent(id)}`, { signal }),
    staleTime: STALE.shared,
  });

/** The CSV of the same filtered list (the export route takes the list's query string). */
export function caseExportUrl(filters: CaseFilters): string {
  const { limit: _limit, offset: _offset, ...rest } = filters;
  return apiUrl(`/api/cases/export.csv${caseQueryString(rest)}`);
}

export function useCasesQuery(filters: CaseFilters) {
  return useQuery(casesListQuery(filters));
}

export function useCaseQuery(id: string | undefined) {
  return useQuery({ ...caseDetailQuery(id ?? ""), enabled: !!id });
}

/** Invalidates: every case list (a new row). Seeds the new case's detail. */
export function useCreateCaseMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateCaseBody) => api<CaseDetail>("/api/cases", { body }),
    onSuccess: (created) => {
      qc.setQueryData(caseKeys.detail(created.id), created);
      return qc.invalidateQueries({ queryKey: caseKeys.lists() });
    },
  });
}

/** Invalidates: the case's detail and every list (title, status and outcome show there). */
export function usePatchCaseMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: PatchCaseBody) => api<CaseDetail>(`/api/cases/${encodeURIComponent(id)}`, { method: "PATCH", body }),
    onSuccess: (updated) => {
      qc.setQueryData(caseKeys.detail(id), updated);
      return Promise.all([
        qc.invalidateQueries({ queryKey: caseKeys.detail(id) }),
        qc.invalidateQueries({ queryKey: caseKeys.lists() }),
      ]);
    },
  });
}

function invalidateCase(qc: ReturnType<typeof useQueryClient>, id: string) {
  return Promise.all([qc.invalidateQueries({ queryKey: caseKeys.detail(id) }), qc.invalidateQueries({ queryKey: caseKeys.lists() })]);
}

/** Invalidates: the case's detail (timeline) and every list ("what worked", attempt count). */
export function useAddAttemptMutation(caseId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: AttemptBody) => api<CaseAttempt>(`/api/cases/${encodeURIComponent(caseId)}/attempts`, { body }),
    onSuccess: () => invalidateCase(qc, caseId),
  });
}

/** Invalidates: the case's detail and every list. */
export function usePatchAttemptMutation(caseId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ attemptId, body }: { attemptId: string; body: AttemptPatchBody }) =>
      api<CaseAttempt>(`/api/cases/${encodeURIComponent(caseId)}/attempts/${encodeURIComponent(attemptId)}`, { method: "PATCH", body }),
    onSuccess: () => invalidateCase(qc, caseId),
  });
}

/** A picked image: a web File/Blob, or a native file URI (React Native's FormData takes `{ uri, name, type }`). */
export type UploadFile = { blob: Blob; name: string } | { uri: string; name: string; type: string };

/**
 * POST a photo as multipart field `photo`, reporting upload progress (0–1). XMLHttpRequest,
 * because fetch has no upload progress; withCredentials sends the session cookie.
 */
export function uploadCasePhoto(
  caseId: string,
  file: UploadFile,
  onProgress: (fraction: number) => void,
  signal?: AbortSignal,
): Promise<CasePhoto> {
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open("POST", apiUrl(`/api/cases/${encodeURIComponent(caseId)}/photos`));
    xhr.withCredentials = true;
    xhr.responseType = "text";
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress(Math.min(e.loaded / e.total, 1));
    };
    xhr.onload = () => {
      let data: unknown;
      try {
        data = xhr.responseText ? JSON.parse(xhr.responseText) : undefined;
      } catch {
        data = undefined;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress(1);
        resolve(data as CasePhoto);
        return;
      }
      const err = (data as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | undefined)?.error;
      const fallback = xhr.status === 413 ? "That photo is larger than the 10 MB limit." : `The upload failed (${xhr.status}).`;
      reject(new ApiError(xhr.status, err?.code ?? "http_error", err?.message ?? fallback, err?.fields, data));
    };
    xhr.onerror = () => reject(new ApiError(0, "network", "The upload did not reach the server. Check the connection and try again."));
    xhr.onabort = () => reject(new ApiError(0, "aborted", "The upload was stopped."));
    signal?.addEventListener("abort", () => xhr.abort(), { once: true });
    const form = new FormData();
    if ("blob" in file) form.append("photo", file.blob, file.name);
    else form.append("photo", file as unknown as Blob);
    xhr.send(form);
  });
}

/**
 * Upload one photo with a visible progress value (0–1, null before it starts).
 * Invalidates: the case's detail (photos) and every list (photo count, card thumbnail).
 */
export function useUploadPhotoMutation(caseId: string) {
  const qc = useQueryClient();
  const [progress, setProgress] = useState<number | null>(null);
  const mutation = useMutation({
    mutationFn: (file: UploadFile) => {
      setProgress(0);
      return uploadCasePhoto(caseId, file, setProgress);
    },
    onSuccess: () => invalidateCase(qc, caseId),
    onError: () => setProgress(null),
  });
  const reset = useCallback(() => {
    setProgress(null);
    mutation.reset();
  }, [mutation]);
  return { ...mutation, progress, reset };
}

/** Invalidates: the case's detail and every list. */
export function useDeletePhotoMutation(caseId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (photoId: string) => api<void>(`/api/photos/${encodeURIComponent(photoId)}`, { method: "DELETE" }),
    onSuccess: () => invalidateCase(qc, caseId),
  });
}

/**
 * Follow or stop following. Writes the answer into the detail at once, then
 * invalidates: the case's detail and every list (cards show "following").
 */
export function useFollowCaseMutation(caseId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (follow: boolean) =>
      api<FollowResponse>(`/api/cases/${encodeURIComponent(caseId)}/follow`, { method: follow ? "POST" : "DELETE", body: follow ? {} : undefined }),
    onSuccess: (res) => {
      qc.setQueryData<CaseDetail>(caseKeys.detail(caseId), (old) =>
        old && res ? { ...old, following: res.following, followerCount: res.followerCount } : old,
      );
      return invalidateCase(qc, caseId);
    },
  });
}

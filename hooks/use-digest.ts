import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { Digest, SentDigest } from "../knowledge/contracts/digest";
import { api } from "./api";
import { STALE } from "./query-client";

/* The weekly digest to leads: a preview and "send it now". */

export const digestKeys = { all: ["digest"] as const, preview: (groupId: string) => [...digestKeys.all, groupId] as const };

export const digestQuery = (groupId: string) =>
  queryOptions({ queryKey: digestKeys.preview(groupId), queryFn: ({ signal }) => api<Digest>("/api/digest", { signal }), staleTime: STALE.shared });

export function useDigestQuery(groupId: string, enabled = true) {
  return useQuery({ ...digestQuery(groupId), enabled });
}

/** Invalidates the preview (it shows what was sent). */
export function useSendDigestMutation(groupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<SentDigest>("/api/digest/send", { body: {} }),
    onSuccess: () => qc.invalidateQueries({ queryKey: digestKeys.preview(groupId) }),
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type {
  AcceptedInvitation,
  CreateInvitationBody,
  CreatedInvitation,
  InvitationPreview,
  InvitationView,
} from "../knowledge/contracts/invitations";
import { api } from "./api";
import { STALE } from "./query-client";
import { meKeys } from "./use-me";

/* Invitations to a lab group: the pending list on the desk, and the invite link's page. */

export const invitationKeys = {
  all: ["invitations"] as const,
  pending: (groupId: string) => [...invitationKeys.all, "pending", groupId] as const,
  preview: (id: string) => [...invitationKeys.all, "preview", id] as const,
};

export const pendingInvitationsQuery = (groupId: string) =>
  queryOptions({
    queryKey: invitationKeys.pending(groupId),
    queryFn: ({ signal }) => api<{ invitations: InvitationView[] }>(`/api/groups/${groupId}/invitations`, { signal }),
    staleTime: STALE.shared,
  });

export const invitationPreviewQuery = (id: string) =>
  queryOptions({
    queryKey: invitationKeys.preview(id),
    queryFn: ({ signal }) => api<InvitationPreview>(`/api/invitations/${encodeURIComponent(id)}`, { signal }),
    staleTime: STALE.shared,
  });

export function usePendingInvitationsQuery(groupId: string, enabled = true) {
  return useQuery({ ...pendingInvitationsQuery(groupId), enabled });
}

export function useInvitationPreviewQuery(id: string) {
  return useQuery(invitationPreviewQuery(id));
}

/** Invalidates the pending list. */
export function useInviteMutation(groupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateInvitationBody) => api<CreatedInvitation>(`/api/groups/${groupId}/invitations`, { body }),
    onSuccess: () => qc.invalidateQueries({ queryKey: invitationKeys.pending(groupId) }),
  });
}

/** Invalidates the pending list. */
export function useRevokeInvitationMutation(groupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (invitationId: string) => api<InvitationView>(`/api/groups/${groupId}/invitations/${invitationId}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: invitationKeys.pending(groupId) }),
  });
}

/** Invalidates who I am (a new group) and the invitation's preview. */
export function useAcceptInvitationMutation(id: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: () => api<AcceptedInvitation>(`/api/invitations/${encodeURIComponent(id)}/accept`, { body: {} }),
    onSuccess: () => Promise.all([qc.invalidateQueries({ queryKey: meKeys.all }), qc.invalidateQueries({ queryKey: invitationKeys.preview(id) })]),
  });
}

import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { api } from "./api";
import { STALE } from "./query-client";

export type GroupRole = "owner" | "lead" | "chemist";
export interface MyGroup {
  id: string;
  name: string;
  slug: string;
  role: GroupRole;
}
export interface Me {
  user: { id: string; email: string; name: string };
  groups: MyGroup[];
  activeGroupId: string | null;
}
export interface GroupMember {
  id: string;
  userId: string;
  name: string;
  email: string;
  role: GroupRole;
  joinedAt: string;
}

export const meKeys = {
  all: ["me"] as const,
  me: () => [...meKeys.all, "self"] as const,
  members: (groupId: string) => [...meKeys.all, "members", groupId] as const,
};

export const meQuery = () => queryOptions({ queryKey: meKeys.me(), queryFn: () => api<Me>("/api/me"), staleTime: STALE.session });
export const membersQuery = (groupId: string) =>
  queryOptions({
    queryKey: meKeys.members(groupId),
    queryFn: () => api<{ members: GroupMember[]; yourRole: GroupRole }>(`/api/groups/${groupId}/members`),
  });

export function useMeQuery() {
  return useQuery(meQuery());
}

/** The active group and my role in it, or null. */
export function useActiveGroup(): (MyGroup & { userId: string }) | null {
  const me = useMeQuery().data;
  const g = me?.groups.find((x) => x.id === me.activeGroupId) ?? me?.groups[0];
  return g && me ? { ...g, userId: me.user.id } : null;
}

export function useMembersQuery(groupId: string | undefined) {
  return useQuery({ ...membersQuery(groupId ?? ""), enabled: !!groupId });
}

/** Invalidates everything: another group means other data everywhere. */
export function useActivateGroupMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (groupId: string) => api(`/api/groups/${groupId}/activate`, { method: "POST", body: {} }),
    onSuccess: () => qc.invalidateQueries(),
  });
}

export function useCreateGroupMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (name: string) => api<MyGroup>("/api/groups", { body: { name } }),
    onSuccess: () => qc.invalidateQueries(),
  });
}

export function useChangeRoleMutation(groupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (v: { memberId: string; role: GroupRole }) =>
      api(`/api/groups/${groupId}/members/${v.memberId}`, { method: "PATCH", body: { role: v.role } }),
    onSuccess: () => qc.invalidateQueries({ queryKey: meKeys.members(groupId) }),
  });
}

export function useRemoveMemberMutation(groupId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (memberId: string) => api(`/api/groups/${groupId}/members/${memberId}`, { method: "DELETE" }),
    onSuccess: () => qc.invalidateQueries({ queryKey: meKeys.members(groupId) }),
  });
}

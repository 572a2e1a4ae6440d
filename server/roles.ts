import { createAccessControl } from "better-auth/plugins/access";

/** Group roles, strongest first. owner ⊇ lead ⊇ chemist. */
export const GROUP_ROLES = ["owner", "lead", "chemist"] as const;
export type GroupRole = (typeof GROUP_ROLES)[number];

const RANK: Record<GroupRole, number> = { owner: 3, lead: 2, chemist: 1 };

export function isGroupRole(value: string): value is GroupRole {
  return (GROUP_ROLES as readonly string[]).includes(value);
}

/** True when `role` carries at least the rights of `needed`. */
export function roleAtLeast(role: GroupRole, needed: GroupRole): boolean {
  return RANK[role] >= RANK[needed];
}

const statements = {
  organization: ["update", "delete"],
  member: ["create", "update", "delete"],
  invitation: ["create", "cancel"],
  team: ["create", "update", "delete"],
  ac: ["create", "read", "update", "delete"],
} as const;

export const accessControl = createAccessControl(statements);

export const authRoles = {
  owner: accessControl.newRole({
    organization: ["update", "delete"],
    member: ["create", "update", "delete"],
    invitation: ["create", "cancel"],
    team: ["create", "update", "delete"],
    ac: ["create", "read", "update", "delete"],
  }),
  lead: accessControl.newRole({
    organization: ["update"],
    member: [],
    invitation: ["create", "cancel"],
    team: [],
    ac: ["read"],
  }),
  chemist: accessControl.newRole({ organization: [], member: [], invitation: [], team: [], ac: ["read"] }),
};

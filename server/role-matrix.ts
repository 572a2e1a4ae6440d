import type { GroupRole } from "./roles";

/*
 * Who may call each API route: the written-down role matrix. The routes enforce it with
 * requireUser / requireGroup(db, min) and their own author checks; tests/api/role-matrix.test.ts
 * walks every route the app registers against this list (a route missing here fails the test),
 * and DEVELOPERS.md's table is generated from it (`roleMatrixMarkdown()`).
 *
 * Guards:
 *  - public: no session needed (reference tables and computations; a signed-in member gets
 *    their group's reference corrections).
 *  - user: any signed-in account, in a group or not.
 *  - group: the caller's active group, at least `min`; 401 signed out, 403 in no group or below
 *    `min`, 404 for another group's record.
 *  - group-url: the group named in the URL; 401 signed out, 404 when not a member, 403 below `min`.
 *  - record-user: any signed-in account, but the record must belong to one of the caller's
 *    groups (404 otherwise).
 *  - invitee: signed in with the address the invitation was sent to (403 otherwise).
 * `own`: a chemist may do it only to a record they wrote (the case's or plan's author, the
 * photo's uploader); a lead or owner may do it to any record of the group.
 */

export type Guard = "public" | "user" | "group" | "group-url" | "record-user" | "invitee";

/** What a path parameter names, so the walk can fill it with a record of the right group. */
export type RecordKind =
  | "group"
  | "member"
  | "case"
  | "attempt"
  | "photo"
  | "plan"
  | "override"
  | "audit"
  | "invitation"
  | "advice"
  | "request"
  | "solvent"
  | "solute"
  | "remedy";

export interface RouteRule {
  method: "GET" | "POST" | "PATCH" | "PUT" | "DELETE";
  /** as Express holds it, under /api */
  path: string;
  action: string;
  guard: Guard;
  /** the weakest role allowed (group and group-url guards) */
  min?: GroupRole;
  own?: boolean;
  /** each path parameter and what it names */
  params?: Record<string, RecordKind>;
}

const pub = (method: RouteRule["method"], path: string, action: string, params?: RouteRule["params"]): RouteRule => ({
  method,
  path,
  action,
  guard: "public",
  params,
});
const grp = (
  method: RouteRule["method"],
  path: string,
  action: string,
  min: GroupRole,
  extra: Pick<RouteRule, "own" | "params"> = {},
): RouteRule => ({ method, path, action, guard: "group", min, ...extra });

export const ROLE_MATRIX: RouteRule[] = [
  // ── account and groups ────────────────────────────────────────────────────
  pub("GET", "/api/health", "check the server is up"),
  { method: "GET", path: "/api/me", action: "see your account and groups", guard: "user" },
  { method: "POST", path: "/api/groups", action: "create a group (becomes its owner)", guard: "user" },
  { method: "POST", path: "/api/groups/:id/activate", action: "switch to a group you belong to", guard: "group-url", min: "chemist", params: { id: "group" } },
  { method: "GET", path: "/api/groups/:id/members", action: "read group members", guard: "group-url", min: "chemist", params: { id: "group" } },
  {
    method: "PATCH",
    path: "/api/groups/:id/members/:memberId",
    action: "change a member's role",
    guard: "group-url",
    min: "owner",
    params: { id: "group", memberId: "member" },
  },
  {
    method: "DELETE",
    path: "/api/groups/:id/members/:memberId",
    action: "remove a member",
    guard: "group-url",
    min: "owner",
    params: { id: "group", memberId: "member" },
  },
  { method: "POST", path: "/api/groups/:id/invitations", action: "invite by e-mail (an owner may invite an owner)", guard: "group-url", min: "lead", params: { id: "group" } },
  { method: "GET", path: "/api/groups/:id/invitations", action: "see pending invitations", guard: "group-url", min: "lead", params: { id: "group" } },
  {
    method: "DELETE",
    path: "/api/groups/:id/invitations/:invitationId",
    action: "revoke a pending invitation",
    guard: "group-url",
    min: "lead",
    params: { id: "group", invitationId: "invitation" },
  },
  pub("GET", "/api/invitations/:id", "open an invitation link (shows group, role and address)", { id: "invitation" }),
  { method: "POST", path: "/api/invitations/:id/accept", action: "accept an invitation sent to your address", guard: "invitee", params: { id: "invitation" } },

  // ── reference tables and computations (public) ────────────────────────────
  pub("GET", "/api/solvents", "search solvents"),
  pub("GET", "/api/solvents/:key", "read a solvent with sources", { key: "solvent" }),
  pub("GET", "/api/aqueous-solutions", "read aqueous density tables"),
  pub("POST", "/api/layers/predict", "check which layer is which"),
  pub("POST", "/api/troubleshoot", "rank emulsion remedies (with the group's advice when signed in)"),
  pub("GET", "/api/remedies", "read the remedy catalogue"),
  pub("GET", "/api/remedies/:id", "read one remedy", { id: "remedy" }),
  pub("POST", "/api/plans/compute", "compute an extraction plan"),
  pub("POST", "/api/evaporation", "estimate rotary evaporation"),
  pub("POST", "/api/solvents/rank", "rank solvents for a job"),
  pub("GET", "/api/solvents/:key/substitutes", "suggest substitute solvents", { key: "solvent" }),

  // ── cases ─────────────────────────────────────────────────────────────────
  grp("POST", "/api/cases", "log a case", "chemist"),
  grp("GET", "/api/cases", "search and list the group's cases", "chemist"),
  grp("GET", "/api/cases/export.csv", "export the group's cases as CSV", "chemist"),
  grp("GET", "/api/cases/:id", "read a case", "chemist", { params: { id: "case" } }),
  grp("PATCH", "/api/cases/:id", "edit a case", "chemist", { own: true, params: { id: "case" } }),
  grp("POST", "/api/cases/:id/attempts", "add an attempt", "chemist", { own: true, params: { id: "case" } }),
  grp("PATCH", "/api/cases/:id/attempts/:attemptId", "edit an attempt", "chemist", { own: true, params: { id: "case", attemptId: "attempt" } }),
  grp("POST", "/api/cases/:id/follow", "follow a case (mail on new attempts)", "chemist", { params: { id: "case" } }),
  grp("DELETE", "/api/cases/:id/follow", "stop following a case", "chemist", { params: { id: "case" } }),
  grp("POST", "/api/cases/:id/photos", "add a photo to a case", "chemist", { own: true, params: { id: "case" } }),
  { method: "GET", path: "/api/photos/:id", action: "view a photo of your group", guard: "record-user", params: { id: "photo" } },
  { method: "GET", path: "/api/photos/:id/thumbnail", action: "view a photo's thumbnail", guard: "record-user", params: { id: "photo" } },
  grp("DELETE", "/api/photos/:id", "delete a photo", "chemist", { own: true, params: { id: "photo" } }),

  // ── saved plans ───────────────────────────────────────────────────────────
  grp("GET", "/api/plans", "list the group's saved plans", "chemist"),
  grp("POST", "/api/plans", "save a plan", "chemist"),
  grp("GET", "/api/plans/:id", "read a saved plan", "chemist", { params: { id: "plan" } }),
  grp("PATCH", "/api/plans/:id", "edit a saved plan", "chemist", { own: true, params: { id: "plan" } }),
  grp("DELETE", "/api/plans/:id", "delete a saved plan", "chemist", { own: true, params: { id: "plan" } }),

  // ── curation (the lead's desk) ────────────────────────────────────────────
  grp("GET", "/api/review", "see the review queue", "lead"),
  grp("POST", "/api/cases/:id/verify", "verify a case and its fix", "lead", { params: { id: "case" } }),
  grp("POST", "/api/review/verify", "verify several cases", "lead"),
  grp("POST", "/api/cases/:id/retire", "retire a case with a reason", "lead", { params: { id: "case" } }),
  grp("POST", "/api/cases/:id/restore", "restore a retired or merged case", "lead", { params: { id: "case" } }),
  grp("POST", "/api/cases/:id/merge", "merge a duplicate case", "lead", { params: { id: "case" } }),
  grp("POST", "/api/cases/:id/requests", "ask a case's author for more", "lead", { params: { id: "case" } }),
  grp("GET", "/api/cases/:id/requests", "read requests on a case", "chemist", { params: { id: "case" } }),
  grp("GET", "/api/my-requests", "see requests addressed to you", "chemist"),
  grp("PATCH", "/api/requests/:id", "answer a request on your case", "chemist", { own: true, params: { id: "request" } }),
  grp("GET", "/api/advice", "read the group's advice notes", "chemist"),
  grp("POST", "/api/advice", "promote a verified fix to a group note", "lead"),
  grp("PATCH", "/api/advice/:id", "edit or retire a group note", "lead", { params: { id: "advice" } }),
  grp("GET", "/api/reference/overrides", "read the group's reference corrections", "chemist"),
  grp("POST", "/api/reference/overrides", "correct a reference value (with source and reason)", "lead"),
  grp("DELETE", "/api/reference/overrides/:id", "retire a reference correction", "lead", { params: { id: "override" } }),
  grp("GET", "/api/reference/solvents/:key", "compare a solvent's shipped and group values", "chemist", { params: { key: "solvent" } }),
  grp("GET", "/api/reference/solutes/:key", "compare a solution's shipped and group density points", "chemist", { params: { key: "solute" } }),
  grp("GET", "/api/audit", "read and filter the audit log", "lead"),
  grp("POST", "/api/audit/:id/restore", "restore a version from the audit log", "lead", { params: { id: "audit" } }),
  grp("GET", "/api/insight", "see the group's insight charts", "chemist"),
  grp("GET", "/api/digest", "preview the weekly digest", "lead"),
  grp("POST", "/api/digest/send", "send the weekly digest now", "lead"),
  grp("GET", "/api/backup", "download the group's backup", "lead"),
  grp("POST", "/api/backup/import", "import a backup into an empty group", "lead"),

  // ── development only (not mounted in production) ──────────────────────────
  pub("GET", "/api/dev/outbox", "list mail caught by the local outbox (development)"),
  pub("DELETE", "/api/dev/outbox", "empty the local outbox (development)"),
];

const GUARD_WORDS: Record<Guard, string> = {
  public: "anyone",
  user: "signed in",
  group: "group",
  "group-url": "group in URL",
  "record-user": "signed in, own group's record",
  invitee: "the invited address",
};

/** Who may call a route, as a cell per role. */
export function allowedFor(rule: RouteRule, role: GroupRole): boolean {
  if (rule.guard === "public" || rule.guard === "user" || rule.guard === "record-user") return true;
  if (rule.guard === "invitee") return false;
  const rank: Record<GroupRole, number> = { owner: 3, lead: 2, chemist: 1 };
  return rank[role] >= rank[rule.min ?? "chemist"];
}

/** The table for DEVELOPERS.md. */
export function roleMatrixMarkdown(): string {
  const cell = (rule: RouteRule, role: GroupRole) => {
    if (rule.guard === "invitee") return "invitee";
    if (!allowedFor(rule, role)) return "";
    return rule.own && role === "chemist" ? "own" : "✓";
  };
  const lines = [
    "| route | action | who | chemist | lead | owner |",
    "|---|---|---|---|---|---|",
    ...ROLE_MATRIX.map(
      (r) => `| \`${r.method} ${r.path}\` | ${r.action} | ${GUARD_WORDS[r.guard]} | ${cell(r, "chemist")} | ${cell(r, "lead")} | ${cell(r, "owner")} |`,
    ),
  ];
  return lines.join("\n");
}

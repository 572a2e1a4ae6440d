import * as z from "./zod";

/*
 * The audit log's request and response shapes, shared by the server route and the desk screen.
 */

const filterText = (max: number) => z.optional(z.string().check(z.trim(), z.minLength(1), z.maxLength(max)));

export const auditListQuery = z.object({
  /** entity type, e.g. "case" or "reference-override" */
  entity: filterText(60),
  entityId: filterText(100),
  /** user id of whoever acted */
  actor: filterText(100),
  action: filterText(60),
  from: z.optional(z.coerce.date({ message: "Give the start as a date, e.g. 2025-03-01." })),
  to: z.optional(z.coerce.date({ message: "Give the end as a date, e.g. 2025-03-31." })),
  sort: z._default(z.enum(["newest", "oldest"]), "newest"),
  limit: z._default(z.coerce.number().check(z.int(), z.minimum(1), z.maximum(500)), 100),
  offset: z._default(z.coerce.number().check(z.int(), z.minimum(0), z.maximum(1_000_000)), 0),
});
export type AuditListQuery = z.infer<typeof auditListQuery>;

/** Which side of an entry to bring back: `before` undoes the change, `after` re-applies it. */
export const auditRestoreBody = z.object({
  version: z._default(z.enum(["before", "after"]), "before"),
  reason: z.optional(z.string().check(z.trim(), z.maxLength(500))),
});
export type AuditRestoreBody = z.infer<typeof auditRestoreBody>;

export interface AuditEntry {
  id: string;
  action: string;
  entityType: string;
  entityId: string;
  actor: { id: string; name: string; email: string } | null;
  before: unknown;
  after: unknown;
  reason: string | null;
  restoredFrom: string | null;
  createdAt: string;
  /** a restore handler exists for this entity type */
  restorable: boolean;
}

export interface AuditListResponse {
  entries: AuditEntry[];
  total: number;
  /** the actions and entity types present in this group's log, for the filter pickers */
  facets: { actions: string[]; entityTypes: string[]; actors: { id: string; name: string }[] };
}

export interface AuditRestoreResponse {
  /** the new audit entry describing the restore */
  entry: AuditEntry;
  /** the record as it is after the restore */
  record: unknown;
}

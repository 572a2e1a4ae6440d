import { z } from "zod";

/*
 * The audit log's request and response shapes, shared by the server route and the desk screen.
 */

export const auditListQuery = z.object({
  /** entity type, e.g. "case" or "reference-override" */
  entity: z.string().trim().min(1).max(60).optional(),
  entityId: z.string().trim().min(1).max(100).optional(),
  /** user id of whoever acted */
  actor: z.string().trim().min(1).max(100).optional(),
  action: z.string().trim().min(1).max(60).optional(),
  from: z.coerce.date({ message: "Give the start as a date, e.g. 2025-03-01." }).optional(),
  to: z.coerce.date({ message: "Give the end as a date, e.g. 2025-03-31." }).optional(),
  sort: z.enum(["newest", "oldest"]).default("newest"),
  limit: z.coerce.number().int().min(1).max(500).default(100),
  offset: z.coerce.number().int().min(0).max(1_000_000).default(0),
});
export type AuditListQuery = z.infer<typeof auditListQuery>;

/** Which side of an entry to bring back: `before` undoes the change, `after` re-applies it. */
export const auditRestoreBody = z.object({
  version: z.enum(["before", "after"]).default("before"),
  reason: z.string().trim().max(500).optional(),
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

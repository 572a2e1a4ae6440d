import { index, jsonb, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";

/**
 * One row per curation action in a lab group: who did what to which record, with the record
 * before and after. Written in the same transaction as the change it describes; never edited.
 */
export const auditLog = pgTable(
  "audit_log",
  {
    id: text("id").primaryKey(),
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    /** null when the system acted (e.g. an import), or when the actor's account was removed */
    actorId: text("actor_id").references(() => user.id, { onDelete: "set null" }),
    /** a verb of the area, e.g. "verify", "merge", "retire", "restore", "override.create" */
    action: text("action").notNull(),
    /** what kind of record changed, e.g. "case", "reference-override", "advice-note" */
    entityType: text("entity_type").notNull(),
    entityId: text("entity_id").notNull(),
    before: jsonb("before").$type<unknown>(),
    after: jsonb("after").$type<unknown>(),
    reason: text("reason"),
    /** set on a restore: the entry whose `before` (or `after`) was brought back */
    restoredFrom: text("restored_from"),
    createdAt: timestamp("created_at", { withTimezone: true, mode: "date" }).notNull().defaultNow(),
  },
  (t) => [
    index("audit_log_group_time_idx").on(t.groupId, t.createdAt),
    index("audit_log_group_entity_idx").on(t.groupId, t.entityType, t.entityId),
  ],
);

export type AuditRow = typeof auditLog.$inferSelect;

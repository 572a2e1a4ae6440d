import { sql } from "drizzle-orm";
import { index, jsonb, pgTable, text, timestamp, uniqueIndex } from "drizzle-orm/pg-core";
import type { ReferenceOverride } from "../../knowledge/overrides";
import { organization, user } from "./auth";

const stamp = (name: string) => timestamp(name, { withTimezone: true, mode: "date" });

/**
 * A lab group's correction to the shipped reference tables (a solvent value, an aqueous density
 * point, or a solvent the tables lack). Retired instead of deleted, so its history stays.
 */
export const referenceOverrides = pgTable(
  "reference_overrides",
  {
    id: text("id").primaryKey(),
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    kind: text("kind").$type<ReferenceOverride["kind"]>().notNull(),
    /**
     * What the correction replaces, e.g. "solvent-value:dichloromethane:densityGPerMl20C" or
     * "aqueous-point:sodium-chloride:26"; one active correction per subject and group.
     */
    subject: text("subject").notNull(),
    /** the solvent or solute key the correction belongs to */
    targetKey: text("target_key").notNull(),
    /** the correction exactly as knowledge/overrides.ts applies it (its source included) */
    payload: jsonb("payload").$type<ReferenceOverride>().notNull(),
    /** where the value comes from: an SDS, a handbook table, a measurement in the lab */
    source: text("source").notNull(),
    /** why the shipped value is not right for this group */
    reason: text("reason").notNull(),
    createdBy: text("created_by").references(() => user.id, { onDelete: "set null" }),
    createdAt: stamp("created_at").notNull().defaultNow(),
    retiredAt: stamp("retired_at"),
    retiredBy: text("retired_by").references(() => user.id, { onDelete: "set null" }),
    retiredReason: text("retired_reason"),
  },
  (t) => [
    uniqueIndex("reference_overrides_active_subject_idx").on(t.groupId, t.subject).where(sql`${t.retiredAt} is null`),
    index("reference_overrides_group_idx").on(t.groupId, t.createdAt),
  ],
);

export type ReferenceOverrideRow = typeof referenceOverrides.$inferSelect;

import { index, jsonb, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import type { PlanDocument } from "../../knowledge/contracts/plans";
import { organization, user } from "./auth";

const stamp = (name: string) => timestamp(name, { withTimezone: true, mode: "date" });

/** An extraction plan saved in a lab group: the builder's input, recomputed whenever it is shown. */
export const plans = pgTable(
  "plans",
  {
    id: text("id").primaryKey(),
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    authorId: text("author_id")
      .notNull()
      .references(() => user.id),
    title: text("title").notNull(),
    /** the compute request as entered (solvent, components, washes, panel settings) */
    input: jsonb("input").$type<PlanDocument>().notNull(),
    notes: text("notes").notNull().default(""),
    updatedBy: text("updated_by").references(() => user.id),
    createdAt: stamp("created_at").notNull().defaultNow(),
    updatedAt: stamp("updated_at").notNull().defaultNow(),
  },
  (t) => [index("plans_group_updated_idx").on(t.groupId, t.updatedAt)],
);

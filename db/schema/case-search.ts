import { bigint, index, pgTable, text } from "drizzle-orm/pg-core";
import { cases } from "./cases";

/*
 * Which transaction last changed each case's searchable words. Triggers on `cases` (in the
 * migration that creates this table) keep it current for every write, from this process or any
 * other, so a server finds the cases that changed since it last looked — one index range read —
 * and adds their words to its typo vocabulary instead of reading the whole group again.
 */

export const caseSearchStamps = pgTable(
  "case_search_stamps",
  {
    caseId: text("case_id")
      .primaryKey()
      .references(() => cases.id, { onDelete: "cascade" }),
    groupId: text("group_id").notNull(),
    /** pg_current_xact_id() of the writing transaction */
    xact: bigint("xact", { mode: "number" }).notNull(),
  },
  (t) => [index("case_search_stamps_group_xact_idx").on(t.groupId, t.xact)],
);

import { sql } from "drizzle-orm";
import { index, integer, jsonb, pgTable, text, timestamp } from "drizzle-orm/pg-core";
import { organization, user } from "./auth";
import { cases } from "./cases";

/*
 * The lead's desk: requests to a case's author, merges of duplicate cases (kept so a merge can
 * be undone exactly) and the group's advice notes on remedies. Nothing here is ever deleted.
 */

const stamp = (name: string) => timestamp(name, { withTimezone: true, mode: "date" });

/** A lead asks a case's author for more (a photo, the pH, what happened next). */
export const caseRequests = pgTable(
  "case_requests",
  {
    id: text("id").primaryKey(),
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    caseId: text("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    askedBy: text("asked_by")
      .notNull()
      .references(() => user.id),
    /** the case's author when the request was made */
    askedOf: text("asked_of")
      .notNull()
      .references(() => user.id),
    text: text("text").notNull(),
    /** open until the author (or a lead) marks it answered */
    status: text("status").notNull().default("open"),
    reply: text("reply"),
    answeredAt: stamp("answered_at"),
    answeredBy: text("answered_by").references(() => user.id),
    createdAt: stamp("created_at").notNull().defaultNow(),
  },
  (t) => [index("case_requests_case_idx").on(t.caseId, t.createdAt), index("case_requests_asked_of_idx").on(t.groupId, t.askedOf, t.status)],
);

/** What one merge moved, so restoring the merged case puts every attempt and photo back. */
export const caseMerges = pgTable(
  "case_merges",
  {
    id: text("id").primaryKey(),
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    keptId: text("kept_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    mergedId: text("merged_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    /** attempt id → its position on the merged case before the move */
    movedAttempts: jsonb("moved_attempts").$type<{ id: string; position: number }[]>().notNull(),
    movedPhotoIds: text("moved_photo_ids").array().notNull().default(sql`'{}'::text[]`),
    /** followers added to the kept case by the merge (not those already following it) */
    addedFollowerIds: text("added_follower_ids").array().notNull().default(sql`'{}'::text[]`),
    mergedBy: text("merged_by")
      .notNull()
      .references(() => user.id),
    createdAt: stamp("created_at").notNull().defaultNow(),
    undoneAt: stamp("undone_at"),
    undoneBy: text("undone_by").references(() => user.id),
  },
  (t) => [index("case_merges_merged_idx").on(t.groupId, t.mergedId), index("case_merges_kept_idx").on(t.keptId)],
);

/**
 * A group note on a remedy for a kind of system ("for chlorinated solvents over basic water,
 * filter first"), promoted from a verified fix. Null signature parts mean "any".
 */
export const groupAdvice = pgTable(
  "group_advice",
  {
    id: text("id").primaryKey(),
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    remedyId: text("remedy_id").notNull(),
    solventFamily: text("solvent_family"),
    phBand: text("ph_band"),
    causeCode: text("cause_code"),
    text: text("text").notNull(),
    /** the verified cases the note came from, first the one it was promoted from */
    sourceCaseIds: text("source_case_ids").array().notNull().default(sql`'{}'::text[]`),
    createdBy: text("created_by")
      .notNull()
      .references(() => user.id),
    createdAt: stamp("created_at").notNull().defaultNow(),
    updatedAt: stamp("updated_at").notNull().defaultNow(),
    /** bumped on each change, so the audit log can name the version a restore returns to */
    version: integer("version").notNull().default(1),
    retiredAt: stamp("retired_at"),
    retiredBy: text("retired_by").references(() => user.id),
    retiredReason: text("retired_reason"),
  },
  (t) => [index("group_advice_group_idx").on(t.groupId, t.remedyId)],
);

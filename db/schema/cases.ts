import { sql } from "drizzle-orm";
import {
  boolean,
  customType,
  doublePrecision,
  index,
  integer,
  jsonb,
  pgTable,
  primaryKey,
  text,
  timestamp,
  uniqueIndex,
  type AnyPgColumn,
} from "drizzle-orm/pg-core";
import type {
  CaseComponent,
  CasePredictedLayers,
  CaseSeen,
  CaseSystem,
} from "../../knowledge/contracts/cases";
import { organization, user } from "./auth";

/** PostgreSQL's tsvector (drizzle has no built-in type for it). */
const tsvector = customType<{ data: string }>({
  dataType: () => "tsvector",
});

const stamp = (name: string) => timestamp(name, { withTimezone: true, mode: "date" });

/** A logged work-up or stubborn emulsion, owned by one lab group. */
export const cases = pgTable(
  "cases",
  {
    id: text("id").primaryKey(),
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    authorId: text("author_id")
      .notNull()
      .references(() => user.id),
    title: text("title").notNull(),
    /** organic parts and aqueous phase as entered, with the knowledge keys they resolved to */
    system: jsonb("system").$type<CaseSystem>().notNull(),
    // Denormalised from `system` so filters and the similar-case match run in SQL.
    solventKeys: text("solvent_keys").array().notNull().default(sql`'{}'::text[]`),
    aqueousKey: text("aqueous_key"),
    solventFamily: text("solvent_family"),
    phBand: text("ph_band"),
    tags: text("tags").array().notNull().default(sql`'{}'::text[]`),
    causes: text("causes").array().notNull().default(sql`'{}'::text[]`),
    components: jsonb("components").$type<CaseComponent[]>().notNull().default([]),
    predicted: jsonb("predicted").$type<CasePredictedLayers>(),
    observedBottom: text("observed_bottom"),
    seen: jsonb("seen").$type<CaseSeen>().notNull(),
    emulsionKind: text("emulsion_kind"),
    notes: text("notes").notNull().default(""),
    status: text("status").notNull().default("open"),
    finalOutcome: text("final_outcome"),
    recovery: jsonb("recovery").$type<{ massG?: number; percent?: number }>(),
    /** everything the search box looks at, in one lower-case string (title, notes, solvent synonyms, remedies, tags) */
    searchText: text("search_text").notNull().default(""),
    /** full-text vector of the search text, title words weighted highest ('simple': no stemming, any language) */
    searchVector: tsvector("search_vector").generatedAlwaysAs(
      sql`setweight(to_tsvector('simple', "title"), 'A') || setweight(to_tsvector('simple', "search_text"), 'D')`,
    ),
    occurredAt: stamp("occurred_at").notNull().defaultNow(),
    createdAt: stamp("created_at").notNull().defaultNow(),
    updatedAt: stamp("updated_at").notNull().defaultNow(),
    // Curation by a lead (verify, retire, merge); nothing is ever deleted.
    verified: boolean("verified").notNull().default(false),
    verifiedBy: text("verified_by").references(() => user.id),
    verifiedAt: stamp("verified_at"),
    verifiedAttemptId: text("verified_attempt_id"),
    retired: boolean("retired").notNull().default(false),
    retiredAt: stamp("retired_at"),
    retiredBy: text("retired_by").references(() => user.id),
    retiredReason: text("retired_reason"),
    mergedInto: text("merged_into").references((): AnyPgColumn => cases.id),
  },
  (t) => [
    index("cases_group_occurred_idx").on(t.groupId, t.occurredAt),
    index("cases_group_status_idx").on(t.groupId, t.status),
    index("cases_group_author_idx").on(t.groupId, t.authorId),
    index("cases_group_signature_idx").on(t.groupId, t.solventFamily, t.phBand),
    index("cases_group_aqueous_idx").on(t.groupId, t.aqueousKey),
    index("cases_solvent_keys_idx").using("gin", t.solventKeys),
    index("cases_tags_idx").using("gin", t.tags),
    index("cases_causes_idx").using("gin", t.causes),
    index("cases_search_idx").using("gin", t.searchVector),
  ],
);

/** One remedy tried on a case, in order. */
export const caseAttempts = pgTable(
  "case_attempts",
  {
    id: text("id").primaryKey(),
    caseId: text("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    /** the case's group, repeated so evidence queries scope without a join */
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    position: integer("position").notNull(),
    remedyId: text("remedy_id"),
    description: text("description"),
    amount: text("amount"),
    minutes: doublePrecision("minutes"),
    outcome: text("outcome").notNull(),
    note: text("note"),
    authorId: text("author_id")
      .notNull()
      .references(() => user.id),
    createdAt: stamp("created_at").notNull().defaultNow(),
    updatedAt: stamp("updated_at").notNull().defaultNow(),
  },
  (t) => [
    uniqueIndex("case_attempts_case_position_idx").on(t.caseId, t.position),
    index("case_attempts_group_remedy_idx").on(t.groupId, t.remedyId, t.outcome),
  ],
);

/** A photo of a case; the bytes live in storage under random keys. */
export const casePhotos = pgTable(
  "case_photos",
  {
    id: text("id").primaryKey(),
    caseId: text("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    groupId: text("group_id")
      .notNull()
      .references(() => organization.id, { onDelete: "cascade" }),
    storageKey: text("storage_key").notNull().unique(),
    thumbnailKey: text("thumbnail_key").notNull().unique(),
    mimeType: text("mime_type").notNull(),
    sizeBytes: integer("size_bytes").notNull(),
    width: integer("width").notNull(),
    height: integer("height").notNull(),
    thumbnailSizeBytes: integer("thumbnail_size_bytes").notNull(),
    uploadedBy: text("uploaded_by")
      .notNull()
      .references(() => user.id),
    createdAt: stamp("created_at").notNull().defaultNow(),
  },
  (t) => [index("case_photos_case_idx").on(t.caseId, t.createdAt), index("case_photos_group_idx").on(t.groupId)],
);

/** Members who want to hear about a case (mail comes with the lead's desk). */
export const caseFollowers = pgTable(
  "case_followers",
  {
    caseId: text("case_id")
      .notNull()
      .references(() => cases.id, { onDelete: "cascade" }),
    userId: text("user_id")
      .notNull()
      .references(() => user.id, { onDelete: "cascade" }),
    createdAt: stamp("created_at").notNull().defaultNow(),
  },
  (t) => [primaryKey({ columns: [t.caseId, t.userId] }), index("case_followers_user_idx").on(t.userId)],
);

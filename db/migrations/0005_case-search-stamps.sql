CREATE TABLE "case_search_stamps" (
	"case_id" text PRIMARY KEY NOT NULL,
	"group_id" text NOT NULL,
	"xact" bigint NOT NULL
);
--> statement-breakpoint
ALTER TABLE "case_search_stamps" ADD CONSTRAINT "case_search_stamps_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "case_search_stamps_group_xact_idx" ON "case_search_stamps" USING btree ("group_id","xact");--> statement-breakpoint
-- Every statement that writes cases stamps them with its transaction, so a server can ask which
-- cases changed since a snapshot it took. An update stamps only the cases whose words changed.
CREATE FUNCTION "case_search_stamp_inserted"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO "case_search_stamps" ("case_id", "group_id", "xact")
    SELECT n."id", n."group_id", pg_current_xact_id()::text::bigint FROM "new_cases" n
    ON CONFLICT ("case_id") DO UPDATE SET "group_id" = excluded."group_id", "xact" = excluded."xact";
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE FUNCTION "case_search_stamp_updated"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO "case_search_stamps" ("case_id", "group_id", "xact")
    SELECT n."id", n."group_id", pg_current_xact_id()::text::bigint
    FROM "new_cases" n JOIN "old_cases" o ON o."id" = n."id"
    WHERE n."search_vector" IS DISTINCT FROM o."search_vector" OR n."group_id" IS DISTINCT FROM o."group_id"
    ON CONFLICT ("case_id") DO UPDATE SET "group_id" = excluded."group_id", "xact" = excluded."xact";
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "cases_search_stamp_insert" AFTER INSERT ON "cases" REFERENCING NEW TABLE AS "new_cases"
  FOR EACH STATEMENT EXECUTE FUNCTION "case_search_stamp_inserted"();--> statement-breakpoint
CREATE TRIGGER "cases_search_stamp_update" AFTER UPDATE ON "cases" REFERENCING OLD TABLE AS "old_cases" NEW TABLE AS "new_cases"
  FOR EACH STATEMENT EXECUTE FUNCTION "case_search_stamp_updated"();--> statement-breakpoint
INSERT INTO "case_search_stamps" ("case_id", "group_id", "xact")
  SELECT "id", "group_id", pg_current_xact_id()::text::bigint FROM "cases";
--> statement-breakpoint
-- Keep the search vector in the row: moved out to the TOAST table (a case's row passes 2 kB),
-- every match test fetched it from there, most of a broad search's time.
ALTER TABLE "cases" ALTER COLUMN "search_vector" SET STORAGE MAIN;

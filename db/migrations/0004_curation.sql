CREATE TABLE "case_merges" (
	"id" text PRIMARY KEY NOT NULL,
	"group_id" text NOT NULL,
	"kept_id" text NOT NULL,
	"merged_id" text NOT NULL,
	"moved_attempts" jsonb NOT NULL,
	"moved_photo_ids" text[] DEFAULT '{}'::text[] NOT NULL,
	"added_follower_ids" text[] DEFAULT '{}'::text[] NOT NULL,
	"merged_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"undone_at" timestamp with time zone,
	"undone_by" text
);
--> statement-breakpoint
CREATE TABLE "case_requests" (
	"id" text PRIMARY KEY NOT NULL,
	"group_id" text NOT NULL,
	"case_id" text NOT NULL,
	"asked_by" text NOT NULL,
	"asked_of" text NOT NULL,
	"text" text NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"reply" text,
	"answered_at" timestamp with time zone,
	"answered_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "group_advice" (
	"id" text PRIMARY KEY NOT NULL,
	"group_id" text NOT NULL,
	"remedy_id" text NOT NULL,
	"solvent_family" text,
	"ph_band" text,
	"cause_code" text,
	"text" text NOT NULL,
	"source_case_ids" text[] DEFAULT '{}'::text[] NOT NULL,
	"created_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"version" integer DEFAULT 1 NOT NULL,
	"retired_at" timestamp with time zone,
	"retired_by" text,
	"retired_reason" text
);
--> statement-breakpoint
CREATE TABLE "plans" (
	"id" text PRIMARY KEY NOT NULL,
	"group_id" text NOT NULL,
	"author_id" text NOT NULL,
	"title" text NOT NULL,
	"input" jsonb NOT NULL,
	"notes" text DEFAULT '' NOT NULL,
	"updated_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "case_merges" ADD CONSTRAINT "case_merges_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_merges" ADD CONSTRAINT "case_merges_kept_id_cases_id_fk" FOREIGN KEY ("kept_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_merges" ADD CONSTRAINT "case_merges_merged_id_cases_id_fk" FOREIGN KEY ("merged_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_merges" ADD CONSTRAINT "case_merges_merged_by_user_id_fk" FOREIGN KEY ("merged_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_merges" ADD CONSTRAINT "case_merges_undone_by_user_id_fk" FOREIGN KEY ("undone_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_requests" ADD CONSTRAINT "case_requests_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_requests" ADD CONSTRAINT "case_requests_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_requests" ADD CONSTRAINT "case_requests_asked_by_user_id_fk" FOREIGN KEY ("asked_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_requests" ADD CONSTRAINT "case_requests_asked_of_user_id_fk" FOREIGN KEY ("asked_of") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_requests" ADD CONSTRAINT "case_requests_answered_by_user_id_fk" FOREIGN KEY ("answered_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "group_advice" ADD CONSTRAINT "group_advice_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "group_advice" ADD CONSTRAINT "group_advice_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "group_advice" ADD CONSTRAINT "group_advice_retired_by_user_id_fk" FOREIGN KEY ("retired_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_updated_by_user_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "case_merges_merged_idx" ON "case_merges" USING btree ("group_id","merged_id");--> statement-breakpoint
CREATE INDEX "case_merges_kept_idx" ON "case_merges" USING btree ("kept_id");--> statement-breakpoint
CREATE INDEX "case_requests_case_idx" ON "case_requests" USING btree ("case_id","created_at");--> statement-breakpoint
CREATE INDEX "case_requests_asked_of_idx" ON "case_requests" USING btree ("group_id","asked_of","status");--> statement-breakpoint
CREATE INDEX "group_advice_group_idx" ON "group_advice" USING btree ("group_id","remedy_id");--> statement-breakpoint
CREATE INDEX "plans_group_updated_idx" ON "plans" USING btree ("group_id","updated_at");
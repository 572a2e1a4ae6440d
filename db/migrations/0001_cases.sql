CREATE TABLE "case_attempts" (
	"id" text PRIMARY KEY NOT NULL,
	"case_id" text NOT NULL,
	"group_id" text NOT NULL,
	"position" integer NOT NULL,
	"remedy_id" text,
	"description" text,
	"amount" text,
	"minutes" double precision,
	"outcome" text NOT NULL,
	"note" text,
	"author_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "case_followers" (
	"case_id" text NOT NULL,
	"user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "case_followers_case_id_user_id_pk" PRIMARY KEY("case_id","user_id")
);
--> statement-breakpoint
CREATE TABLE "case_photos" (
	"id" text PRIMARY KEY NOT NULL,
	"case_id" text NOT NULL,
	"group_id" text NOT NULL,
	"storage_key" text NOT NULL,
	"thumbnail_key" text NOT NULL,
	"mime_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"thumbnail_size_bytes" integer NOT NULL,
	"uploaded_by" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "case_photos_storage_key_unique" UNIQUE("storage_key"),
	CONSTRAINT "case_photos_thumbnail_key_unique" UNIQUE("thumbnail_key")
);
--> statement-breakpoint
CREATE TABLE "cases" (
	"id" text PRIMARY KEY NOT NULL,
	"group_id" text NOT NULL,
	"author_id" text NOT NULL,
	"title" text NOT NULL,
	"system" jsonb NOT NULL,
	"solvent_keys" text[] DEFAULT '{}'::text[] NOT NULL,
	"aqueous_key" text,
	"solvent_family" text,
	"ph_band" text,
	"tags" text[] DEFAULT '{}'::text[] NOT NULL,
	"causes" text[] DEFAULT '{}'::text[] NOT NULL,
	"components" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"predicted" jsonb,
	"observed_bottom" text,
	"seen" jsonb NOT NULL,
	"emulsion_kind" text,
	"notes" text DEFAULT '' NOT NULL,
	"status" text DEFAULT 'open' NOT NULL,
	"final_outcome" text,
	"recovery" jsonb,
	"search_text" text DEFAULT '' NOT NULL,
	"occurred_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"verified" boolean DEFAULT false NOT NULL,
	"verified_by" text,
	"verified_at" timestamp with time zone,
	"verified_attempt_id" text,
	"retired" boolean DEFAULT false NOT NULL,
	"retired_at" timestamp with time zone,
	"retired_by" text,
	"retired_reason" text,
	"merged_into" text
);
--> statement-breakpoint
ALTER TABLE "case_attempts" ADD CONSTRAINT "case_attempts_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_attempts" ADD CONSTRAINT "case_attempts_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_attempts" ADD CONSTRAINT "case_attempts_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_followers" ADD CONSTRAINT "case_followers_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_followers" ADD CONSTRAINT "case_followers_user_id_user_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."user"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_photos" ADD CONSTRAINT "case_photos_case_id_cases_id_fk" FOREIGN KEY ("case_id") REFERENCES "public"."cases"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_photos" ADD CONSTRAINT "case_photos_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "case_photos" ADD CONSTRAINT "case_photos_uploaded_by_user_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_author_id_user_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_verified_by_user_id_fk" FOREIGN KEY ("verified_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_retired_by_user_id_fk" FOREIGN KEY ("retired_by") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "cases" ADD CONSTRAINT "cases_merged_into_cases_id_fk" FOREIGN KEY ("merged_into") REFERENCES "public"."cases"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "case_attempts_case_position_idx" ON "case_attempts" USING btree ("case_id","position");--> statement-breakpoint
CREATE INDEX "case_attempts_group_remedy_idx" ON "case_attempts" USING btree ("group_id","remedy_id","outcome");--> statement-breakpoint
CREATE INDEX "case_followers_user_idx" ON "case_followers" USING btree ("user_id");--> statement-breakpoint
CREATE INDEX "case_photos_case_idx" ON "case_photos" USING btree ("case_id","created_at");--> statement-breakpoint
CREATE INDEX "case_photos_group_idx" ON "case_photos" USING btree ("group_id");--> statement-breakpoint
CREATE INDEX "cases_group_occurred_idx" ON "cases" USING btree ("group_id","occurred_at");--> statement-breakpoint
CREATE INDEX "cases_group_status_idx" ON "cases" USING btree ("group_id","status");--> statement-breakpoint
CREATE INDEX "cases_group_author_idx" ON "cases" USING btree ("group_id","author_id");--> statement-breakpoint
CREATE INDEX "cases_group_signature_idx" ON "cases" USING btree ("group_id","solvent_family","ph_band");--> statement-breakpoint
CREATE INDEX "cases_group_aqueous_idx" ON "cases" USING btree ("group_id","aqueous_key");--> statement-breakpoint
CREATE INDEX "cases_solvent_keys_idx" ON "cases" USING gin ("solvent_keys");--> statement-breakpoint
CREATE INDEX "cases_tags_idx" ON "cases" USING gin ("tags");--> statement-breakpoint
CREATE INDEX "cases_causes_idx" ON "cases" USING gin ("causes");
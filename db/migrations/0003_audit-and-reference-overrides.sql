CREATE TABLE "audit_log" (
	"id" text PRIMARY KEY NOT NULL,
	"group_id" text NOT NULL,
	"actor_id" text,
	"action" text NOT NULL,
	"entity_type" text NOT NULL,
	"entity_id" text NOT NULL,
	"before" jsonb,
	"after" jsonb,
	"reason" text,
	"restored_from" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "reference_overrides" (
	"id" text PRIMARY KEY NOT NULL,
	"group_id" text NOT NULL,
	"kind" text NOT NULL,
	"subject" text NOT NULL,
	"target_key" text NOT NULL,
	"payload" jsonb NOT NULL,
	"source" text NOT NULL,
	"reason" text NOT NULL,
	"created_by" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"retired_at" timestamp with time zone,
	"retired_by" text,
	"retired_reason" text
);
--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "audit_log" ADD CONSTRAINT "audit_log_actor_id_user_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reference_overrides" ADD CONSTRAINT "reference_overrides_group_id_organization_id_fk" FOREIGN KEY ("group_id") REFERENCES "public"."organization"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reference_overrides" ADD CONSTRAINT "reference_overrides_created_by_user_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "reference_overrides" ADD CONSTRAINT "reference_overrides_retired_by_user_id_fk" FOREIGN KEY ("retired_by") REFERENCES "public"."user"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "audit_log_group_time_idx" ON "audit_log" USING btree ("group_id","created_at");--> statement-breakpoint
CREATE INDEX "audit_log_group_entity_idx" ON "audit_log" USING btree ("group_id","entity_type","entity_id");--> statement-breakpoint
CREATE UNIQUE INDEX "reference_overrides_active_subject_idx" ON "reference_overrides" USING btree ("group_id","subject") WHERE "reference_overrides"."retired_at" is null;--> statement-breakpoint
CREATE INDEX "reference_overrides_group_idx" ON "reference_overrides" USING btree ("group_id","created_at");
CREATE TYPE "public"."tag_format" AS ENUM('sheet_1x2_625', 'single_large');--> statement-breakpoint
CREATE TYPE "public"."tag_status" AS ENUM('unassigned', 'assigned', 'retired');--> statement-breakpoint
CREATE TYPE "public"."photo_kind" AS ENUM('nameplate', 'before', 'after', 'finding', 'other');--> statement-breakpoint
CREATE TABLE "tag_batches" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"format" "tag_format" NOT NULL,
	"count" integer NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tags" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"code" text NOT NULL,
	"batch_id" uuid NOT NULL,
	"appliance_id" uuid,
	"status" "tag_status" DEFAULT 'unassigned' NOT NULL,
	"assigned_at" timestamp with time zone,
	"assigned_by" uuid,
	"retired_at" timestamp with time zone,
	"retired_note" text,
	"replaced_by_tag_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "photos" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"appliance_id" uuid NOT NULL,
	"visit_id" uuid,
	"component_id" uuid,
	"kind" "photo_kind" NOT NULL,
	"caption" text,
	"homeowner_visible" boolean DEFAULT false NOT NULL,
	"sha256" text NOT NULL,
	"width" integer NOT NULL,
	"height" integer NOT NULL,
	"display_key" text NOT NULL,
	"thumb_key" text NOT NULL,
	"bytes" integer NOT NULL,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "photos_same_file_per_record_uq" UNIQUE NULLS NOT DISTINCT("appliance_id","visit_id","component_id","sha256")
);
--> statement-breakpoint
ALTER TABLE "tag_batches" ADD CONSTRAINT "tag_batches_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tag_batches" ADD CONSTRAINT "tag_batches_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tags" ADD CONSTRAINT "tags_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tags" ADD CONSTRAINT "tags_batch_id_tag_batches_id_fk" FOREIGN KEY ("batch_id") REFERENCES "public"."tag_batches"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tags" ADD CONSTRAINT "tags_appliance_id_appliances_id_fk" FOREIGN KEY ("appliance_id") REFERENCES "public"."appliances"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tags" ADD CONSTRAINT "tags_assigned_by_users_id_fk" FOREIGN KEY ("assigned_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tags" ADD CONSTRAINT "tags_replaced_by_tag_id_tags_id_fk" FOREIGN KEY ("replaced_by_tag_id") REFERENCES "public"."tags"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_appliance_id_appliances_id_fk" FOREIGN KEY ("appliance_id") REFERENCES "public"."appliances"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_visit_id_visits_id_fk" FOREIGN KEY ("visit_id") REFERENCES "public"."visits"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_component_id_components_id_fk" FOREIGN KEY ("component_id") REFERENCES "public"."components"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "tag_batches_company_idx" ON "tag_batches" USING btree ("company_id","created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "tags_code_uq" ON "tags" USING btree ("code");--> statement-breakpoint
CREATE UNIQUE INDEX "tags_one_active_per_appliance_uq" ON "tags" USING btree ("appliance_id") WHERE "tags"."status" = 'assigned';--> statement-breakpoint
CREATE INDEX "tags_batch_idx" ON "tags" USING btree ("batch_id");--> statement-breakpoint
CREATE INDEX "tags_company_appliance_idx" ON "tags" USING btree ("company_id","appliance_id");--> statement-breakpoint
CREATE INDEX "photos_company_appliance_idx" ON "photos" USING btree ("company_id","appliance_id","created_at");
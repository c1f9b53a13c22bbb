CREATE TYPE "public"."import_status" AS ENUM('uploaded', 'queued', 'importing', 'done', 'failed');--> statement-breakpoint
ALTER TYPE "public"."timeline_kind" ADD VALUE 'import';--> statement-breakpoint
CREATE TABLE "import_files" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"file_name" text NOT NULL,
	"object_key" text,
	"bytes" integer NOT NULL,
	"encoding" text NOT NULL,
	"headers" jsonb NOT NULL,
	"row_count" integer NOT NULL,
	"mapping" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"status" "import_status" DEFAULT 'uploaded' NOT NULL,
	"rows_done" integer DEFAULT 0 NOT NULL,
	"error_rows" integer DEFAULT 0 NOT NULL,
	"counts" jsonb,
	"summary" jsonb,
	"heartbeat_at" timestamp with time zone,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	"failure" text,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "import_mappings" (
	"company_id" uuid PRIMARY KEY NOT NULL,
	"by_header" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "appliances" ADD COLUMN "external_id" text;--> statement-breakpoint
ALTER TABLE "appliances" ADD COLUMN "import_id" uuid;--> statement-breakpoint
ALTER TABLE "customers" ADD COLUMN "external_id" text;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "import_id" uuid;--> statement-breakpoint
ALTER TABLE "import_files" ADD CONSTRAINT "import_files_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "import_files" ADD CONSTRAINT "import_files_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "import_mappings" ADD CONSTRAINT "import_mappings_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "import_files_company_idx" ON "import_files" USING btree ("company_id","created_at");--> statement-breakpoint
CREATE INDEX "import_files_status_idx" ON "import_files" USING btree ("status","heartbeat_at");--> statement-breakpoint
CREATE UNIQUE INDEX "appliances_company_external_id_uq" ON "appliances" USING btree ("company_id","external_id") WHERE "appliances"."external_id" is not null;--> statement-breakpoint
CREATE UNIQUE INDEX "customers_company_external_id_uq" ON "customers" USING btree ("company_id","external_id") WHERE "customers"."external_id" is not null;
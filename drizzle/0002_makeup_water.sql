CREATE TYPE "public"."makeup_water_kind" AS ENUM('meter_reading', 'added_by_hand');--> statement-breakpoint
CREATE TABLE "makeup_water_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"appliance_id" uuid NOT NULL,
	"recorded_on" date NOT NULL,
	"kind" "makeup_water_kind" NOT NULL,
	"gallons" numeric(10, 2),
	"note" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" uuid
);
--> statement-breakpoint
ALTER TABLE "makeup_water_entries" ADD CONSTRAINT "makeup_water_entries_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "makeup_water_entries" ADD CONSTRAINT "makeup_water_entries_appliance_id_appliances_id_fk" FOREIGN KEY ("appliance_id") REFERENCES "public"."appliances"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "makeup_water_entries" ADD CONSTRAINT "makeup_water_entries_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "makeup_water_appliance_day_idx" ON "makeup_water_entries" USING btree ("appliance_id","recorded_on");
CREATE TYPE "public"."booking_source" AS ENUM('due_list', 'annual_service', 'service_request', 'reminder_reply', 'phone', 'life_record', 'follow_up');--> statement-breakpoint
CREATE TYPE "public"."booking_status" AS ENUM('booked', 'confirmed', 'done', 'cancelled', 'no_access');--> statement-breakpoint
ALTER TYPE "public"."timeline_kind" ADD VALUE 'booking';--> statement-breakpoint
CREATE TABLE "booking_appliances" (
	"booking_id" uuid NOT NULL,
	"appliance_id" uuid NOT NULL,
	"company_id" uuid NOT NULL,
	CONSTRAINT "booking_appliances_booking_id_appliance_id_pk" PRIMARY KEY("booking_id","appliance_id")
);
--> statement-breakpoint
CREATE TABLE "booking_notices" (
	"booking_id" uuid NOT NULL,
	"company_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"revision" text NOT NULL,
	"mail_id" uuid,
	"outcome" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"data" jsonb DEFAULT '{}'::jsonb NOT NULL,
	CONSTRAINT "booking_notices_booking_id_kind_revision_pk" PRIMARY KEY("booking_id","kind","revision")
);
--> statement-breakpoint
CREATE TABLE "bookings" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"site_id" uuid NOT NULL,
	"technician_id" uuid NOT NULL,
	"starts_at" timestamp with time zone NOT NULL,
	"ends_at" timestamp with time zone NOT NULL,
	"status" "booking_status" DEFAULT 'booked' NOT NULL,
	"source" "booking_source" DEFAULT 'phone' NOT NULL,
	"service_request_id" uuid,
	"note" text,
	"status_reason" text,
	"revision" text DEFAULT gen_random_uuid()::text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" uuid,
	"updated_by" uuid,
	CONSTRAINT "bookings_window_ck" CHECK ("bookings"."ends_at" > "bookings"."starts_at" and "bookings"."ends_at" - "bookings"."starts_at" <= interval '24 hours')
);
--> statement-breakpoint
ALTER TABLE "companies" ADD COLUMN "booking_minutes" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "booking_id" uuid;--> statement-breakpoint
ALTER TABLE "booking_appliances" ADD CONSTRAINT "booking_appliances_booking_id_bookings_id_fk" FOREIGN KEY ("booking_id") REFERENCES "public"."bookings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "booking_appliances" ADD CONSTRAINT "booking_appliances_appliance_id_appliances_id_fk" FOREIGN KEY ("appliance_id") REFERENCES "public"."appliances"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "booking_appliances" ADD CONSTRAINT "booking_appliances_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "booking_notices" ADD CONSTRAINT "booking_notices_booking_id_bookings_id_fk" FOREIGN KEY ("booking_id") REFERENCES "public"."bookings"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "booking_notices" ADD CONSTRAINT "booking_notices_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_site_id_sites_id_fk" FOREIGN KEY ("site_id") REFERENCES "public"."sites"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_technician_id_users_id_fk" FOREIGN KEY ("technician_id") REFERENCES "public"."users"("id") ON DELETE restrict ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_service_request_id_service_requests_id_fk" FOREIGN KEY ("service_request_id") REFERENCES "public"."service_requests"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_updated_by_users_id_fk" FOREIGN KEY ("updated_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "booking_appliances_appliance_idx" ON "booking_appliances" USING btree ("appliance_id");--> statement-breakpoint
CREATE INDEX "bookings_company_start_idx" ON "bookings" USING btree ("company_id","starts_at");--> statement-breakpoint
CREATE INDEX "bookings_technician_start_idx" ON "bookings" USING btree ("technician_id","starts_at");--> statement-breakpoint
CREATE INDEX "bookings_site_idx" ON "bookings" USING btree ("site_id");--> statement-breakpoint
CREATE INDEX "bookings_service_request_idx" ON "bookings" USING btree ("service_request_id");--> statement-breakpoint
CREATE INDEX "visits_booking_idx" ON "visits" USING btree ("booking_id");
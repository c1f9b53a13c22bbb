ALTER TYPE "public"."service_request_via" ADD VALUE 'booking_reply';--> statement-breakpoint
ALTER TYPE "public"."mail_kind" ADD VALUE 'booking_notice';--> statement-breakpoint
ALTER TABLE "service_requests" ADD COLUMN "about_booking_id" uuid;--> statement-breakpoint
ALTER TABLE "bookings" ADD COLUMN "sequence" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "service_requests" ADD CONSTRAINT "service_requests_about_booking_id_bookings_id_fk" FOREIGN KEY ("about_booking_id") REFERENCES "public"."bookings"("id") ON DELETE set null ON UPDATE no action;
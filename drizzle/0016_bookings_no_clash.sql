-- A technician cannot be in two live bookings at once (cancelled and no-access bookings free the time).
-- btree_gist lets the GiST exclusion constraint compare uuids with = beside the range's && (PostgreSQL docs, "btree_gist").
CREATE EXTENSION IF NOT EXISTS btree_gist;
--> statement-breakpoint
ALTER TABLE "bookings" ADD CONSTRAINT "bookings_no_clash" EXCLUDE USING gist (
  "technician_id" WITH =,
  tstzrange("starts_at", "ends_at", '[)') WITH &&
) WHERE ("status" IN ('booked', 'confirmed', 'done'));
--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_booking_id_bookings_id_fk" FOREIGN KEY ("booking_id") REFERENCES "public"."bookings"("id") ON DELETE SET NULL;

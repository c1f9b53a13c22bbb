CREATE TABLE "record_transfers" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"appliance_id" uuid NOT NULL,
	"code_hash" text NOT NULL,
	"made_by" text NOT NULL,
	"expires_at" timestamp with time zone NOT NULL,
	"withdrawn_at" timestamp with time zone,
	"redeemed_at" timestamp with time zone,
	"redeemed_by_company_id" uuid,
	"sender_name" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_by" uuid,
	CONSTRAINT "record_transfers_code_hash_unique" UNIQUE("code_hash"),
	CONSTRAINT "record_transfers_made_by_ck" CHECK ("record_transfers"."made_by" in ('office', 'homeowner'))
);
--> statement-breakpoint
ALTER TABLE "appliances" ADD COLUMN "imported_from_transfer_id" uuid;--> statement-breakpoint
ALTER TABLE "components" ADD COLUMN "imported_from_transfer_id" uuid;--> statement-breakpoint
ALTER TABLE "part_swaps" ADD COLUMN "imported_from_transfer_id" uuid;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "imported_from_transfer_id" uuid;--> statement-breakpoint
ALTER TABLE "photos" ADD COLUMN "imported_from_transfer_id" uuid;--> statement-breakpoint
ALTER TABLE "record_transfers" ADD CONSTRAINT "record_transfers_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "record_transfers" ADD CONSTRAINT "record_transfers_appliance_id_appliances_id_fk" FOREIGN KEY ("appliance_id") REFERENCES "public"."appliances"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "record_transfers" ADD CONSTRAINT "record_transfers_redeemed_by_company_id_companies_id_fk" FOREIGN KEY ("redeemed_by_company_id") REFERENCES "public"."companies"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "record_transfers" ADD CONSTRAINT "record_transfers_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "record_transfers_appliance_idx" ON "record_transfers" USING btree ("company_id","appliance_id","created_at");--> statement-breakpoint
ALTER TABLE "appliances" ADD CONSTRAINT "appliances_imported_from_transfer_id_record_transfers_id_fk" FOREIGN KEY ("imported_from_transfer_id") REFERENCES "public"."record_transfers"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "components" ADD CONSTRAINT "components_imported_from_transfer_id_record_transfers_id_fk" FOREIGN KEY ("imported_from_transfer_id") REFERENCES "public"."record_transfers"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "part_swaps" ADD CONSTRAINT "part_swaps_imported_from_transfer_id_record_transfers_id_fk" FOREIGN KEY ("imported_from_transfer_id") REFERENCES "public"."record_transfers"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "visits" ADD CONSTRAINT "visits_imported_from_transfer_id_record_transfers_id_fk" FOREIGN KEY ("imported_from_transfer_id") REFERENCES "public"."record_transfers"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "photos" ADD CONSTRAINT "photos_imported_from_transfer_id_record_transfers_id_fk" FOREIGN KEY ("imported_from_transfer_id") REFERENCES "public"."record_transfers"("id") ON DELETE set null ON UPDATE no action;
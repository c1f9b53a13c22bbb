ALTER TABLE "part_swaps" ADD COLUMN "cause" text DEFAULT 'wear_or_failure' NOT NULL;--> statement-breakpoint
CREATE INDEX "components_company_type_idx" ON "components" USING btree ("company_id","type_code");--> statement-breakpoint
CREATE INDEX "part_swaps_removed_component_idx" ON "part_swaps" USING btree ("company_id","removed_component_id");--> statement-breakpoint
ALTER TABLE "part_swaps" ADD CONSTRAINT "part_swaps_cause_ck" CHECK ("part_swaps"."cause" in ('wear_or_failure', 'upgrade', 'other'));
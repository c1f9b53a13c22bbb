-- The stock counts group every present part due within the window by type, spec and due kind. With those columns
-- (and the appliance, for the join) in the due index, the count reads the index only, not 1.8 M component rows.
-- drizzle-kit does not model INCLUDE, so the index keeps its name and key columns in server/db/schema/records.ts.
DROP INDEX IF EXISTS "components_company_due_idx";--> statement-breakpoint
CREATE INDEX "components_company_due_idx" ON "components" USING btree ("company_id","due_on","id") INCLUDE ("type_code","spec_key","due_kind","appliance_id") WHERE "components"."removed_on" is null;

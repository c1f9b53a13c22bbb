ALTER TABLE "checklist_templates" ADD COLUMN "required_readings" jsonb DEFAULT '{}'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "required_readings" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "visits" ADD COLUMN "reading_skips" jsonb DEFAULT '{}'::jsonb NOT NULL;
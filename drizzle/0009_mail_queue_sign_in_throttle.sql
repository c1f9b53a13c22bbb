CREATE TYPE "public"."mail_kind" AS ENUM('invitation', 'sign_in', 'service_request');--> statement-breakpoint
CREATE TYPE "public"."mail_status" AS ENUM('queued', 'sending', 'sent', 'failed', 'cancelled');--> statement-breakpoint
CREATE TABLE "outgoing_mail" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid,
	"kind" "mail_kind" NOT NULL,
	"ref_id" uuid,
	"status" "mail_status" DEFAULT 'queued' NOT NULL,
	"sealed" text,
	"attempts" smallint DEFAULT 0 NOT NULL,
	"next_attempt_at" timestamp with time zone NOT NULL,
	"last_error" text,
	"message_id" text,
	"sent_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_throttle" (
	"key" text PRIMARY KEY NOT NULL,
	"attempts" smallint DEFAULT 0 NOT NULL,
	"last_attempt_at" timestamp with time zone NOT NULL,
	"locked_until" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "outgoing_mail" ADD CONSTRAINT "outgoing_mail_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "outgoing_mail_due_idx" ON "outgoing_mail" USING btree ("next_attempt_at") WHERE "outgoing_mail"."status" in ('queued', 'sending');--> statement-breakpoint
CREATE INDEX "outgoing_mail_ref_idx" ON "outgoing_mail" USING btree ("kind","ref_id","created_at" DESC NULLS LAST);
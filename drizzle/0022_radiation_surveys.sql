CREATE TYPE "public"."heating_medium" AS ENUM('steam', 'hot_water');--> statement-breakpoint
CREATE TYPE "public"."radiator_type" AS ENUM('cast_iron_column', 'tube', 'wall', 'convector', 'baseboard');--> statement-breakpoint
CREATE TABLE "radiation_survey_radiators" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"room_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"type" "radiator_type" NOT NULL,
	"columns" integer,
	"tubes" integer,
	"height_in" integer,
	"sections" integer,
	"wall_size" text,
	"rated_edr_sq_ft" numeric(10, 2),
	"length_ft" numeric(6, 2),
	"rated_edr_sq_ft_per_ft" numeric(6, 3),
	"count" integer DEFAULT 1 NOT NULL,
	"edr_sq_ft" numeric(10, 2) NOT NULL
);
--> statement-breakpoint
CREATE TABLE "radiation_survey_rooms" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"survey_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"name" text NOT NULL
);
--> statement-breakpoint
CREATE TABLE "radiation_surveys" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"company_id" uuid NOT NULL,
	"appliance_id" uuid NOT NULL,
	"surveyed_on" date NOT NULL,
	"surveyed_by" uuid,
	"system" "heating_medium" NOT NULL,
	"design_water_f" integer,
	"notes" text,
	"total_edr_sq_ft" numeric(10, 2) NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "radiation_survey_radiators" ADD CONSTRAINT "radiation_survey_radiators_room_id_radiation_survey_rooms_id_fk" FOREIGN KEY ("room_id") REFERENCES "public"."radiation_survey_rooms"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "radiation_survey_rooms" ADD CONSTRAINT "radiation_survey_rooms_survey_id_radiation_surveys_id_fk" FOREIGN KEY ("survey_id") REFERENCES "public"."radiation_surveys"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "radiation_surveys" ADD CONSTRAINT "radiation_surveys_company_id_companies_id_fk" FOREIGN KEY ("company_id") REFERENCES "public"."companies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "radiation_surveys" ADD CONSTRAINT "radiation_surveys_appliance_id_appliances_id_fk" FOREIGN KEY ("appliance_id") REFERENCES "public"."appliances"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "radiation_surveys" ADD CONSTRAINT "radiation_surveys_surveyed_by_users_id_fk" FOREIGN KEY ("surveyed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "radiation_survey_radiators_room_idx" ON "radiation_survey_radiators" USING btree ("room_id","position");--> statement-breakpoint
CREATE INDEX "radiation_survey_rooms_survey_idx" ON "radiation_survey_rooms" USING btree ("survey_id","position");--> statement-breakpoint
CREATE INDEX "radiation_surveys_appliance_idx" ON "radiation_surveys" USING btree ("appliance_id","created_at");
CREATE TABLE "athlete_latest_screens" (
	"athlete_id" uuid PRIMARY KEY NOT NULL,
	"club_id" uuid NOT NULL,
	"assessment_id" uuid,
	"screened_on" date,
	"flag_ids" json,
	"flag_sides" json,
	"maturity_band" text,
	"rescreen_date" text,
	"refreshed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "round_summaries" (
	"round_id" uuid PRIMARY KEY NOT NULL,
	"club_id" uuid NOT NULL,
	"screened" integer DEFAULT 0 NOT NULL,
	"flagged" json DEFAULT '{}'::json NOT NULL,
	"knee_angles" json DEFAULT '{"athletes":[],"angles":{}}'::json NOT NULL,
	"refreshed_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "athlete_latest_screens" ADD CONSTRAINT "athlete_latest_screens_athlete_id_athletes_id_fk" FOREIGN KEY ("athlete_id") REFERENCES "public"."athletes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "athlete_latest_screens" ADD CONSTRAINT "athlete_latest_screens_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "round_summaries" ADD CONSTRAINT "round_summaries_round_id_rounds_id_fk" FOREIGN KEY ("round_id") REFERENCES "public"."rounds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "round_summaries" ADD CONSTRAINT "round_summaries_club_id_clubs_id_fk" FOREIGN KEY ("club_id") REFERENCES "public"."clubs"("id") ON DELETE cascade ON UPDATE no action;
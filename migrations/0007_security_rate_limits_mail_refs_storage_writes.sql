CREATE TABLE "rate_limits" (
	"key" text PRIMARY KEY NOT NULL,
	"window_started_at" timestamp with time zone NOT NULL,
	"count" integer NOT NULL
);
--> statement-breakpoint
CREATE TABLE "storage_writes" (
	"key" text PRIMARY KEY NOT NULL,
	"written_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE INDEX "storage_writes_written_at_idx" ON "storage_writes" USING btree ("written_at");--> statement-breakpoint
DROP TABLE "rate_limit_hits" CASCADE;--> statement-breakpoint
ALTER TABLE "password_resets" ADD COLUMN "id" uuid DEFAULT gen_random_uuid() NOT NULL;--> statement-breakpoint
ALTER TABLE "password_resets" ADD CONSTRAINT "password_resets_id_unique" UNIQUE("id");--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "id" uuid DEFAULT gen_random_uuid() NOT NULL;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_id_unique" UNIQUE("id");--> statement-breakpoint
ALTER TABLE "invitation_athletes" DROP CONSTRAINT "invitation_athletes_token_hash_invitations_token_hash_fk";--> statement-breakpoint
ALTER TABLE "invitation_athletes" DROP CONSTRAINT "invitation_athletes_token_hash_athlete_id_pk";--> statement-breakpoint
ALTER TABLE "invitation_athletes" ADD COLUMN "invitation_id" uuid;--> statement-breakpoint
UPDATE "invitation_athletes" SET "invitation_id" = "invitations"."id" FROM "invitations" WHERE "invitations"."token_hash" = "invitation_athletes"."token_hash";--> statement-breakpoint
ALTER TABLE "invitation_athletes" ALTER COLUMN "invitation_id" SET NOT NULL;--> statement-breakpoint
ALTER TABLE "invitation_athletes" ADD CONSTRAINT "invitation_athletes_invitation_id_athlete_id_pk" PRIMARY KEY("invitation_id","athlete_id");--> statement-breakpoint
ALTER TABLE "invitation_athletes" ADD CONSTRAINT "invitation_athletes_invitation_id_invitations_id_fk" FOREIGN KEY ("invitation_id") REFERENCES "public"."invitations"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitation_athletes" DROP COLUMN "token_hash";

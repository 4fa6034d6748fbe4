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
ALTER TABLE "password_resets" ADD COLUMN "id" uuid DEFAULT gen_random_uuid() NOT NULL;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "id" uuid DEFAULT gen_random_uuid() NOT NULL;--> statement-breakpoint
CREATE INDEX "storage_writes_written_at_idx" ON "storage_writes" USING btree ("written_at");--> statement-breakpoint
ALTER TABLE "password_resets" ADD CONSTRAINT "password_resets_id_unique" UNIQUE("id");--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_id_unique" UNIQUE("id");
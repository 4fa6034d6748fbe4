ALTER TABLE "rounds" ADD COLUMN "closed_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "rounds" ADD COLUMN "closed_by" uuid;--> statement-breakpoint
ALTER TABLE "rounds" ADD CONSTRAINT "rounds_closed_by_users_id_fk" FOREIGN KEY ("closed_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;
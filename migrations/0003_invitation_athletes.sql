CREATE TABLE "invitation_athletes" (
	"token_hash" text NOT NULL,
	"athlete_id" uuid NOT NULL,
	CONSTRAINT "invitation_athletes_token_hash_athlete_id_pk" PRIMARY KEY("token_hash","athlete_id")
);
--> statement-breakpoint
ALTER TABLE "invitation_athletes" ADD CONSTRAINT "invitation_athletes_token_hash_invitations_token_hash_fk" FOREIGN KEY ("token_hash") REFERENCES "public"."invitations"("token_hash") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "invitation_athletes" ADD CONSTRAINT "invitation_athletes_athlete_id_athletes_id_fk" FOREIGN KEY ("athlete_id") REFERENCES "public"."athletes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "invitation_athletes_athlete_idx" ON "invitation_athletes" USING btree ("athlete_id");
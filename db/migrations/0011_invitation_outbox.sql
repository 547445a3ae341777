CREATE TYPE "public"."invitation_mail_state" AS ENUM('sending', 'sent', 'failed');--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "revoked_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "revoked_by" uuid;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "mail_state" "invitation_mail_state" DEFAULT 'sending' NOT NULL;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "mail_attempts" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "mail_error" text;--> statement-breakpoint
ALTER TABLE "invitations" ADD COLUMN "mail_sent_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "invitations" ADD CONSTRAINT "invitations_revoked_by_users_id_fk" FOREIGN KEY ("revoked_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
-- Invitations made before the outbox were mailed at once: they are not to be sent again.
UPDATE "invitations" SET "mail_state" = 'sent', "mail_attempts" = 1, "mail_sent_at" = "created_at";--> statement-breakpoint
-- Keep only the newest open invitation per address (older ones could only be expired).
UPDATE "invitations" i SET "revoked_at" = now() WHERE i."accepted_at" IS NULL AND EXISTS (SELECT 1 FROM "invitations" j WHERE j."email" = i."email" AND j."accepted_at" IS NULL AND j."created_at" > i."created_at");--> statement-breakpoint
CREATE UNIQUE INDEX "invitations_one_open_per_email" ON "invitations" USING btree ("email") WHERE "invitations"."accepted_at" IS NULL AND "invitations"."revoked_at" IS NULL;
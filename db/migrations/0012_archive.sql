ALTER TABLE "crew_members" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "crew_members" ADD COLUMN "archived_by" uuid;--> statement-breakpoint
ALTER TABLE "sequences" ADD COLUMN "archived_at" timestamp with time zone;--> statement-breakpoint
ALTER TABLE "sequences" ADD COLUMN "archived_by" uuid;--> statement-breakpoint
ALTER TABLE "crew_members" ADD CONSTRAINT "crew_members_archived_by_users_id_fk" FOREIGN KEY ("archived_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sequences" ADD CONSTRAINT "sequences_archived_by_users_id_fk" FOREIGN KEY ("archived_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;
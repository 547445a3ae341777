CREATE TABLE "rehearsal_captures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"rehearsal_id" uuid NOT NULL,
	"upload_id" uuid NOT NULL,
	"rate_hz" double precision NOT NULL,
	"dofs" jsonb NOT NULL,
	"frames" jsonb NOT NULL,
	"capture" jsonb NOT NULL,
	"signed_off_by" uuid,
	"signed_off_at" timestamp with time zone,
	"sign_off_note" text,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "rehearsal_captures_rehearsal_id_unique" UNIQUE("rehearsal_id")
);
--> statement-breakpoint
ALTER TABLE "rehearsal_captures" ADD CONSTRAINT "rehearsal_captures_rehearsal_id_rehearsals_id_fk" FOREIGN KEY ("rehearsal_id") REFERENCES "public"."rehearsals"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rehearsal_captures" ADD CONSTRAINT "rehearsal_captures_upload_id_uploads_id_fk" FOREIGN KEY ("upload_id") REFERENCES "public"."uploads"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rehearsal_captures" ADD CONSTRAINT "rehearsal_captures_signed_off_by_users_id_fk" FOREIGN KEY ("signed_off_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "rehearsal_captures" ADD CONSTRAINT "rehearsal_captures_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;
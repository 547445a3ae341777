ALTER TABLE "reverifications" ADD COLUMN "result_version_id" uuid;--> statement-breakpoint
ALTER TABLE "sequence_versions" ADD COLUMN "submit_note" text;--> statement-breakpoint
ALTER TABLE "sequence_versions" ADD COLUMN "acknowledged_failures" jsonb;--> statement-breakpoint
ALTER TABLE "sequence_versions" ADD COLUMN "recheck_of_id" uuid;--> statement-breakpoint
ALTER TABLE "reverifications" ADD CONSTRAINT "reverifications_result_version_id_sequence_versions_id_fk" FOREIGN KEY ("result_version_id") REFERENCES "public"."sequence_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sequence_versions" ADD CONSTRAINT "sequence_versions_recheck_of_id_sequence_versions_id_fk" FOREIGN KEY ("recheck_of_id") REFERENCES "public"."sequence_versions"("id") ON DELETE no action ON UPDATE no action;
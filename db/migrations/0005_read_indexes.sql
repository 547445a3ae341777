ALTER TABLE "sequence_versions" ADD COLUMN "report_summary" jsonb GENERATED ALWAYS AS (holonaut_report_summary(report)) STORED;--> statement-breakpoint
CREATE INDEX "rehearsals_trainee_idx" ON "rehearsals" USING btree ("trainee_id","performed_at");--> statement-breakpoint
CREATE INDEX "rehearsals_sequence_version_idx" ON "rehearsals" USING btree ("sequence_version_id");--> statement-breakpoint
CREATE INDEX "reverifications_version_created_idx" ON "reverifications" USING btree ("sequence_version_id","created_at");--> statement-breakpoint
CREATE INDEX "reviews_sequence_version_idx" ON "reviews" USING btree ("sequence_version_id");--> statement-breakpoint
CREATE INDEX "sequence_versions_status_idx" ON "sequence_versions" USING btree ("status");--> statement-breakpoint
CREATE INDEX "sequence_versions_profile_version_idx" ON "sequence_versions" USING btree ("profile_version_id");--> statement-breakpoint
CREATE INDEX "sequences_crew_member_idx" ON "sequences" USING btree ("crew_member_id");--> statement-breakpoint
CREATE INDEX "plans_sequence_created_idx" ON "plans" USING btree ("sequence_id","created_at");
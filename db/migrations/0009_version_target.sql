ALTER TABLE "sequence_versions" ADD COLUMN "target" jsonb;--> statement-breakpoint
UPDATE "sequence_versions" v SET "target" = s."target" FROM "sequences" s WHERE s."id" = v."sequence_id";--> statement-breakpoint
ALTER TABLE "sequence_versions" ALTER COLUMN "target" SET NOT NULL;

CREATE TABLE "robustness_chunks" (
	"run_id" uuid NOT NULL,
	"chunk_index" integer NOT NULL,
	"from_sample" integer NOT NULL,
	"to_sample" integer NOT NULL,
	"state" text DEFAULT 'queued' NOT NULL,
	"results" jsonb,
	"attempts" integer DEFAULT 0 NOT NULL,
	"error" text,
	"finished_at" timestamp with time zone,
	CONSTRAINT "robustness_chunks_run_id_chunk_index_pk" PRIMARY KEY("run_id","chunk_index")
);
--> statement-breakpoint
CREATE TABLE "robustness_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"sequence_version_id" uuid,
	"plan_id" uuid,
	"candidate_index" integer,
	"state" text DEFAULT 'queued' NOT NULL,
	"samples" integer NOT NULL,
	"chunk_size" integer NOT NULL,
	"seed" bigint NOT NULL,
	"model" jsonb NOT NULL,
	"tolerance_deg" double precision NOT NULL,
	"inputs" jsonb NOT NULL,
	"done_samples" integer DEFAULT 0 NOT NULL,
	"figures" jsonb,
	"error" text,
	"requested_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone
);
--> statement-breakpoint
ALTER TABLE "robustness_chunks" ADD CONSTRAINT "robustness_chunks_run_id_robustness_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."robustness_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robustness_runs" ADD CONSTRAINT "robustness_runs_sequence_version_id_sequence_versions_id_fk" FOREIGN KEY ("sequence_version_id") REFERENCES "public"."sequence_versions"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robustness_runs" ADD CONSTRAINT "robustness_runs_plan_id_plans_id_fk" FOREIGN KEY ("plan_id") REFERENCES "public"."plans"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "robustness_runs" ADD CONSTRAINT "robustness_runs_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "robustness_runs_version" ON "robustness_runs" USING btree ("sequence_version_id");--> statement-breakpoint
CREATE INDEX "robustness_runs_plan" ON "robustness_runs" USING btree ("plan_id");--> statement-breakpoint
CREATE INDEX "robustness_runs_state" ON "robustness_runs" USING btree ("state");
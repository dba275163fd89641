CREATE TABLE "lab_run_checkpoints" (
	"run_id" uuid NOT NULL,
	"chunk_index" integer NOT NULL,
	"attempt" integer NOT NULL,
	"meta" jsonb NOT NULL,
	"data" "bytea" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "lab_run_checkpoints_run_id_chunk_index_pk" PRIMARY KEY("run_id","chunk_index")
);
--> statement-breakpoint
ALTER TABLE "lab_run_results" ADD COLUMN "engine_version" text DEFAULT '1.0.0' NOT NULL;--> statement-breakpoint
ALTER TABLE "lab_runs" ADD COLUMN "progress_at_start" double precision DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "lab_runs" ADD COLUMN "engine_version" text DEFAULT '1.0.0' NOT NULL;--> statement-breakpoint
ALTER TABLE "lab_run_checkpoints" ADD CONSTRAINT "lab_run_checkpoints_run_id_lab_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."lab_runs"("id") ON DELETE cascade ON UPDATE no action;
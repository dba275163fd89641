CREATE TYPE "public"."lab_run_state" AS ENUM('queued', 'running', 'done', 'failed', 'cancelled');--> statement-breakpoint
CREATE TABLE "lab_run_results" (
	"run_id" uuid PRIMARY KEY NOT NULL,
	"worker_id" text NOT NULL,
	"attempt" integer NOT NULL,
	"meta" jsonb NOT NULL,
	"data" "bytea" NOT NULL,
	"compute_ms" integer NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "lab_runs" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_id" uuid NOT NULL,
	"submitted_by" uuid NOT NULL,
	"kind" text NOT NULL,
	"title" text NOT NULL,
	"payload" jsonb NOT NULL,
	"cells" integer NOT NULL,
	"parameter_set_id" uuid,
	"parameter_set_name" text,
	"parameter_set_version" integer,
	"params_edited" boolean DEFAULT false NOT NULL,
	"state" "lab_run_state" DEFAULT 'queued' NOT NULL,
	"progress" double precision DEFAULT 0 NOT NULL,
	"cancel_requested" boolean DEFAULT false NOT NULL,
	"error" text,
	"worker_id" text,
	"attempt" integer DEFAULT 0 NOT NULL,
	"started_at" timestamp with time zone,
	"finished_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "lab_run_results" ADD CONSTRAINT "lab_run_results_run_id_lab_runs_id_fk" FOREIGN KEY ("run_id") REFERENCES "public"."lab_runs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lab_runs" ADD CONSTRAINT "lab_runs_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lab_runs" ADD CONSTRAINT "lab_runs_submitted_by_users_id_fk" FOREIGN KEY ("submitted_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "lab_runs" ADD CONSTRAINT "lab_runs_parameter_set_id_parameter_sets_id_fk" FOREIGN KEY ("parameter_set_id") REFERENCES "public"."parameter_sets"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "lab_runs_lab_idx" ON "lab_runs" USING btree ("lab_id","created_at");--> statement-breakpoint
CREATE INDEX "lab_runs_state_idx" ON "lab_runs" USING btree ("state");
CREATE TABLE "light_sources" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_id" uuid NOT NULL,
	"name" text NOT NULL,
	"wavelength_nm" double precision NOT NULL,
	"tunable_min_nm" double precision,
	"tunable_max_nm" double precision,
	"power_w" double precision,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "light_sources_lab_name_unique" UNIQUE("lab_id","name")
);
--> statement-breakpoint
CREATE TABLE "plans" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"set_id" uuid NOT NULL,
	"set_version" integer NOT NULL,
	"name" text NOT NULL,
	"request" jsonb NOT NULL,
	"plan" jsonb NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "light_sources" ADD CONSTRAINT "light_sources_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_set_id_parameter_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."parameter_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "plans" ADD CONSTRAINT "plans_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "light_sources_lab_idx" ON "light_sources" USING btree ("lab_id");--> statement-breakpoint
CREATE INDEX "plans_set_idx" ON "plans" USING btree ("set_id","created_at");
CREATE TABLE "measurement_points" (
	"set_id" uuid NOT NULL,
	"ordinal" integer NOT NULL,
	"line" integer NOT NULL,
	"wavelength_nm" double precision NOT NULL,
	"value" double precision NOT NULL,
	"sigma" double precision NOT NULL,
	"temperature_k" double precision NOT NULL,
	"field_t" double precision NOT NULL,
	"length_m" double precision NOT NULL,
	CONSTRAINT "measurement_points_set_id_ordinal_pk" PRIMARY KEY("set_id","ordinal")
);
--> statement-breakpoint
CREATE TABLE "measurement_sets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"lab_id" uuid NOT NULL,
	"name" text NOT NULL,
	"sample" text DEFAULT '' NOT NULL,
	"quantity" text NOT NULL,
	"row_count" integer NOT NULL,
	"wavelength_min_nm" double precision NOT NULL,
	"wavelength_max_nm" double precision NOT NULL,
	"temperatures_k" double precision[] NOT NULL,
	"fields_t" double precision[] NOT NULL,
	"lengths_m" double precision[] NOT NULL,
	"mapping" jsonb NOT NULL,
	"file_name" text NOT NULL,
	"file_bytes" integer NOT NULL,
	"content_type" text NOT NULL,
	"file_sha256" text NOT NULL,
	"object_key" text NOT NULL,
	"created_by" uuid NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "measurement_sets_lab_name_unique" UNIQUE("lab_id","name")
);
--> statement-breakpoint
ALTER TABLE "measurement_points" ADD CONSTRAINT "measurement_points_set_id_measurement_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."measurement_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_sets" ADD CONSTRAINT "measurement_sets_lab_id_labs_id_fk" FOREIGN KEY ("lab_id") REFERENCES "public"."labs"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_sets" ADD CONSTRAINT "measurement_sets_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "measurement_sets_lab_idx" ON "measurement_sets" USING btree ("lab_id");
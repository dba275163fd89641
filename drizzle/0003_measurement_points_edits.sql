CREATE TABLE "measurement_point_changes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"set_id" uuid NOT NULL,
	"revision" integer NOT NULL,
	"ordinal" integer NOT NULL,
	"changes" jsonb NOT NULL,
	"actor_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "measurement_points" ADD COLUMN "extra" jsonb;--> statement-breakpoint
ALTER TABLE "measurement_points" ADD COLUMN "masked" boolean DEFAULT false NOT NULL;--> statement-breakpoint
ALTER TABLE "measurement_points" ADD COLUMN "mask_reason" text;--> statement-breakpoint
ALTER TABLE "measurement_points" ADD COLUMN "note" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "measurement_points" ADD COLUMN "original" jsonb;--> statement-breakpoint
ALTER TABLE "measurement_sets" ADD COLUMN "revision" integer DEFAULT 1 NOT NULL;--> statement-breakpoint
ALTER TABLE "measurement_sets" ADD COLUMN "masked_count" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "measurement_point_changes" ADD CONSTRAINT "measurement_point_changes_set_id_measurement_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."measurement_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "measurement_point_changes" ADD CONSTRAINT "measurement_point_changes_actor_id_users_id_fk" FOREIGN KEY ("actor_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "measurement_point_changes_set_idx" ON "measurement_point_changes" USING btree ("set_id","revision");
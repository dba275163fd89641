ALTER TABLE "parameter_set_versions" ADD COLUMN "note" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "parameter_set_versions" ADD COLUMN "restored_from" integer;
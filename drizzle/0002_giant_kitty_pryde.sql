CREATE TABLE "workbench_views" (
	"user_id" uuid NOT NULL,
	"set_id" uuid NOT NULL,
	"view_state" jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "workbench_views_user_id_set_id_pk" PRIMARY KEY("user_id","set_id")
);
--> statement-breakpoint
ALTER TABLE "workbench_views" ADD CONSTRAINT "workbench_views_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "workbench_views" ADD CONSTRAINT "workbench_views_set_id_parameter_sets_id_fk" FOREIGN KEY ("set_id") REFERENCES "public"."parameter_sets"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "workbench_views_set_idx" ON "workbench_views" USING btree ("set_id");
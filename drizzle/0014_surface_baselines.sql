CREATE TYPE "public"."baseline_status" AS ENUM('proposed', 'locked', 'replaced');--> statement-breakpoint
CREATE TABLE "surface_baselines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"area" text DEFAULT '' NOT NULL,
	"status" "baseline_status" DEFAULT 'proposed' NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"storage_key" text NOT NULL,
	"surface_name" text NOT NULL,
	"point_count" integer NOT NULL,
	"linear_unit" text NOT NULL,
	"elevation_unit" text NOT NULL,
	"units_from" text NOT NULL,
	"points" "bytea" NOT NULL,
	"replaces_id" uuid,
	"recorded_by_user_id" text NOT NULL,
	"sub_accepted_by_user_id" text,
	"sub_accepted_at" timestamp with time zone,
	"gc_accepted_by_user_id" text,
	"gc_accepted_at" timestamp with time zone,
	"locked_at" timestamp with time zone,
	"replaced_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "surface_baselines_storage_key_unique" UNIQUE("storage_key")
);
--> statement-breakpoint
ALTER TABLE "surface_baselines" ADD CONSTRAINT "surface_baselines_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "surface_baselines" ADD CONSTRAINT "surface_baselines_recorded_by_user_id_user_id_fk" FOREIGN KEY ("recorded_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "surface_baselines" ADD CONSTRAINT "surface_baselines_sub_accepted_by_user_id_user_id_fk" FOREIGN KEY ("sub_accepted_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "surface_baselines" ADD CONSTRAINT "surface_baselines_gc_accepted_by_user_id_user_id_fk" FOREIGN KEY ("gc_accepted_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "surface_baselines_project_id_index" ON "surface_baselines" USING btree ("project_id");--> statement-breakpoint
CREATE UNIQUE INDEX "surface_baselines_one_proposed" ON "surface_baselines" USING btree ("project_id","area") WHERE status = 'proposed';--> statement-breakpoint
CREATE UNIQUE INDEX "surface_baselines_one_locked" ON "surface_baselines" USING btree ("project_id","area") WHERE status = 'locked';
ALTER TABLE "surface_baselines" ADD COLUMN "faces" "bytea";--> statement-breakpoint
ALTER TABLE "surface_baselines" ADD COLUMN "breaklines" jsonb;--> statement-breakpoint
ALTER TABLE "surface_baselines" ADD COLUMN "point_order" text;
ALTER TABLE "pay_app_lines" ADD COLUMN "stored_materials_cents" bigint DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "pay_apps" ADD COLUMN "adjustments_cents" bigint DEFAULT 0 NOT NULL;
CREATE TYPE "public"."pay_line_source" AS ENUM('tallies', 'tickets', 'steps', 'settings');--> statement-breakpoint
ALTER TABLE "pay_app_lines" ADD COLUMN "paid_from" "pay_line_source" DEFAULT 'tallies' NOT NULL;--> statement-breakpoint
UPDATE "pay_app_lines" SET "paid_from" = 'tickets' WHERE EXISTS (SELECT 1 FROM "truck_tickets" t WHERE t."pay_app_id" = "pay_app_lines"."pay_app_id" AND t."bid_item_id" = "pay_app_lines"."bid_item_id") OR EXISTS (SELECT 1 FROM "scale_tickets" s WHERE s."pay_app_id" = "pay_app_lines"."pay_app_id" AND s."bid_item_id" = "pay_app_lines"."bid_item_id");

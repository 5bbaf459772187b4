CREATE TYPE "public"."fee_bearer" AS ENUM('payer', 'payee');--> statement-breakpoint
ALTER TABLE "projects" ADD COLUMN "processing_fee_bearer" "fee_bearer" DEFAULT 'payee' NOT NULL;--> statement-breakpoint
ALTER TABLE "disputes" ADD COLUMN "claimed_quantity" numeric(16, 4);--> statement-breakpoint
ALTER TABLE "lien_waivers" ADD COLUMN "exceptions" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "payments" ADD COLUMN "fee_bearer" "fee_bearer" DEFAULT 'payee' NOT NULL;
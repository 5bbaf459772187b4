CREATE TABLE "rate_limit" (
	"id" text PRIMARY KEY NOT NULL,
	"key" text NOT NULL,
	"count" integer NOT NULL,
	"last_request" bigint NOT NULL,
	CONSTRAINT "rate_limit_key_unique" UNIQUE("key")
);
--> statement-breakpoint
CREATE TABLE "sign_in_failures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"account" text NOT NULL,
	"address" text NOT NULL,
	"failed_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sign_in_known_addresses" (
	"account" text NOT NULL,
	"address" text NOT NULL,
	"last_success_at" timestamp with time zone NOT NULL,
	CONSTRAINT "sign_in_known_addresses_account_address_pk" PRIMARY KEY("account","address")
);
--> statement-breakpoint
ALTER TABLE "email_outbox" ADD COLUMN "leased_until" timestamp with time zone;--> statement-breakpoint
CREATE INDEX "sign_in_failures_account_failed_at_index" ON "sign_in_failures" USING btree ("account","failed_at");
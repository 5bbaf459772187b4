CREATE TYPE "public"."tally_status" AS ENUM('draft', 'ready', 'billed');--> statement-breakpoint
CREATE TYPE "public"."dispute_resolution" AS ENUM('counter_accepted', 'answered', 'withdrawn');--> statement-breakpoint
CREATE TYPE "public"."dispute_status" AS ENUM('open', 'resolved');--> statement-breakpoint
CREATE TYPE "public"."line_review_status" AS ENUM('pending', 'approved', 'disputed');--> statement-breakpoint
CREATE TYPE "public"."pay_app_status" AS ENUM('draft', 'submitted', 'in_review', 'returned', 'certified', 'payment_processing', 'partially_paid', 'paid');--> statement-breakpoint
CREATE TYPE "public"."change_order_item_kind" AS ENUM('add_item', 'change_quantity', 'change_price');--> statement-breakpoint
CREATE TYPE "public"."change_order_status" AS ENUM('proposed', 'approved', 'rejected');--> statement-breakpoint
CREATE TYPE "public"."email_status" AS ENUM('pending', 'sent', 'failed');--> statement-breakpoint
CREATE TABLE "forecasts" (
	"bid_item_id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"forecast_quantity" numeric(16, 4) NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"updated_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tallies" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"bid_item_id" uuid NOT NULL,
	"measured_on" date NOT NULL,
	"title" text DEFAULT '' NOT NULL,
	"method" "measurement_method" NOT NULL,
	"inputs" jsonb,
	"result" jsonb,
	"quantity" numeric(16, 4) NOT NULL,
	"manual_basis" text,
	"status" "tally_status" DEFAULT 'draft' NOT NULL,
	"pay_app_id" uuid,
	"author_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "tally_evidence" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"tally_id" uuid NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"kind" text NOT NULL,
	"size_bytes" integer NOT NULL,
	"sha256" text NOT NULL,
	"storage_key" text NOT NULL,
	"uploaded_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tally_evidence_storage_key_unique" UNIQUE("storage_key")
);
--> statement-breakpoint
CREATE TABLE "dispute_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"dispute_id" uuid NOT NULL,
	"author_user_id" text NOT NULL,
	"body" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "disputes" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"pay_app_id" uuid NOT NULL,
	"line_id" uuid NOT NULL,
	"revision" integer NOT NULL,
	"reason" text NOT NULL,
	"counter_quantity" numeric(16, 4) NOT NULL,
	"status" "dispute_status" DEFAULT 'open' NOT NULL,
	"resolution" "dispute_resolution",
	"resolution_note" text,
	"opened_by_user_id" text NOT NULL,
	"resolved_by_user_id" text,
	"resolved_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "pay_app_lines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"pay_app_id" uuid NOT NULL,
	"bid_item_id" uuid NOT NULL,
	"sort_order" integer NOT NULL,
	"item_number" text NOT NULL,
	"description" text NOT NULL,
	"pay_unit" "pay_unit" NOT NULL,
	"unit_price_cents" bigint NOT NULL,
	"contract_quantity" numeric(16, 4) NOT NULL,
	"previous_quantity" numeric(16, 4) NOT NULL,
	"this_period_quantity" numeric(16, 4) NOT NULL,
	"to_date_quantity" numeric(16, 4) NOT NULL,
	"previous_amount_cents" bigint NOT NULL,
	"this_period_amount_cents" bigint NOT NULL,
	"amount_to_date_cents" bigint NOT NULL,
	"retainage_cents" bigint NOT NULL,
	"review_status" "line_review_status" DEFAULT 'pending' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "pay_app_lines_app_item" UNIQUE("pay_app_id","bid_item_id")
);
--> statement-breakpoint
CREATE TABLE "pay_app_status_history" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"pay_app_id" uuid NOT NULL,
	"from_status" "pay_app_status",
	"to_status" "pay_app_status" NOT NULL,
	"revision" integer NOT NULL,
	"note" text DEFAULT '' NOT NULL,
	"actor_user_id" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "pay_apps" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"revision" integer DEFAULT 0 NOT NULL,
	"status" "pay_app_status" DEFAULT 'draft' NOT NULL,
	"period_start" date NOT NULL,
	"period_end" date NOT NULL,
	"is_final" boolean DEFAULT false NOT NULL,
	"retainage_bps" integer NOT NULL,
	"earned_to_date_cents" bigint DEFAULT 0 NOT NULL,
	"this_period_cents" bigint DEFAULT 0 NOT NULL,
	"retainage_cents" bigint DEFAULT 0 NOT NULL,
	"previous_certified_cents" bigint DEFAULT 0 NOT NULL,
	"current_due_cents" bigint DEFAULT 0 NOT NULL,
	"paid_cents" bigint DEFAULT 0 NOT NULL,
	"submitted_at" timestamp with time zone,
	"certified_at" timestamp with time zone,
	"certified_by_user_id" text,
	"created_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "pay_apps_project_number" UNIQUE("project_id","number")
);
--> statement-breakpoint
CREATE TABLE "change_order_items" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"change_order_id" uuid NOT NULL,
	"kind" "change_order_item_kind" NOT NULL,
	"bid_item_id" uuid,
	"new_item" jsonb,
	"quantity_delta" numeric(16, 4),
	"new_unit_price_cents" bigint,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "change_orders" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"number" integer NOT NULL,
	"title" text NOT NULL,
	"reason" text DEFAULT '' NOT NULL,
	"status" "change_order_status" DEFAULT 'proposed' NOT NULL,
	"proposed_by_user_id" text NOT NULL,
	"gc_approved_by_user_id" text,
	"gc_approved_at" timestamp with time zone,
	"owner_approved_by_user_id" text,
	"owner_approved_at" timestamp with time zone,
	"decided_at" timestamp with time zone,
	"decision_note" text DEFAULT '' NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "change_orders_project_number" UNIQUE("project_id","number")
);
--> statement-breakpoint
CREATE TABLE "email_outbox" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid,
	"template" text NOT NULL,
	"to_addresses" jsonb NOT NULL,
	"subject" text NOT NULL,
	"text" text NOT NULL,
	"html" text NOT NULL,
	"status" "email_status" DEFAULT 'pending' NOT NULL,
	"attempts" integer DEFAULT 0 NOT NULL,
	"last_error" text,
	"sent_at" timestamp with time zone,
	"next_attempt_at" timestamp with time zone DEFAULT now() NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "bid_items" ADD COLUMN "added_by_change_order_id" uuid;--> statement-breakpoint
ALTER TABLE "forecasts" ADD CONSTRAINT "forecasts_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "forecasts" ADD CONSTRAINT "forecasts_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "forecasts" ADD CONSTRAINT "forecasts_updated_by_user_id_user_id_fk" FOREIGN KEY ("updated_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tallies" ADD CONSTRAINT "tallies_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tallies" ADD CONSTRAINT "tallies_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tallies" ADD CONSTRAINT "tallies_author_user_id_user_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tally_evidence" ADD CONSTRAINT "tally_evidence_tally_id_tallies_id_fk" FOREIGN KEY ("tally_id") REFERENCES "public"."tallies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tally_evidence" ADD CONSTRAINT "tally_evidence_uploaded_by_user_id_user_id_fk" FOREIGN KEY ("uploaded_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dispute_comments" ADD CONSTRAINT "dispute_comments_dispute_id_disputes_id_fk" FOREIGN KEY ("dispute_id") REFERENCES "public"."disputes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "dispute_comments" ADD CONSTRAINT "dispute_comments_author_user_id_user_id_fk" FOREIGN KEY ("author_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "disputes" ADD CONSTRAINT "disputes_pay_app_id_pay_apps_id_fk" FOREIGN KEY ("pay_app_id") REFERENCES "public"."pay_apps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "disputes" ADD CONSTRAINT "disputes_line_id_pay_app_lines_id_fk" FOREIGN KEY ("line_id") REFERENCES "public"."pay_app_lines"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "disputes" ADD CONSTRAINT "disputes_opened_by_user_id_user_id_fk" FOREIGN KEY ("opened_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "disputes" ADD CONSTRAINT "disputes_resolved_by_user_id_user_id_fk" FOREIGN KEY ("resolved_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_app_lines" ADD CONSTRAINT "pay_app_lines_pay_app_id_pay_apps_id_fk" FOREIGN KEY ("pay_app_id") REFERENCES "public"."pay_apps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_app_lines" ADD CONSTRAINT "pay_app_lines_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_app_status_history" ADD CONSTRAINT "pay_app_status_history_pay_app_id_pay_apps_id_fk" FOREIGN KEY ("pay_app_id") REFERENCES "public"."pay_apps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_app_status_history" ADD CONSTRAINT "pay_app_status_history_actor_user_id_user_id_fk" FOREIGN KEY ("actor_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_apps" ADD CONSTRAINT "pay_apps_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_apps" ADD CONSTRAINT "pay_apps_certified_by_user_id_user_id_fk" FOREIGN KEY ("certified_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_apps" ADD CONSTRAINT "pay_apps_created_by_user_id_user_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "change_order_items" ADD CONSTRAINT "change_order_items_change_order_id_change_orders_id_fk" FOREIGN KEY ("change_order_id") REFERENCES "public"."change_orders"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "change_order_items" ADD CONSTRAINT "change_order_items_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "change_orders" ADD CONSTRAINT "change_orders_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "change_orders" ADD CONSTRAINT "change_orders_proposed_by_user_id_user_id_fk" FOREIGN KEY ("proposed_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "change_orders" ADD CONSTRAINT "change_orders_gc_approved_by_user_id_user_id_fk" FOREIGN KEY ("gc_approved_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "change_orders" ADD CONSTRAINT "change_orders_owner_approved_by_user_id_user_id_fk" FOREIGN KEY ("owner_approved_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "email_outbox" ADD CONSTRAINT "email_outbox_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "tallies_project_id_measured_on_index" ON "tallies" USING btree ("project_id","measured_on");--> statement-breakpoint
CREATE INDEX "tallies_bid_item_id_index" ON "tallies" USING btree ("bid_item_id");--> statement-breakpoint
CREATE INDEX "tallies_pay_app_id_index" ON "tallies" USING btree ("pay_app_id");--> statement-breakpoint
CREATE INDEX "tally_evidence_tally_id_index" ON "tally_evidence" USING btree ("tally_id");--> statement-breakpoint
CREATE INDEX "dispute_comments_dispute_id_index" ON "dispute_comments" USING btree ("dispute_id");--> statement-breakpoint
CREATE INDEX "disputes_line_id_index" ON "disputes" USING btree ("line_id");--> statement-breakpoint
CREATE INDEX "disputes_pay_app_id_index" ON "disputes" USING btree ("pay_app_id");--> statement-breakpoint
CREATE INDEX "pay_app_lines_pay_app_id_index" ON "pay_app_lines" USING btree ("pay_app_id");--> statement-breakpoint
CREATE INDEX "pay_app_status_history_pay_app_id_index" ON "pay_app_status_history" USING btree ("pay_app_id");--> statement-breakpoint
CREATE INDEX "pay_apps_project_id_status_index" ON "pay_apps" USING btree ("project_id","status");--> statement-breakpoint
CREATE INDEX "change_order_items_change_order_id_index" ON "change_order_items" USING btree ("change_order_id");--> statement-breakpoint
CREATE INDEX "change_order_items_bid_item_id_index" ON "change_order_items" USING btree ("bid_item_id");--> statement-breakpoint
CREATE INDEX "email_outbox_status_next_attempt_at_index" ON "email_outbox" USING btree ("status","next_attempt_at");
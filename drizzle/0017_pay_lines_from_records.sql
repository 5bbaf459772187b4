CREATE TABLE "pay_app_force_account_lines" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"pay_app_id" uuid NOT NULL,
	"change_order_id" uuid NOT NULL,
	"sort_order" integer NOT NULL,
	"change_order_number" integer NOT NULL,
	"title" text NOT NULL,
	"days" integer NOT NULL,
	"previous_amount_cents" bigint NOT NULL,
	"this_period_amount_cents" bigint NOT NULL,
	"amount_to_date_cents" bigint NOT NULL,
	"retainage_cents" bigint NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "pay_app_force_account_lines_app_order" UNIQUE("pay_app_id","change_order_id")
);
--> statement-breakpoint
ALTER TABLE "pay_apps" ADD COLUMN "ticket_holds" jsonb DEFAULT '[]'::jsonb NOT NULL;--> statement-breakpoint
ALTER TABLE "scale_tickets" ADD COLUMN "pay_app_id" uuid;--> statement-breakpoint
ALTER TABLE "truck_tickets" ADD COLUMN "pay_app_id" uuid;--> statement-breakpoint
ALTER TABLE "force_account_sheets" ADD COLUMN "pay_app_id" uuid;--> statement-breakpoint
ALTER TABLE "pay_app_force_account_lines" ADD CONSTRAINT "pay_app_force_account_lines_pay_app_id_pay_apps_id_fk" FOREIGN KEY ("pay_app_id") REFERENCES "public"."pay_apps"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_app_force_account_lines" ADD CONSTRAINT "pay_app_force_account_lines_change_order_id_change_orders_id_fk" FOREIGN KEY ("change_order_id") REFERENCES "public"."change_orders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "pay_app_force_account_lines_pay_app_id_index" ON "pay_app_force_account_lines" USING btree ("pay_app_id");--> statement-breakpoint
ALTER TABLE "scale_tickets" ADD CONSTRAINT "scale_tickets_pay_app_id_pay_apps_id_fk" FOREIGN KEY ("pay_app_id") REFERENCES "public"."pay_apps"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "truck_tickets" ADD CONSTRAINT "truck_tickets_pay_app_id_pay_apps_id_fk" FOREIGN KEY ("pay_app_id") REFERENCES "public"."pay_apps"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "force_account_sheets" ADD CONSTRAINT "force_account_sheets_pay_app_id_pay_apps_id_fk" FOREIGN KEY ("pay_app_id") REFERENCES "public"."pay_apps"("id") ON DELETE no action ON UPDATE no action;
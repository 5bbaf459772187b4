CREATE TYPE "public"."measurement_profile" AS ENUM('plan_quantity', 'worksheet', 'truck_measure', 'weight', 'lump_sum', 'force_account');--> statement-breakpoint
CREATE TYPE "public"."measurement_stage" AS ENUM('interim', 'final');--> statement-breakpoint
CREATE TYPE "public"."adjustment_kind" AS ENUM('liquidated_damages', 'fuel_adjustment', 'credit', 'other');--> statement-breakpoint
CREATE TABLE "bid_item_profiles" (
	"bid_item_id" uuid PRIMARY KEY NOT NULL,
	"project_id" uuid NOT NULL,
	"profile" "measurement_profile" NOT NULL,
	"pay_decimals" integer NOT NULL,
	"stage" "measurement_stage" DEFAULT 'interim' NOT NULL,
	"settings" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "material_sources" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"name" text NOT NULL,
	"weighed_loads" jsonb NOT NULL,
	"factor_computed" numeric(10, 4) NOT NULL,
	"factor_used" numeric(10, 3) NOT NULL,
	"stated_moisture_percent" numeric(6, 2),
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "material_sources_project_name" UNIQUE("project_id","name")
);
--> statement-breakpoint
CREATE TABLE "scale_tickets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"bid_item_id" uuid NOT NULL,
	"source_id" uuid NOT NULL,
	"ticket_number" text NOT NULL,
	"weighed_on" date NOT NULL,
	"gross_tons" numeric(10, 2) NOT NULL,
	"tare_tons" numeric(10, 2) NOT NULL,
	"net_tons" numeric(10, 2) NOT NULL,
	"material" text NOT NULL,
	"moisture_percent" numeric(6, 2),
	"scale_checker_initials" text NOT NULL,
	"delivery_checker_initials" text NOT NULL,
	"created_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "scale_tickets_project_number" UNIQUE("project_id","ticket_number")
);
--> statement-breakpoint
CREATE TABLE "truck_tickets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"bid_item_id" uuid NOT NULL,
	"delivered_on" date NOT NULL,
	"truck_label" text NOT NULL,
	"material" text NOT NULL,
	"source" text NOT NULL,
	"loaded_at" text NOT NULL,
	"delivered_to" text NOT NULL,
	"load_checker_initials" text NOT NULL,
	"delivery_checker_initials" text NOT NULL,
	"load_volume_cy" numeric(10, 2),
	"created_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "trucks" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"label" text NOT NULL,
	"hauler" text DEFAULT '' NOT NULL,
	"bed_volume_cy" numeric(10, 2) NOT NULL,
	"measured_by" text NOT NULL,
	"measured_on" date NOT NULL,
	"created_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "trucks_project_label" UNIQUE("project_id","label")
);
--> statement-breakpoint
CREATE TABLE "force_account_sheets" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"change_order_id" uuid NOT NULL,
	"worked_on" date NOT NULL,
	"description" text NOT NULL,
	"lines" jsonb NOT NULL,
	"total_cents" bigint NOT NULL,
	"contractor_signed_by_user_id" text,
	"contractor_signed_at" timestamp with time zone,
	"gc_signed_by_user_id" text,
	"gc_signed_at" timestamp with time zone,
	"created_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "force_account_sheets_order_day" UNIQUE("change_order_id","worked_on")
);
--> statement-breakpoint
CREATE TABLE "pay_adjustments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"kind" "adjustment_kind" NOT NULL,
	"applies_on" date NOT NULL,
	"description" text NOT NULL,
	"amount_cents" bigint NOT NULL,
	"basis" jsonb DEFAULT '{}'::jsonb NOT NULL,
	"created_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "stored_material_movements" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"stored_material_id" uuid NOT NULL,
	"kind" text NOT NULL,
	"moved_on" date NOT NULL,
	"quantity" numeric(16, 4) NOT NULL,
	"invoice_ref" text DEFAULT '' NOT NULL,
	"created_by_user_id" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "stored_materials" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"project_id" uuid NOT NULL,
	"bid_item_id" uuid NOT NULL,
	"description" text NOT NULL,
	"unit" text NOT NULL,
	"unit_cost_cents" bigint NOT NULL,
	"needed_quantity" numeric(16, 4) NOT NULL,
	"stored_at" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "bid_item_profiles" ADD CONSTRAINT "bid_item_profiles_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bid_item_profiles" ADD CONSTRAINT "bid_item_profiles_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "material_sources" ADD CONSTRAINT "material_sources_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scale_tickets" ADD CONSTRAINT "scale_tickets_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scale_tickets" ADD CONSTRAINT "scale_tickets_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scale_tickets" ADD CONSTRAINT "scale_tickets_source_id_material_sources_id_fk" FOREIGN KEY ("source_id") REFERENCES "public"."material_sources"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "scale_tickets" ADD CONSTRAINT "scale_tickets_created_by_user_id_user_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "truck_tickets" ADD CONSTRAINT "truck_tickets_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "truck_tickets" ADD CONSTRAINT "truck_tickets_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "truck_tickets" ADD CONSTRAINT "truck_tickets_created_by_user_id_user_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "trucks" ADD CONSTRAINT "trucks_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "trucks" ADD CONSTRAINT "trucks_created_by_user_id_user_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "force_account_sheets" ADD CONSTRAINT "force_account_sheets_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "force_account_sheets" ADD CONSTRAINT "force_account_sheets_change_order_id_change_orders_id_fk" FOREIGN KEY ("change_order_id") REFERENCES "public"."change_orders"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "force_account_sheets" ADD CONSTRAINT "force_account_sheets_contractor_signed_by_user_id_user_id_fk" FOREIGN KEY ("contractor_signed_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "force_account_sheets" ADD CONSTRAINT "force_account_sheets_gc_signed_by_user_id_user_id_fk" FOREIGN KEY ("gc_signed_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "force_account_sheets" ADD CONSTRAINT "force_account_sheets_created_by_user_id_user_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_adjustments" ADD CONSTRAINT "pay_adjustments_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "pay_adjustments" ADD CONSTRAINT "pay_adjustments_created_by_user_id_user_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stored_material_movements" ADD CONSTRAINT "stored_material_movements_stored_material_id_stored_materials_id_fk" FOREIGN KEY ("stored_material_id") REFERENCES "public"."stored_materials"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stored_material_movements" ADD CONSTRAINT "stored_material_movements_created_by_user_id_user_id_fk" FOREIGN KEY ("created_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stored_materials" ADD CONSTRAINT "stored_materials_project_id_projects_id_fk" FOREIGN KEY ("project_id") REFERENCES "public"."projects"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stored_materials" ADD CONSTRAINT "stored_materials_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "scale_tickets_bid_item_id_index" ON "scale_tickets" USING btree ("bid_item_id");--> statement-breakpoint
CREATE INDEX "truck_tickets_project_id_delivered_on_index" ON "truck_tickets" USING btree ("project_id","delivered_on");--> statement-breakpoint
CREATE INDEX "truck_tickets_bid_item_id_index" ON "truck_tickets" USING btree ("bid_item_id");--> statement-breakpoint
CREATE INDEX "force_account_sheets_project_id_index" ON "force_account_sheets" USING btree ("project_id");--> statement-breakpoint
CREATE INDEX "pay_adjustments_project_id_applies_on_index" ON "pay_adjustments" USING btree ("project_id","applies_on");--> statement-breakpoint
CREATE INDEX "stored_material_movements_stored_material_id_index" ON "stored_material_movements" USING btree ("stored_material_id");--> statement-breakpoint
CREATE INDEX "stored_materials_project_id_index" ON "stored_materials" USING btree ("project_id");
CREATE TABLE "tally_revisions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"tally_id" uuid NOT NULL,
	"revision" integer NOT NULL,
	"bid_item_id" uuid NOT NULL,
	"measured_on" date NOT NULL,
	"title" text NOT NULL,
	"method" "measurement_method" NOT NULL,
	"inputs" jsonb,
	"result" jsonb,
	"quantity" numeric(16, 4) NOT NULL,
	"manual_basis" text,
	"replaced_by_user_id" text NOT NULL,
	"saved_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "tally_revisions_tally_id_revision_unique" UNIQUE("tally_id","revision")
);
--> statement-breakpoint
ALTER TABLE "tallies" ADD COLUMN "sanity_reason" text;--> statement-breakpoint
ALTER TABLE "tally_revisions" ADD CONSTRAINT "tally_revisions_tally_id_tallies_id_fk" FOREIGN KEY ("tally_id") REFERENCES "public"."tallies"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tally_revisions" ADD CONSTRAINT "tally_revisions_bid_item_id_bid_items_id_fk" FOREIGN KEY ("bid_item_id") REFERENCES "public"."bid_items"("id") ON DELETE no action ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "tally_revisions" ADD CONSTRAINT "tally_revisions_replaced_by_user_id_user_id_fk" FOREIGN KEY ("replaced_by_user_id") REFERENCES "public"."user"("id") ON DELETE no action ON UPDATE no action;
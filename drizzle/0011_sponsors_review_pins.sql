CREATE TABLE "review_pins" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"deal_id" uuid NOT NULL,
	"link_id" uuid NOT NULL,
	"deliverable_id" uuid,
	"offset_ms" integer NOT NULL,
	"note" text NOT NULL,
	"contact_name" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "review_pins" ADD CONSTRAINT "review_pins_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_pins" ADD CONSTRAINT "review_pins_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_pins" ADD CONSTRAINT "review_pins_link_id_review_links_id_fk" FOREIGN KEY ("link_id") REFERENCES "public"."review_links"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "review_pins" ADD CONSTRAINT "review_pins_deliverable_id_deliverables_id_fk" FOREIGN KEY ("deliverable_id") REFERENCES "public"."deliverables"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "review_pins_deal_idx" ON "review_pins" USING btree ("deal_id","offset_ms");--> statement-breakpoint
CREATE INDEX "review_pins_link_idx" ON "review_pins" USING btree ("link_id","created_at");
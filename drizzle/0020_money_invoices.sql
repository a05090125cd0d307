CREATE TYPE "public"."invoice_status" AS ENUM('draft', 'open', 'paid', 'void', 'uncollectible');--> statement-breakpoint
CREATE TABLE "deal_invoices" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"deal_id" uuid NOT NULL,
	"position" integer NOT NULL,
	"label" text NOT NULL,
	"amount_minor" bigint NOT NULL,
	"currency" text NOT NULL,
	"days_until_due" integer NOT NULL,
	"provider_id" text NOT NULL,
	"number" text,
	"status" "invoice_status" DEFAULT 'draft' NOT NULL,
	"hosted_url" text,
	"due_date" date,
	"finalised_at" timestamp with time zone,
	"sent_at" timestamp with time zone,
	"paid_at" timestamp with time zone,
	"overdue_reminded_at" timestamp with time zone,
	"created_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "payment_events" (
	"event_id" text PRIMARY KEY NOT NULL,
	"type" text NOT NULL,
	"object_id" text,
	"channel_id" uuid,
	"invoice_id" uuid,
	"outcome" text NOT NULL,
	"provider_created_at" timestamp with time zone NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "sponsors" ADD COLUMN "payments_customer_id" text;--> statement-breakpoint
ALTER TABLE "deal_invoices" ADD CONSTRAINT "deal_invoices_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deal_invoices" ADD CONSTRAINT "deal_invoices_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deal_invoices" ADD CONSTRAINT "deal_invoices_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "payment_events" ADD CONSTRAINT "payment_events_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "payment_events" ADD CONSTRAINT "payment_events_invoice_id_deal_invoices_id_fk" FOREIGN KEY ("invoice_id") REFERENCES "public"."deal_invoices"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "deal_invoices_deal_idx" ON "deal_invoices" USING btree ("deal_id","position");--> statement-breakpoint
CREATE UNIQUE INDEX "deal_invoices_provider_idx" ON "deal_invoices" USING btree ("provider_id");--> statement-breakpoint
CREATE INDEX "deal_invoices_channel_due_idx" ON "deal_invoices" USING btree ("channel_id","status","due_date");--> statement-breakpoint
CREATE INDEX "payment_events_invoice_idx" ON "payment_events" USING btree ("invoice_id");
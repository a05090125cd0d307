CREATE TYPE "public"."money_entry_kind" AS ENUM('part', 'purchase', 'hours', 'income');--> statement-breakpoint
CREATE TYPE "public"."purchase_category" AS ENUM('materials', 'travel', 'rental', 'other');--> statement-breakpoint
CREATE TABLE "deal_fee_rates" (
	"deal_id" uuid PRIMARY KEY NOT NULL,
	"channel_id" uuid NOT NULL,
	"rate" text NOT NULL,
	"recorded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "money_entries" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"kind" "money_entry_kind" NOT NULL,
	"category" "purchase_category",
	"label" text DEFAULT '' NOT NULL,
	"source" text DEFAULT '' NOT NULL,
	"part_id" uuid,
	"part_name" text,
	"quantity" integer,
	"unit_minor" bigint,
	"member_id" uuid,
	"minutes" integer,
	"amount_minor" bigint,
	"currency" text NOT NULL,
	"rate" text,
	"channel_minor" bigint,
	"occurred_on" date NOT NULL,
	"receipt_key" text,
	"receipt_name" text,
	"receipt_type" text,
	"receipt_bytes" bigint,
	"created_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "money_entries_receipt_key_unique" UNIQUE("receipt_key")
);
--> statement-breakpoint
CREATE TABLE "money_settings" (
	"channel_id" uuid PRIMARY KEY NOT NULL,
	"currency" text NOT NULL,
	"hour_rate_minor" bigint,
	"version" integer DEFAULT 1 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "deal_fee_rates" ADD CONSTRAINT "deal_fee_rates_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deal_fee_rates" ADD CONSTRAINT "deal_fee_rates_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "deal_fee_rates" ADD CONSTRAINT "deal_fee_rates_recorded_by_users_id_fk" FOREIGN KEY ("recorded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "money_entries" ADD CONSTRAINT "money_entries_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "money_entries" ADD CONSTRAINT "money_entries_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "money_entries" ADD CONSTRAINT "money_entries_part_id_bench_parts_id_fk" FOREIGN KEY ("part_id") REFERENCES "public"."bench_parts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "money_entries" ADD CONSTRAINT "money_entries_member_id_users_id_fk" FOREIGN KEY ("member_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "money_entries" ADD CONSTRAINT "money_entries_created_by_users_id_fk" FOREIGN KEY ("created_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "money_settings" ADD CONSTRAINT "money_settings_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "money_entries_episode_idx" ON "money_entries" USING btree ("channel_id","episode_id","occurred_on");--> statement-breakpoint
CREATE INDEX "money_entries_channel_month_idx" ON "money_entries" USING btree ("channel_id","occurred_on");
CREATE TABLE "publish_figure_columns" (
	"channel_id" uuid PRIMARY KEY NOT NULL,
	"columns" jsonb NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "publish_figures" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"day" integer NOT NULL,
	"views" bigint,
	"watch_hours" numeric(14, 1),
	"link_clicks" bigint,
	"code_uses" bigint,
	"source" text NOT NULL,
	"entered_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "sponsor_reports" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"deal_id" uuid NOT NULL,
	"state" text NOT NULL,
	"object_key" text,
	"pages" integer,
	"size_bytes" bigint,
	"failure" text,
	"requested_by" uuid,
	"made_at" timestamp with time zone,
	"sent_to" text,
	"sent_at" timestamp with time zone,
	"link_expires_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "publish_figure_columns" ADD CONSTRAINT "publish_figure_columns_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_figures" ADD CONSTRAINT "publish_figures_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_figures" ADD CONSTRAINT "publish_figures_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_figures" ADD CONSTRAINT "publish_figures_entered_by_users_id_fk" FOREIGN KEY ("entered_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsor_reports" ADD CONSTRAINT "sponsor_reports_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsor_reports" ADD CONSTRAINT "sponsor_reports_deal_id_deals_id_fk" FOREIGN KEY ("deal_id") REFERENCES "public"."deals"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "sponsor_reports" ADD CONSTRAINT "sponsor_reports_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "publish_figures_day_idx" ON "publish_figures" USING btree ("channel_id","episode_id","day");--> statement-breakpoint
CREATE UNIQUE INDEX "sponsor_reports_deal_idx" ON "sponsor_reports" USING btree ("deal_id");
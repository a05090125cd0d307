CREATE TYPE "public"."calendar_feed_scope" AS ENUM('everything', 'mine');--> statement-breakpoint
CREATE TABLE "calendar_feed_items" (
	"feed_id" uuid NOT NULL,
	"key" text NOT NULL,
	"digest" text NOT NULL,
	"sequence" integer DEFAULT 0 NOT NULL,
	"entry" jsonb NOT NULL,
	"changed_at" timestamp with time zone DEFAULT now() NOT NULL,
	"cancelled_at" timestamp with time zone,
	CONSTRAINT "calendar_feed_items_feed_id_key_pk" PRIMARY KEY("feed_id","key")
);
--> statement-breakpoint
CREATE TABLE "calendar_feeds" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"user_id" uuid NOT NULL,
	"token_hash" text NOT NULL,
	"scope" "calendar_feed_scope" NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"revoked_at" timestamp with time zone,
	CONSTRAINT "calendar_feeds_token_hash_unique" UNIQUE("token_hash")
);
--> statement-breakpoint
ALTER TABLE "calendar_feed_items" ADD CONSTRAINT "calendar_feed_items_feed_id_calendar_feeds_id_fk" FOREIGN KEY ("feed_id") REFERENCES "public"."calendar_feeds"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "calendar_feeds" ADD CONSTRAINT "calendar_feeds_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "calendar_feeds" ADD CONSTRAINT "calendar_feeds_user_id_users_id_fk" FOREIGN KEY ("user_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "calendar_feed_items_cancelled_idx" ON "calendar_feed_items" USING btree ("feed_id","cancelled_at");--> statement-breakpoint
CREATE UNIQUE INDEX "calendar_feeds_one_live_idx" ON "calendar_feeds" USING btree ("channel_id","user_id") WHERE "calendar_feeds"."revoked_at" is null;
CREATE TABLE "publish_packages" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"titles" jsonb DEFAULT '[]'::jsonb NOT NULL,
	"chosen_title" integer,
	"description" text DEFAULT '' NOT NULL,
	"chapters" text DEFAULT '' NOT NULL,
	"time_zone" text NOT NULL,
	"publish_at" timestamp with time zone,
	"thumbnail_id" uuid,
	"published_at" timestamp with time zone,
	"video_url" text,
	"go_live_reason" text,
	"go_live_skipped" jsonb,
	"published_by" uuid,
	"version" integer DEFAULT 1 NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "publish_thumbnails" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"object_key" text NOT NULL,
	"file_name" text NOT NULL,
	"content_type" text NOT NULL,
	"size_bytes" bigint NOT NULL,
	"width" integer,
	"height" integer,
	"uploaded_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "publish_thumbnails_object_key_unique" UNIQUE("object_key")
);
--> statement-breakpoint
ALTER TABLE "publish_packages" ADD CONSTRAINT "publish_packages_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD CONSTRAINT "publish_packages_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_packages" ADD CONSTRAINT "publish_packages_published_by_users_id_fk" FOREIGN KEY ("published_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_thumbnails" ADD CONSTRAINT "publish_thumbnails_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_thumbnails" ADD CONSTRAINT "publish_thumbnails_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "publish_thumbnails" ADD CONSTRAINT "publish_thumbnails_uploaded_by_users_id_fk" FOREIGN KEY ("uploaded_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "publish_packages_episode_idx" ON "publish_packages" USING btree ("channel_id","episode_id");--> statement-breakpoint
CREATE INDEX "publish_thumbnails_episode_idx" ON "publish_thumbnails" USING btree ("channel_id","episode_id","created_at");
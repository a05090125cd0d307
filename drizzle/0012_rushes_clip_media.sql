CREATE TYPE "public"."clip_media_state" AS ENUM('waiting', 'making', 'ready', 'failed');--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "media_state" "clip_media_state" DEFAULT 'ready' NOT NULL;--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "media_failure" text;--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "media_attempts" integer DEFAULT 0 NOT NULL;--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "server_poster_key" text;--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "proxy_key" text;--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "probed" jsonb;--> statement-breakpoint
ALTER TABLE "clips" ADD COLUMN "media_mismatches" jsonb DEFAULT '[]'::jsonb NOT NULL;
CREATE TABLE "bench_results_cards" (
	"episode_id" uuid PRIMARY KEY NOT NULL,
	"channel_id" uuid NOT NULL,
	"state" text NOT NULL,
	"failure" text,
	"png_still_id" uuid,
	"svg_still_id" uuid,
	"requested_by" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "channels" ADD COLUMN "card_colours" jsonb;--> statement-breakpoint
ALTER TABLE "bench_results_cards" ADD CONSTRAINT "bench_results_cards_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_results_cards" ADD CONSTRAINT "bench_results_cards_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "bench_results_cards" ADD CONSTRAINT "bench_results_cards_requested_by_users_id_fk" FOREIGN KEY ("requested_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;
CREATE TYPE "public"."episode_origin" AS ENUM('viewer', 'idea', 'sponsor');--> statement-breakpoint
CREATE TABLE "due_overrides" (
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"stage" "stage" NOT NULL,
	"due_date" date NOT NULL,
	"set_by" uuid,
	"set_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "due_overrides_episode_id_stage_pk" PRIMARY KEY("episode_id","stage")
);
--> statement-breakpoint
CREATE TABLE "episode_comments" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"author_id" uuid,
	"body" text NOT NULL,
	"mentions" uuid[] DEFAULT '{}'::uuid[] NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "slate_channels" (
	"channel_id" uuid PRIMARY KEY NOT NULL,
	"stage_lengths" jsonb,
	"board_revision" bigint DEFAULT 0 NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "stage_moves" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid NOT NULL,
	"from_stage" "stage",
	"to_stage" "stage" NOT NULL,
	"moved_by" uuid,
	"moved_at" timestamp with time zone DEFAULT now() NOT NULL,
	"reason" text,
	"skipped" jsonb DEFAULT '[]'::jsonb NOT NULL
);
--> statement-breakpoint
ALTER TABLE "episodes" ADD COLUMN "origin" "episode_origin" DEFAULT 'idea' NOT NULL;--> statement-breakpoint
ALTER TABLE "episodes" ADD COLUMN "origin_link" text;--> statement-breakpoint
ALTER TABLE "episodes" ADD COLUMN "why_worth_it" text DEFAULT '' NOT NULL;--> statement-breakpoint
ALTER TABLE "episodes" ADD COLUMN "tags" text[] DEFAULT '{}'::text[] NOT NULL;--> statement-breakpoint
ALTER TABLE "episodes" ADD COLUMN "budget_amount" numeric(11, 2);--> statement-breakpoint
ALTER TABLE "episodes" ADD COLUMN "budget_currency" text;--> statement-breakpoint
ALTER TABLE "episodes" ADD COLUMN "stage_entered_at" timestamp with time zone DEFAULT now() NOT NULL;--> statement-breakpoint
ALTER TABLE "due_overrides" ADD CONSTRAINT "due_overrides_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "due_overrides" ADD CONSTRAINT "due_overrides_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "due_overrides" ADD CONSTRAINT "due_overrides_set_by_users_id_fk" FOREIGN KEY ("set_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode_comments" ADD CONSTRAINT "episode_comments_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode_comments" ADD CONSTRAINT "episode_comments_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "episode_comments" ADD CONSTRAINT "episode_comments_author_id_users_id_fk" FOREIGN KEY ("author_id") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "slate_channels" ADD CONSTRAINT "slate_channels_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stage_moves" ADD CONSTRAINT "stage_moves_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stage_moves" ADD CONSTRAINT "stage_moves_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "stage_moves" ADD CONSTRAINT "stage_moves_moved_by_users_id_fk" FOREIGN KEY ("moved_by") REFERENCES "public"."users"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "due_overrides_channel_idx" ON "due_overrides" USING btree ("channel_id");--> statement-breakpoint
CREATE INDEX "episode_comments_episode_idx" ON "episode_comments" USING btree ("episode_id","created_at");--> statement-breakpoint
CREATE INDEX "stage_moves_episode_idx" ON "stage_moves" USING btree ("episode_id","moved_at");
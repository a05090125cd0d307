-- What grouping compares: the suggestion's words as Kerf's search configuration (0021_search_config)
-- stems them, without stop words and without the words people wrap an ask in ("please try", "I'd love
-- to see", "next video"), each once, in alphabetical order. So "a drill that climbs stairs" and
-- "please try to make stairs climbable with a drill" come out close, and a trigram index on it
-- (pg_trgm) still matches misspellings. Immutable: the two-argument to_tsvector with a constant
-- configuration is, so it may compute a stored column.
CREATE FUNCTION "intake_key"(input text) RETURNS text
  LANGUAGE sql IMMUTABLE PARALLEL SAFE STRICT
  AS $$
    SELECT coalesce(string_agg(DISTINCT lexeme, ' ' ORDER BY lexeme), '')
    FROM unnest(tsvector_to_array(to_tsvector('kerf_search'::regconfig, input))) AS lexeme
    WHERE lexeme <> ALL (ARRAY['pleas', 'tri', 'see', 'love', 'want', 'wish', 'make', 'build', 'video', 'episod', 'channel',
      'could', 'would', 'someon', 'guy', 'idea', 'challeng', 'next', 'hey', 'like', 'whether', 'possibl', 'realli', 'go', 'get', 'do', 'let', 'us'])
  $$;--> statement-breakpoint
CREATE TYPE "public"."intake_idea_status" AS ENUM('open', 'parked', 'declined', 'promoted');--> statement-breakpoint
CREATE TYPE "public"."intake_source" AS ENUM('page', 'import', 'hand');--> statement-breakpoint
CREATE TABLE "intake_contacts" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"email" text NOT NULL,
	"confirm_hash" text,
	"confirmed_at" timestamp with time zone,
	"unsubscribed_at" timestamp with time zone,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "intake_ideas" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"wording" text NOT NULL,
	"status" "intake_idea_status" DEFAULT 'open' NOT NULL,
	"decline_reason" text,
	"episode_id" uuid,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "intake_judgements" (
	"idea_id" uuid NOT NULL,
	"person_id" uuid NOT NULL,
	"channel_id" uuid NOT NULL,
	"draw" smallint NOT NULL,
	"reach" smallint NOT NULL,
	"spend" smallint NOT NULL,
	"danger" smallint NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "intake_judgements_idea_id_person_id_pk" PRIMARY KEY("idea_id","person_id")
);
--> statement-breakpoint
CREATE TABLE "intake_news" (
	"episode_id" uuid NOT NULL,
	"contact_id" uuid NOT NULL,
	"channel_id" uuid NOT NULL,
	"video_url" text NOT NULL,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "intake_news_episode_id_contact_id_pk" PRIMARY KEY("episode_id","contact_id")
);
--> statement-breakpoint
CREATE TABLE "intake_page_hits" (
	"id" bigserial PRIMARY KEY NOT NULL,
	"scope" text NOT NULL,
	"at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "intake_pages" (
	"channel_id" uuid PRIMARY KEY NOT NULL,
	"open" boolean DEFAULT false NOT NULL,
	"prompt" text DEFAULT '' NOT NULL,
	"mapping" jsonb,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
CREATE TABLE "intake_suggestions" (
	"id" uuid PRIMARY KEY DEFAULT gen_random_uuid() NOT NULL,
	"channel_id" uuid NOT NULL,
	"idea_id" uuid NOT NULL,
	"text" text NOT NULL,
	"key" text GENERATED ALWAYS AS (intake_key("text")) STORED NOT NULL,
	"source" "intake_source" NOT NULL,
	"person_key" text NOT NULL,
	"author" text,
	"link" text,
	"asked_at" timestamp with time zone DEFAULT now() NOT NULL,
	"contact_id" uuid,
	"fingerprint" text,
	"created_at" timestamp with time zone DEFAULT now() NOT NULL
);
--> statement-breakpoint
ALTER TABLE "intake_contacts" ADD CONSTRAINT "intake_contacts_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_ideas" ADD CONSTRAINT "intake_ideas_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_ideas" ADD CONSTRAINT "intake_ideas_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_judgements" ADD CONSTRAINT "intake_judgements_idea_id_intake_ideas_id_fk" FOREIGN KEY ("idea_id") REFERENCES "public"."intake_ideas"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_judgements" ADD CONSTRAINT "intake_judgements_person_id_users_id_fk" FOREIGN KEY ("person_id") REFERENCES "public"."users"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_judgements" ADD CONSTRAINT "intake_judgements_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_news" ADD CONSTRAINT "intake_news_episode_id_episodes_id_fk" FOREIGN KEY ("episode_id") REFERENCES "public"."episodes"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_news" ADD CONSTRAINT "intake_news_contact_id_intake_contacts_id_fk" FOREIGN KEY ("contact_id") REFERENCES "public"."intake_contacts"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_news" ADD CONSTRAINT "intake_news_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_pages" ADD CONSTRAINT "intake_pages_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_suggestions" ADD CONSTRAINT "intake_suggestions_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_suggestions" ADD CONSTRAINT "intake_suggestions_idea_id_intake_ideas_id_fk" FOREIGN KEY ("idea_id") REFERENCES "public"."intake_ideas"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_suggestions" ADD CONSTRAINT "intake_suggestions_contact_id_intake_contacts_id_fk" FOREIGN KEY ("contact_id") REFERENCES "public"."intake_contacts"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE UNIQUE INDEX "intake_contacts_channel_email_idx" ON "intake_contacts" USING btree ("channel_id","email");--> statement-breakpoint
CREATE INDEX "intake_contacts_confirm_idx" ON "intake_contacts" USING btree ("confirm_hash");--> statement-breakpoint
CREATE INDEX "intake_ideas_channel_status_idx" ON "intake_ideas" USING btree ("channel_id","status");--> statement-breakpoint
CREATE INDEX "intake_page_hits_scope_idx" ON "intake_page_hits" USING btree ("scope","at");--> statement-breakpoint
CREATE INDEX "intake_suggestions_idea_idx" ON "intake_suggestions" USING btree ("idea_id","asked_at");--> statement-breakpoint
CREATE UNIQUE INDEX "intake_suggestions_fingerprint_idx" ON "intake_suggestions" USING btree ("fingerprint","channel_id");--> statement-breakpoint
CREATE INDEX "intake_suggestions_key_idx" ON "intake_suggestions" USING gin ("channel_id","key" gin_trgm_ops);
CREATE TABLE "search_documents" (
	"kind" text NOT NULL,
	"record_id" uuid NOT NULL,
	"channel_id" uuid NOT NULL,
	"episode_id" uuid,
	"area" text NOT NULL,
	"title" text NOT NULL,
	"body" text DEFAULT '' NOT NULL,
	"place" jsonb NOT NULL,
	"words" "tsvector" GENERATED ALWAYS AS (setweight(to_tsvector('kerf_search'::regconfig, "title"), 'A') || setweight(to_tsvector('kerf_search'::regconfig, "body"), 'B')) STORED NOT NULL,
	"folded" text GENERATED ALWAYS AS (search_fold("title" || ' ' || "body")) STORED NOT NULL,
	"updated_at" timestamp with time zone DEFAULT now() NOT NULL,
	CONSTRAINT "search_documents_kind_record_id_pk" PRIMARY KEY("kind","record_id")
);
--> statement-breakpoint
ALTER TABLE "search_documents" ADD CONSTRAINT "search_documents_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "search_documents_words_idx" ON "search_documents" USING gin ("channel_id","words");--> statement-breakpoint
CREATE INDEX "search_documents_folded_idx" ON "search_documents" USING gin ("channel_id","folded" gin_trgm_ops);
-- Grouping compares a new suggestion with each idea's distinct keys, not with every suggestion: a
-- popular ask is made hundreds of times in far fewer wordings. btree_gist (Debian's PostgreSQL 15 ships
-- it) lets the GiST trigram index lead with the channel, so a nearest-key search reads only its own
-- channel's keys.
CREATE EXTENSION IF NOT EXISTS "btree_gist";--> statement-breakpoint
CREATE TABLE "intake_idea_keys" (
	"idea_id" uuid NOT NULL,
	"key" text NOT NULL,
	"channel_id" uuid NOT NULL,
	"suggestions" integer NOT NULL,
	CONSTRAINT "intake_idea_keys_idea_id_key_pk" PRIMARY KEY("idea_id","key")
);
--> statement-breakpoint
DROP INDEX "intake_suggestions_key_idx";--> statement-breakpoint
ALTER TABLE "intake_idea_keys" ADD CONSTRAINT "intake_idea_keys_idea_id_intake_ideas_id_fk" FOREIGN KEY ("idea_id") REFERENCES "public"."intake_ideas"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
ALTER TABLE "intake_idea_keys" ADD CONSTRAINT "intake_idea_keys_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "intake_idea_keys_exact_idx" ON "intake_idea_keys" USING btree ("channel_id","key");--> statement-breakpoint
CREATE INDEX "intake_idea_keys_nearest_idx" ON "intake_idea_keys" USING gist ("channel_id","key" gist_trgm_ops(siglen=1024));--> statement-breakpoint
-- Kept in step with intake_suggestions by statement triggers over the rows each statement touched, so
-- an import of thousands of rows touches each (idea, key) once, and a merge or a split moves the keys
-- with the suggestions. Empty keys (asking words only) group with nothing and are not kept. A removal
-- only counts down: when an idea's deletion removed its suggestions, its keys went with it.
CREATE FUNCTION "intake_idea_keys_add"(ideas uuid[], keys text[], channels uuid[]) RETURNS void LANGUAGE sql AS $$
  INSERT INTO "intake_idea_keys" AS k ("idea_id", "key", "channel_id", "suggestions")
  SELECT "idea_id", "key", "channel_id", count(*) FROM unnest(ideas, keys, channels) AS t("idea_id", "key", "channel_id")
  WHERE "key" <> '' GROUP BY "idea_id", "key", "channel_id"
  ON CONFLICT ("idea_id", "key") DO UPDATE SET "suggestions" = k."suggestions" + excluded."suggestions";
$$;--> statement-breakpoint
CREATE FUNCTION "intake_idea_keys_drop"(ideas uuid[], keys text[]) RETURNS void LANGUAGE sql AS $$
  UPDATE "intake_idea_keys" k SET "suggestions" = k."suggestions" - t."n"
  FROM (SELECT "idea_id", "key", count(*) AS "n" FROM unnest(ideas, keys) AS u("idea_id", "key") GROUP BY "idea_id", "key") t
  WHERE k."idea_id" = t."idea_id" AND k."key" = t."key";
  DELETE FROM "intake_idea_keys" k USING unnest(ideas, keys) AS t("idea_id", "key")
  WHERE k."idea_id" = t."idea_id" AND k."key" = t."key" AND k."suggestions" <= 0;
$$;--> statement-breakpoint
CREATE FUNCTION "intake_suggestions_added"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM "intake_idea_keys_add"(array_agg("idea_id"), array_agg("key"), array_agg("channel_id")) FROM added;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE FUNCTION "intake_suggestions_removed"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM "intake_idea_keys_drop"(array_agg("idea_id"), array_agg("key")) FROM removed;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE FUNCTION "intake_suggestions_moved"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM "intake_idea_keys_drop"(array_agg(r."idea_id"), array_agg(r."key"))
  FROM removed r JOIN added a ON a."id" = r."id" WHERE (a."idea_id", a."key") IS DISTINCT FROM (r."idea_id", r."key");
  PERFORM "intake_idea_keys_add"(array_agg(a."idea_id"), array_agg(a."key"), array_agg(a."channel_id"))
  FROM removed r JOIN added a ON a."id" = r."id" WHERE (a."idea_id", a."key") IS DISTINCT FROM (r."idea_id", r."key");
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "intake_suggestions_keys_added" AFTER INSERT ON "intake_suggestions"
  REFERENCING NEW TABLE AS added FOR EACH STATEMENT EXECUTE FUNCTION "intake_suggestions_added"();--> statement-breakpoint
CREATE TRIGGER "intake_suggestions_keys_removed" AFTER DELETE ON "intake_suggestions"
  REFERENCING OLD TABLE AS removed FOR EACH STATEMENT EXECUTE FUNCTION "intake_suggestions_removed"();--> statement-breakpoint
CREATE TRIGGER "intake_suggestions_keys_moved" AFTER UPDATE ON "intake_suggestions"
  REFERENCING OLD TABLE AS removed NEW TABLE AS added FOR EACH STATEMENT EXECUTE FUNCTION "intake_suggestions_moved"();--> statement-breakpoint
-- An import's new keys, compared one at a time in the order they first appear in the file, as filing
-- them one by one would: each goes to the open idea holding the nearest key within the similarity
-- threshold (pg_trgm.similarity_threshold, set by the caller), else to a new idea with its wording, and
-- is kept at once (with no suggestions yet) so the keys after it are compared with it too. One call
-- per file instead of one round trip per key; the caller then writes the suggestions, whose trigger
-- counts them. An empty key (asking words only) always gets a new idea. Returns the ideas, in order.
CREATE FUNCTION "intake_ideas_for_keys"(channel uuid, keys text[], wordings text[]) RETURNS uuid[] LANGUAGE plpgsql AS $$
DECLARE
  chosen uuid[] := '{}';
  found uuid;
BEGIN
  FOR i IN 1 .. coalesce(array_length(keys, 1), 0) LOOP
    found := NULL;
    IF keys[i] <> '' THEN
      SELECT k."idea_id" INTO found FROM "intake_idea_keys" k JOIN "intake_ideas" d ON d."id" = k."idea_id"
      WHERE k."channel_id" = channel AND k."key" % keys[i] AND d."status" = 'open'
      ORDER BY k."key" <-> keys[i] LIMIT 1;
    END IF;
    IF found IS NULL THEN
      INSERT INTO "intake_ideas" ("channel_id", "wording") VALUES (channel, wordings[i]) RETURNING "id" INTO found;
    END IF;
    IF keys[i] <> '' THEN
      INSERT INTO "intake_idea_keys" ("idea_id", "key", "channel_id", "suggestions") VALUES (found, keys[i], channel, 0) ON CONFLICT DO NOTHING;
    END IF;
    chosen := chosen || found;
  END LOOP;
  RETURN chosen;
END $$;--> statement-breakpoint
INSERT INTO "intake_idea_keys" ("idea_id", "key", "channel_id", "suggestions")
SELECT "idea_id", "key", "channel_id", count(*) FROM "intake_suggestions" WHERE "key" <> '' GROUP BY "idea_id", "key", "channel_id";

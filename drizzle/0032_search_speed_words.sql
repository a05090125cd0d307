CREATE TABLE "search_words" (
	"channel_id" uuid NOT NULL,
	"area" text NOT NULL,
	"word" text NOT NULL,
	CONSTRAINT "search_words_channel_id_area_word_pk" PRIMARY KEY("channel_id","area","word")
);
--> statement-breakpoint
DROP INDEX "search_documents_folded_idx";--> statement-breakpoint
ALTER TABLE "search_words" ADD CONSTRAINT "search_words_channel_id_channels_id_fk" FOREIGN KEY ("channel_id") REFERENCES "public"."channels"("id") ON DELETE cascade ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "search_words_near_idx" ON "search_words" USING gin ("channel_id","word" gin_trgm_ops);--> statement-breakpoint
ALTER TABLE "search_documents" DROP COLUMN "folded";--> statement-breakpoint
-- The words search_words keeps of a text: folded like the entries' words, split at anything but
-- letters and digits, three to 40 characters with a letter in them (a trigram of a shorter word says
-- little, and a number's near spellings are other numbers).
CREATE FUNCTION "search_word_list"(input text) RETURNS text[]
  LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$
  SELECT coalesce(array_agg(DISTINCT w), '{}') FROM regexp_split_to_table(search_fold(coalesce(input, '')), '[^[:alnum:]]+') AS w
  WHERE length(w) BETWEEN 3 AND 40 AND w ~ '[[:alpha:]]'
$$;--> statement-breakpoint
-- In PL/pgSQL, so each connection plans its statements once (a SQL function's are planned on every
-- call); an entry whose words changed adds the ones its channel had not used in that area yet.
CREATE OR REPLACE FUNCTION "search_put"(k text, rid uuid, ch uuid, ep uuid, ar text, t text, b text, pl jsonb) RETURNS void
  LANGUAGE plpgsql AS $$
BEGIN
  INSERT INTO search_documents AS d (kind, record_id, channel_id, episode_id, area, title, body, place)
  VALUES (k, rid, ch, ep, ar, coalesce(t, ''), coalesce(b, ''), pl)
  ON CONFLICT (kind, record_id) DO UPDATE
    SET episode_id = excluded.episode_id, title = excluded.title, body = excluded.body, place = excluded.place, updated_at = now()
    WHERE (d.episode_id, d.title, d.body, d.place) IS DISTINCT FROM (excluded.episode_id, excluded.title, excluded.body, excluded.place);
  IF FOUND THEN
    INSERT INTO search_words (channel_id, area, word)
    SELECT ch, ar, w FROM unnest(search_word_list(concat_ws(' ', t, b))) AS w
    ON CONFLICT DO NOTHING;
  END IF;
END $$;--> statement-breakpoint
-- A renamed sponsor's deals take its new name as their title, so their areas learn its words.
CREATE OR REPLACE FUNCTION "search_sponsor_renamed"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE search_documents d SET title = NEW.company, updated_at = now()
    FROM deals x WHERE x.sponsor_id = NEW.id AND d.record_id = x.id AND d.kind IN ('deal', 'dealMoney');
  INSERT INTO search_words (channel_id, area, word)
  SELECT NEW.channel_id, a, w FROM unnest(search_word_list(NEW.company)) AS w, unnest(ARRAY['sponsors', 'fees']) AS a
  ON CONFLICT DO NOTHING;
  RETURN NULL;
END $$;--> statement-breakpoint
-- The words of the entries written before.
INSERT INTO search_words (channel_id, area, word)
SELECT DISTINCT d.channel_id, d.area, w FROM search_documents d, unnest(search_word_list(d.title || ' ' || d.body)) AS w
ON CONFLICT DO NOTHING;

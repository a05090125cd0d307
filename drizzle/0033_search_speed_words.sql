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
-- call). A changed entry is updated in place (its words computed once, where an upsert computes them
-- for the row it tries first too); a new one inserted. Either adds the words its channel had not used
-- in that area yet.
CREATE OR REPLACE FUNCTION "search_put"(k text, rid uuid, ch uuid, ep uuid, ar text, t text, b text, pl jsonb) RETURNS void
  LANGUAGE plpgsql AS $$
BEGIN
  t := coalesce(t, '');
  b := coalesce(b, '');
  UPDATE search_documents d SET episode_id = ep, title = t, body = b, place = pl, updated_at = now()
    WHERE d.kind = k AND d.record_id = rid AND (d.episode_id, d.title, d.body, d.place) IS DISTINCT FROM (ep, t, b, pl);
  IF NOT FOUND THEN
    INSERT INTO search_documents (kind, record_id, channel_id, episode_id, area, title, body, place)
    VALUES (k, rid, ch, ep, ar, t, b, pl)
    ON CONFLICT (kind, record_id) DO NOTHING;
  END IF;
  IF FOUND THEN
    INSERT INTO search_words (channel_id, area, word)
    SELECT ch, ar, w FROM unnest(search_word_list(t || ' ' || b)) AS w
    ON CONFLICT DO NOTHING;
  END IF;
END $$;--> statement-breakpoint
-- The trigger calls its table's *_doc function by name in the function's text, not through EXECUTE:
-- PL/pgSQL keeps one plan per table and connection (a *_doc function, one SELECT, is inlined into it)
-- instead of parsing and planning a statement on every write. A new searchable table adds a line here.
CREATE OR REPLACE FUNCTION "search_keep"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  CASE TG_ARGV[0]
    WHEN 'search_episode_doc' THEN PERFORM search_episode_doc(NEW);
    WHEN 'search_test_plan_doc' THEN PERFORM search_test_plan_doc(NEW);
    WHEN 'search_bench_run_doc' THEN PERFORM search_bench_run_doc(NEW);
    WHEN 'search_part_doc' THEN PERFORM search_part_doc(NEW);
    WHEN 'search_build_entry_doc' THEN PERFORM search_build_entry_doc(NEW);
    WHEN 'search_shot_doc' THEN PERFORM search_shot_doc(NEW);
    WHEN 'search_clip_doc' THEN PERFORM search_clip_doc(NEW);
    WHEN 'search_mark_doc' THEN PERFORM search_mark_doc(NEW);
    WHEN 'search_comment_doc' THEN PERFORM search_comment_doc(NEW);
    WHEN 'search_sponsor_doc' THEN PERFORM search_sponsor_doc(NEW);
    WHEN 'search_deal_doc' THEN PERFORM search_deal_doc(NEW);
  END CASE;
  RETURN NULL;
END $$;--> statement-breakpoint
-- An update fires its table's search trigger only when a searched column's value changed, not merely
-- when the statement set it: a save that keeps the words runs nothing. An insert has a trigger of its
-- own (*_search_new; a WHEN naming OLD is for updates only). Deals keep one trigger on every column.
DO $$
DECLARE
  t record;
BEGIN
  FOR t IN SELECT * FROM (VALUES
    ('episodes', 'search_episode_doc', 'title, question, why_worth_it, tags'),
    ('test_plans', 'search_test_plan_doc', 'hypothesis, method'),
    ('bench_runs', 'search_bench_run_doc', 'label, notes'),
    ('bench_parts', 'search_part_doc', 'name, supplier, notes'),
    ('build_iterations', 'search_build_entry_doc', 'change, notes'),
    ('shots', 'search_shot_doc', 'description, episode_id'),
    ('clips', 'search_clip_doc', 'file_name, tags, camera, notes, episode_id'),
    ('clip_marks', 'search_mark_doc', 'note, in_label'),
    ('episode_comments', 'search_comment_doc', 'body'),
    ('sponsors', 'search_sponsor_doc', 'company, website, notes')
  ) AS v(tbl, doc, cols) LOOP
    EXECUTE format('DROP TRIGGER %I ON %I', t.tbl || '_search', t.tbl);
    EXECUTE format('CREATE TRIGGER %I AFTER INSERT ON %I FOR EACH ROW EXECUTE FUNCTION search_keep(%L)', t.tbl || '_search_new', t.tbl, t.doc);
    EXECUTE format('CREATE TRIGGER %I AFTER UPDATE OF %s ON %I FOR EACH ROW WHEN ((%s) IS DISTINCT FROM (%s)) EXECUTE FUNCTION search_keep(%L)',
      t.tbl || '_search', t.cols, t.tbl, 'OLD.' || replace(t.cols, ', ', ', OLD.'), 'NEW.' || replace(t.cols, ', ', ', NEW.'), t.doc);
  END LOOP;
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

-- Keeps search_documents current: each searchable table's trigger writes its record's entry in the
-- transaction that writes the record, so a search never sees a record's old words and a rolled-back
-- write leaves no entry. Each *_doc function makes one kind's entry from a row; the triggers and the
-- fill at the end both call it. Updates that leave the searched words alone write nothing.
CREATE FUNCTION "search_put"(k text, rid uuid, ch uuid, ep uuid, ar text, t text, b text, pl jsonb) RETURNS void
  LANGUAGE sql AS $$
  INSERT INTO search_documents AS d (kind, record_id, channel_id, episode_id, area, title, body, place)
  VALUES (k, rid, ch, ep, ar, coalesce(t, ''), coalesce(b, ''), pl)
  ON CONFLICT (kind, record_id) DO UPDATE
    SET episode_id = excluded.episode_id, title = excluded.title, body = excluded.body, place = excluded.place, updated_at = now()
    WHERE (d.episode_id, d.title, d.body, d.place) IS DISTINCT FROM (excluded.episode_id, excluded.title, excluded.body, excluded.place)
$$;--> statement-breakpoint
-- File names split into words: "A001_shoulder-test.mov" is searched as "A001 shoulder test mov".
CREATE FUNCTION "search_words_of"(input text) RETURNS text
  LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$ SELECT regexp_replace(coalesce(input, ''), '[_.\-]+', ' ', 'g') $$;--> statement-breakpoint
CREATE FUNCTION "search_lines"(VARIADIC parts text[]) RETURNS text
  LANGUAGE sql IMMUTABLE PARALLEL SAFE AS $$ SELECT array_to_string(array_remove(parts, ''), E'\n') $$;--> statement-breakpoint

CREATE FUNCTION "search_episode_doc"(r episodes) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('episode', r.id, r.channel_id, r.id, 'episodes', r.title,
    search_lines(r.question, r.why_worth_it, array_to_string(r.tags, ' ')), '{}'::jsonb)
$$;--> statement-breakpoint
CREATE FUNCTION "search_test_plan_doc"(r test_plans) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('testPlan', r.episode_id, r.channel_id, r.episode_id, 'testPlan', '', search_lines(r.hypothesis, r.method), '{}'::jsonb)
$$;--> statement-breakpoint
CREATE FUNCTION "search_bench_run_doc"(r bench_runs) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('benchRun', r.id, r.channel_id, r.episode_id, 'bench', r.label, r.notes, jsonb_build_object('number', r.number))
$$;--> statement-breakpoint
CREATE FUNCTION "search_part_doc"(r bench_parts) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('part', r.id, r.channel_id, NULL, 'bench', r.name, search_lines(r.supplier, r.notes), '{}'::jsonb)
$$;--> statement-breakpoint
CREATE FUNCTION "search_build_entry_doc"(r build_iterations) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('buildEntry', r.id, r.channel_id, r.episode_id, 'bench', r.change, r.notes, jsonb_build_object('number', r.number))
$$;--> statement-breakpoint
CREATE FUNCTION "search_shot_doc"(r shots) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('shot', r.id, r.channel_id, r.episode_id, 'shoot', r.description, '', '{}'::jsonb)
$$;--> statement-breakpoint
CREATE FUNCTION "search_clip_doc"(r clips) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('clip', r.id, r.channel_id, r.episode_id, 'footage', r.file_name,
    search_lines(search_words_of(r.file_name), array_to_string(r.tags, ' '), r.camera, r.notes), '{}'::jsonb)
$$;--> statement-breakpoint
CREATE FUNCTION "search_mark_doc"(r clip_marks) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('mark', r.id, r.channel_id, c.episode_id, 'footage', c.file_name, r.note,
    jsonb_build_object('clipId', r.clip_id, 'at', r.in_label))
  FROM clips c WHERE c.id = r.clip_id
$$;--> statement-breakpoint
CREATE FUNCTION "search_comment_doc"(r episode_comments) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('comment', r.id, r.channel_id, r.episode_id, 'comments', '', r.body, '{}'::jsonb)
$$;--> statement-breakpoint
CREATE FUNCTION "search_sponsor_doc"(r sponsors) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('sponsor', r.id, r.channel_id, NULL, 'sponsors', r.company, search_lines(r.website, r.notes), '{}'::jsonb)
$$;--> statement-breakpoint
-- A deal is two entries: its words, read by everyone who reads sponsors, and its money, read only
-- with the "fees" area (shared/access/roles.ts), so a search never shows a fee to a role without it.
CREATE FUNCTION "search_deal_doc"(r deals) RETURNS void LANGUAGE sql AS $$
  SELECT search_put('deal', r.id, r.channel_id, r.episode_id, 'sponsors', s.company,
    search_lines(array_to_string(ARRAY(SELECT jsonb_array_elements_text(r.talking_points)), E'\n'),
      r.promo_code, r.disclosure_text, r.exclusivity_notes, r.description_copy, r.script),
    jsonb_build_object('sponsorId', r.sponsor_id))
  FROM sponsors s WHERE s.id = r.sponsor_id;
  SELECT search_put('dealMoney', r.id, r.channel_id, r.episode_id, 'fees', s.company,
    search_lines(r.invoice_number, r.fee_amount::text || ' ' || r.currency),
    jsonb_build_object('sponsorId', r.sponsor_id))
  FROM sponsors s WHERE s.id = r.sponsor_id
$$;--> statement-breakpoint

-- One trigger function for every table: it calls the table's *_doc function (TG_ARGV[0]) with the new row.
CREATE FUNCTION "search_keep"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  EXECUTE format('SELECT %I($1)', TG_ARGV[0]) USING NEW;
  RETURN NULL;
END $$;--> statement-breakpoint
-- Removes the entries of the kinds named in the trigger's arguments; a test plan's id is its episode's.
CREATE FUNCTION "search_drop"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  DELETE FROM search_documents
    WHERE kind = ANY(TG_ARGV) AND record_id = coalesce(to_jsonb(OLD) ->> 'id', to_jsonb(OLD) ->> 'episode_id')::uuid;
  RETURN NULL;
END $$;--> statement-breakpoint

CREATE TRIGGER "episodes_search" AFTER INSERT OR UPDATE OF title, question, why_worth_it, tags ON "episodes"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_episode_doc');--> statement-breakpoint
CREATE TRIGGER "test_plans_search" AFTER INSERT OR UPDATE OF hypothesis, method ON "test_plans"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_test_plan_doc');--> statement-breakpoint
CREATE TRIGGER "bench_runs_search" AFTER INSERT OR UPDATE OF label, notes ON "bench_runs"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_bench_run_doc');--> statement-breakpoint
CREATE TRIGGER "bench_parts_search" AFTER INSERT OR UPDATE OF name, supplier, notes ON "bench_parts"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_part_doc');--> statement-breakpoint
CREATE TRIGGER "build_iterations_search" AFTER INSERT OR UPDATE OF change, notes ON "build_iterations"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_build_entry_doc');--> statement-breakpoint
CREATE TRIGGER "shots_search" AFTER INSERT OR UPDATE OF description, episode_id ON "shots"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_shot_doc');--> statement-breakpoint
CREATE TRIGGER "clips_search" AFTER INSERT OR UPDATE OF file_name, tags, camera, notes, episode_id ON "clips"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_clip_doc');--> statement-breakpoint
CREATE TRIGGER "clip_marks_search" AFTER INSERT OR UPDATE OF note, in_label ON "clip_marks"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_mark_doc');--> statement-breakpoint
CREATE TRIGGER "episode_comments_search" AFTER INSERT OR UPDATE OF body ON "episode_comments"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_comment_doc');--> statement-breakpoint
CREATE TRIGGER "sponsors_search" AFTER INSERT OR UPDATE OF company, website, notes ON "sponsors"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_sponsor_doc');--> statement-breakpoint
CREATE TRIGGER "deals_search" AFTER INSERT OR UPDATE ON "deals"
  FOR EACH ROW EXECUTE FUNCTION search_keep('search_deal_doc');--> statement-breakpoint

CREATE TRIGGER "episodes_search_drop" AFTER DELETE ON "episodes" FOR EACH ROW EXECUTE FUNCTION search_drop('episode');--> statement-breakpoint
CREATE TRIGGER "test_plans_search_drop" AFTER DELETE ON "test_plans" FOR EACH ROW EXECUTE FUNCTION search_drop('testPlan');--> statement-breakpoint
CREATE TRIGGER "bench_runs_search_drop" AFTER DELETE ON "bench_runs" FOR EACH ROW EXECUTE FUNCTION search_drop('benchRun');--> statement-breakpoint
CREATE TRIGGER "bench_parts_search_drop" AFTER DELETE ON "bench_parts" FOR EACH ROW EXECUTE FUNCTION search_drop('part');--> statement-breakpoint
CREATE TRIGGER "build_iterations_search_drop" AFTER DELETE ON "build_iterations" FOR EACH ROW EXECUTE FUNCTION search_drop('buildEntry');--> statement-breakpoint
CREATE TRIGGER "shots_search_drop" AFTER DELETE ON "shots" FOR EACH ROW EXECUTE FUNCTION search_drop('shot');--> statement-breakpoint
CREATE TRIGGER "clips_search_drop" AFTER DELETE ON "clips" FOR EACH ROW EXECUTE FUNCTION search_drop('clip');--> statement-breakpoint
CREATE TRIGGER "clip_marks_search_drop" AFTER DELETE ON "clip_marks" FOR EACH ROW EXECUTE FUNCTION search_drop('mark');--> statement-breakpoint
CREATE TRIGGER "episode_comments_search_drop" AFTER DELETE ON "episode_comments" FOR EACH ROW EXECUTE FUNCTION search_drop('comment');--> statement-breakpoint
CREATE TRIGGER "sponsors_search_drop" AFTER DELETE ON "sponsors" FOR EACH ROW EXECUTE FUNCTION search_drop('sponsor');--> statement-breakpoint
CREATE TRIGGER "deals_search_drop" AFTER DELETE ON "deals" FOR EACH ROW EXECUTE FUNCTION search_drop('deal', 'dealMoney');--> statement-breakpoint

-- A renamed sponsor renames its deals' entries; a clip's new name reaches its marks' entries.
CREATE FUNCTION "search_sponsor_renamed"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  UPDATE search_documents d SET title = NEW.company, updated_at = now()
    FROM deals x WHERE x.sponsor_id = NEW.id AND d.record_id = x.id AND d.kind IN ('deal', 'dealMoney');
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "sponsors_search_rename" AFTER UPDATE OF company ON "sponsors"
  FOR EACH ROW WHEN (OLD.company IS DISTINCT FROM NEW.company) EXECUTE FUNCTION search_sponsor_renamed();--> statement-breakpoint
CREATE FUNCTION "search_clip_renamed"() RETURNS trigger LANGUAGE plpgsql AS $$
BEGIN
  PERFORM search_mark_doc(m) FROM clip_marks m WHERE m.clip_id = NEW.id;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "clips_search_rename" AFTER UPDATE OF file_name, episode_id ON "clips"
  FOR EACH ROW WHEN ((OLD.file_name, OLD.episode_id) IS DISTINCT FROM (NEW.file_name, NEW.episode_id)) EXECUTE FUNCTION search_clip_renamed();--> statement-breakpoint

-- The records written before search existed.
SELECT search_episode_doc(r) FROM episodes r;--> statement-breakpoint
SELECT search_test_plan_doc(r) FROM test_plans r;--> statement-breakpoint
SELECT search_bench_run_doc(r) FROM bench_runs r;--> statement-breakpoint
SELECT search_part_doc(r) FROM bench_parts r;--> statement-breakpoint
SELECT search_build_entry_doc(r) FROM build_iterations r;--> statement-breakpoint
SELECT search_shot_doc(r) FROM shots r;--> statement-breakpoint
SELECT search_clip_doc(r) FROM clips r;--> statement-breakpoint
SELECT search_mark_doc(r) FROM clip_marks r;--> statement-breakpoint
SELECT search_comment_doc(r) FROM episode_comments r;--> statement-breakpoint
SELECT search_sponsor_doc(r) FROM sponsors r;--> statement-breakpoint
SELECT search_deal_doc(r) FROM deals r;

-- Search across a channel's records (server/search/). Debian's PostgreSQL 15 ships these three.
-- unaccent folds "crème" to "creme"; pg_trgm matches typos and partial words; btree_gin lets a GIN
-- index lead with the channel id, so every search reads only its own channel's entries.
CREATE EXTENSION IF NOT EXISTS "unaccent";--> statement-breakpoint
CREATE EXTENSION IF NOT EXISTS "pg_trgm";--> statement-breakpoint
CREATE EXTENSION IF NOT EXISTS "btree_gin";--> statement-breakpoint
-- English stemming after unaccent: the two-argument to_tsvector with this constant configuration is
-- immutable, so it can compute a generated column (unaccent() alone is not immutable).
CREATE TEXT SEARCH CONFIGURATION "kerf_search" ( COPY = pg_catalog.english );--> statement-breakpoint
ALTER TEXT SEARCH CONFIGURATION "kerf_search"
  ALTER MAPPING FOR hword, hword_part, word WITH "unaccent", english_stem;--> statement-breakpoint
-- unaccent() is stable only because it looks its dictionary up by name; naming it makes a form that
-- may sit in an immutable function, used for the folded text the trigram index reads.
CREATE FUNCTION "search_fold"(input text) RETURNS text
  LANGUAGE sql IMMUTABLE PARALLEL SAFE STRICT
  AS $$ SELECT lower(public.unaccent('public.unaccent'::regdictionary, input)) $$;

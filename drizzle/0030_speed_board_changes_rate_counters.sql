CREATE TABLE "rate_limit_counters" (
	"key" text PRIMARY KEY NOT NULL,
	"hits" integer NOT NULL,
	"resets_at" timestamp with time zone NOT NULL
);
--> statement-breakpoint
CREATE TABLE "slate_board_changes" (
	"channel_id" uuid NOT NULL,
	"revision" bigint NOT NULL,
	"episode_id" uuid,
	CONSTRAINT "slate_board_changes_channel_id_revision_pk" PRIMARY KEY("channel_id","revision")
);
--> statement-breakpoint
-- Raises a channel's board revision (if it has a slate row) and notes what the new revision changed:
-- an episode, or null for anything else behind the board (sponsor rows), which means "read the
-- board whole". Every 64th revision it forgets that channel's notes older than 256 revisions.
CREATE FUNCTION "slate_raise_board_revision"(channel uuid, changed_episode uuid) RETURNS void LANGUAGE plpgsql AS $$
DECLARE
  rev bigint;
BEGIN
  UPDATE "slate_channels" SET "board_revision" = "board_revision" + 1 WHERE "channel_id" = channel
    RETURNING "board_revision" INTO rev;
  IF NOT FOUND THEN RETURN; END IF;
  INSERT INTO "slate_board_changes" ("channel_id", "revision", "episode_id") VALUES (channel, rev, changed_episode);
  IF rev % 64 = 0 THEN
    DELETE FROM "slate_board_changes" WHERE "channel_id" = channel AND "revision" <= rev - 256;
  END IF;
END $$;--> statement-breakpoint
CREATE OR REPLACE FUNCTION "slate_bump_board_revision"() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  row_data record;
  changed_episode uuid;
BEGIN
  IF TG_OP = 'DELETE' THEN row_data := OLD; ELSE row_data := NEW; END IF;
  -- Each field is read only for the table that has it (a record's fields are looked up when read).
  IF TG_TABLE_NAME = 'episodes' THEN
    changed_episode := row_data.id;
  ELSIF TG_TABLE_NAME = 'due_overrides' THEN
    changed_episode := row_data.episode_id;
  END IF;
  IF TG_OP = 'DELETE' THEN
    -- No slate row is made here: when a whole channel is deleted, its rows go and nothing may point at it.
    PERFORM "slate_raise_board_revision"(OLD.channel_id, changed_episode);
    RETURN NULL;
  END IF;
  INSERT INTO "slate_channels" ("channel_id", "board_revision") VALUES (NEW.channel_id, 0) ON CONFLICT ("channel_id") DO NOTHING;
  PERFORM "slate_raise_board_revision"(NEW.channel_id, changed_episode);
  IF TG_OP = 'UPDATE' AND OLD.channel_id <> NEW.channel_id THEN
    PERFORM "slate_raise_board_revision"(OLD.channel_id, NULL);
  END IF;
  RETURN NULL;
END $$;

-- Fractional-index keys order byte by byte ("Zz" < "a0"); a linguistic collation would not.
ALTER TABLE "episodes" ALTER COLUMN "rank" SET DATA TYPE text COLLATE "C";--> statement-breakpoint
-- Episodes from before the history existed: their current stay began when they were made.
UPDATE "episodes" SET "stage_entered_at" = "created_at";--> statement-breakpoint
INSERT INTO "stage_moves" ("channel_id", "episode_id", "from_stage", "to_stage", "moved_at")
  SELECT "channel_id", "id", NULL, "stage", "created_at" FROM "episodes";--> statement-breakpoint
-- Any change to a channel's episodes (from the app, a factory or by hand) raises its board revision,
-- so a board cached for revision N is known stale without reading the episodes again.
CREATE FUNCTION "slate_bump_board_revision"() RETURNS trigger LANGUAGE plpgsql AS $$
DECLARE
  affected uuid;
BEGIN
  IF TG_OP = 'DELETE' THEN
    -- Only an update: when a whole channel is deleted, its rows go and nothing may point at it.
    UPDATE "slate_channels" SET "board_revision" = "board_revision" + 1 WHERE "channel_id" = OLD.channel_id;
    RETURN NULL;
  END IF;
  affected := NEW.channel_id;
  INSERT INTO "slate_channels" ("channel_id", "board_revision") VALUES (affected, 1)
    ON CONFLICT ("channel_id") DO UPDATE SET "board_revision" = "slate_channels"."board_revision" + 1;
  IF TG_OP = 'UPDATE' AND OLD.channel_id <> NEW.channel_id THEN
    UPDATE "slate_channels" SET "board_revision" = "board_revision" + 1 WHERE "channel_id" = OLD.channel_id;
  END IF;
  RETURN NULL;
END $$;--> statement-breakpoint
CREATE TRIGGER "episodes_board_revision" AFTER INSERT OR UPDATE OR DELETE ON "episodes"
  FOR EACH ROW EXECUTE FUNCTION "slate_bump_board_revision"();--> statement-breakpoint
CREATE TRIGGER "due_overrides_board_revision" AFTER INSERT OR UPDATE OR DELETE ON "due_overrides"
  FOR EACH ROW EXECUTE FUNCTION "slate_bump_board_revision"();

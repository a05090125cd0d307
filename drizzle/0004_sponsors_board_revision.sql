-- Sponsor rows put flags ("Sponsor item due") and the sponsor filter's choices on the board, so a
-- change to them raises the board revision like a change to an episode: a kept board answer,
-- flags included, is then known stale from the one revision row alone.
CREATE TRIGGER "sponsors_board_revision" AFTER INSERT OR UPDATE OR DELETE ON "sponsors"
  FOR EACH ROW EXECUTE FUNCTION "slate_bump_board_revision"();--> statement-breakpoint
CREATE TRIGGER "deals_board_revision" AFTER INSERT OR UPDATE OR DELETE ON "deals"
  FOR EACH ROW EXECUTE FUNCTION "slate_bump_board_revision"();--> statement-breakpoint
CREATE TRIGGER "deliverables_board_revision" AFTER INSERT OR UPDATE OR DELETE ON "deliverables"
  FOR EACH ROW EXECUTE FUNCTION "slate_bump_board_revision"();

ALTER TABLE "deliverables" ADD COLUMN "approves_id" uuid;--> statement-breakpoint
ALTER TABLE "deliverables" ADD CONSTRAINT "deliverables_approves_id_deliverables_id_fk" FOREIGN KEY ("approves_id") REFERENCES "public"."deliverables"("id") ON DELETE set null ON UPDATE no action;--> statement-breakpoint
CREATE INDEX "deliverables_approves_idx" ON "deliverables" USING btree ("approves_id");--> statement-breakpoint
-- Deals and templates made before items could be paired: an approval item approves the deal's only
-- script draft (script approval) or only draft cut (final approval), as the suggested template pairs them.
UPDATE "deliverables" AS approval SET "approves_id" = approved."id"
FROM "deliverables" AS approved
WHERE approval."deal_id" = approved."deal_id"
  AND approval."approves_id" IS NULL
  AND ((approval."kind" = 'script_approval' AND approved."kind" = 'script_draft') OR (approval."kind" = 'final_approval' AND approved."kind" = 'draft_cut'))
  AND (SELECT count(*) FROM "deliverables" AS same WHERE same."deal_id" = approved."deal_id" AND same."kind" = approved."kind") = 1;--> statement-breakpoint
UPDATE "deal_templates" AS template SET "items" = (
  SELECT jsonb_agg(
    CASE WHEN entry.item->>'kind' IN ('script_approval', 'final_approval') AND NOT entry.item ? 'approves' THEN entry.item || jsonb_build_object('approves', (
      SELECT other.n - 1 FROM jsonb_array_elements(template."items") WITH ORDINALITY AS other(item, n)
      WHERE other.item->>'kind' = CASE entry.item->>'kind' WHEN 'script_approval' THEN 'script_draft' ELSE 'draft_cut' END
      ORDER BY other.n LIMIT 1))
    ELSE entry.item END ORDER BY entry.n)
  FROM jsonb_array_elements(template."items") WITH ORDINALITY AS entry(item, n)
);

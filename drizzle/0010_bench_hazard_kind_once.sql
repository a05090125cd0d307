-- An episode may already list a hazard twice: keep the one checked (else the oldest) before the index.
DELETE FROM "safety_hazards" AS later USING "safety_hazards" AS kept
WHERE later."kind" <> 'custom' AND later."channel_id" = kept."channel_id" AND later."episode_id" = kept."episode_id" AND later."kind" = kept."kind"
  AND (kept."checked_at" IS NOT NULL, -extract(epoch FROM kept."created_at"), kept."id") > (later."checked_at" IS NOT NULL, -extract(epoch FROM later."created_at"), later."id");--> statement-breakpoint
CREATE UNIQUE INDEX "safety_hazards_kind_once" ON "safety_hazards" USING btree ("channel_id","episode_id","kind") WHERE "safety_hazards"."kind" <> 'custom';

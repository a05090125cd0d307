import { generateKeyBetween } from "fractional-indexing";
import type { Origin } from "../../shared/slate/schemas";
import type { Stage } from "../../shared/slate/stages";
import type { Database } from "../../server/db/client";
import { episodes } from "../../server/db/schema/slate";

type EpisodeOverrides = Partial<{
  title: string;
  question: string;
  stage: Stage;
  rank: string;
  ownerId: string | null;
  targetPublishDate: string | null;
  origin: Origin;
  originLink: string | null;
  whyWorthIt: string;
  tags: string[];
  budgetAmount: string | null;
  budgetCurrency: string | null;
  stageEnteredAt: Date;
  createdAt: Date;
  archivedAt: Date | null;
}>;

/** An episode row made directly (no history row: the slate reads its stay from stageEnteredAt). */
export async function createEpisode(db: Database, channelId: string, overrides: EpisodeOverrides = {}) {
  const [episode] = await db
    .insert(episodes)
    .values({
      channelId,
      title: overrides.title ?? "Test episode",
      question: overrides.question ?? "Does it work?",
      stage: overrides.stage ?? "challenge",
      rank: overrides.rank ?? generateKeyBetween(null, null),
      ownerId: overrides.ownerId ?? null,
      targetPublishDate: overrides.targetPublishDate ?? null,
      origin: overrides.origin,
      originLink: overrides.originLink,
      whyWorthIt: overrides.whyWorthIt,
      tags: overrides.tags,
      budgetAmount: overrides.budgetAmount,
      budgetCurrency: overrides.budgetCurrency,
      stageEnteredAt: overrides.stageEnteredAt ?? overrides.createdAt,
      createdAt: overrides.createdAt,
      archivedAt: overrides.archivedAt,
    })
    .returning();
  if (!episode) throw new Error("episode insert returned nothing");
  return episode;
}

import { generateKeyBetween } from "fractional-indexing";
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
}>;

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
    })
    .returning();
  if (!episode) throw new Error("episode insert returned nothing");
  return episode;
}

import { and, asc, eq, getTableColumns } from "drizzle-orm";
import type { Database } from "../db/client";
import { users } from "../db/schema/accounts";
import { episodes } from "../db/schema/slate";

const summaryColumns = {
  id: episodes.id,
  title: episodes.title,
  question: episodes.question,
  stage: episodes.stage,
  rank: episodes.rank,
  version: episodes.version,
  ownerId: episodes.ownerId,
  ownerName: users.name,
  targetPublishDate: episodes.targetPublishDate,
  archivedAt: episodes.archivedAt,
};

export async function listEpisodes(db: Database, channelId: string) {
  return db
    .select(summaryColumns)
    .from(episodes)
    .leftJoin(users, eq(users.id, episodes.ownerId))
    .where(eq(episodes.channelId, channelId))
    .orderBy(asc(episodes.stage), asc(episodes.rank));
}

/** Always scoped by channel: an id from another channel finds nothing and answers 404. */
export async function findEpisode(db: Database, channelId: string, episodeId: string) {
  const rows = await db
    .select({ ...getTableColumns(episodes), ownerName: users.name })
    .from(episodes)
    .leftJoin(users, eq(users.id, episodes.ownerId))
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}

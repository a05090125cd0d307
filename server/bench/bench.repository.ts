import { and, eq } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { episodes } from "../db/schema/slate";

export type { Queryable } from "../db/client";

/** The episode's title (the route's guard has checked it is the channel's). */
export async function episodeTitle(db: Queryable, channelId: string, episodeId: string): Promise<string> {
  const [row] = await db
    .select({ title: episodes.title })
    .from(episodes)
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId)));
  return row?.title ?? "";
}

export const iso = (date: Date | null) => date?.toISOString() ?? null;

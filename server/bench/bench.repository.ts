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

/** Postgres's unique_violation: two inserts raced for the same per-episode number. */
export function isUniqueViolation(error: unknown): boolean {
  const code = (error as { code?: string; cause?: { code?: string } })?.code ?? (error as { cause?: { code?: string } })?.cause?.code;
  return code === "23505";
}

/** Runs an insert that takes the next number, again when a concurrent insert took it first. */
export async function withNextNumber<T>(attempt: () => Promise<T>, tries = 5): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await attempt();
    } catch (error) {
      if (i >= tries || !isUniqueViolation(error)) throw error;
    }
  }
}

export const iso = (date: Date | null) => date?.toISOString() ?? null;

import { and, asc, eq } from "drizzle-orm";
import type { FigureColumns, FigureValues } from "../../shared/publish/figures";
import type { Queryable } from "../db/client";
import { users } from "../db/schema/accounts";
import { publishFigureColumns, publishFigures } from "../db/schema/publish";
import { nextVersion } from "../db/versions";

export async function listFigures(db: Queryable, channelId: string, episodeId: string) {
  return db
    .select({ figures: publishFigures, enteredByName: users.name })
    .from(publishFigures)
    .leftJoin(users, eq(users.id, publishFigures.enteredBy))
    .where(and(eq(publishFigures.channelId, channelId), eq(publishFigures.episodeId, episodeId)))
    .orderBy(asc(publishFigures.day));
}

type Entry = FigureValues & { source: "hand" | "export"; enteredBy: string };

/** The day's first figures: null when another first entry got there before (the caller answers 409). */
export async function insertFigures(db: Queryable, channelId: string, episodeId: string, day: number, entry: Entry) {
  const [row] = await db.insert(publishFigures).values({ channelId, episodeId, day, ...entry }).onConflictDoNothing().returning();
  return row ?? null;
}

/** New figures for the day against `version`: null when the version has moved on. */
export async function updateFigures(db: Queryable, channelId: string, episodeId: string, day: number, version: number, entry: Entry) {
  const [row] = await db
    .update(publishFigures)
    .set({ ...entry, version: nextVersion(publishFigures.version), updatedAt: new Date() })
    .where(and(eq(publishFigures.channelId, channelId), eq(publishFigures.episodeId, episodeId), eq(publishFigures.day, day), eq(publishFigures.version, version)))
    .returning();
  return row ?? null;
}

export async function findFigureColumns(db: Queryable, channelId: string): Promise<FigureColumns | null> {
  const [row] = await db.select({ columns: publishFigureColumns.columns }).from(publishFigureColumns).where(eq(publishFigureColumns.channelId, channelId));
  return row?.columns ?? null;
}

export async function saveFigureColumns(db: Queryable, channelId: string, columns: FigureColumns) {
  await db
    .insert(publishFigureColumns)
    .values({ channelId, columns })
    .onConflictDoUpdate({ target: publishFigureColumns.channelId, set: { columns, updatedAt: new Date() } });
}

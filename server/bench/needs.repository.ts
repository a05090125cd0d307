import { and, asc, eq, inArray, isNull } from "drizzle-orm";
import type { Stage } from "../../shared/slate/stages";
import type { Database } from "../db/client";
import { safetyHazards } from "../db/schema/bench";
import { episodes } from "../db/schema/slate";

/** Hazards nobody has checked yet, on episodes in these stages that are still on the slate. */
export async function uncheckedHazards(db: Database, channelId: string, inStages: readonly Stage[]) {
  return db
    .select({ id: safetyHazards.id, kind: safetyHazards.kind, title: safetyHazards.title, mitigation: safetyHazards.mitigation, episodeId: episodes.id, episodeTitle: episodes.title })
    .from(safetyHazards)
    .innerJoin(episodes, eq(episodes.id, safetyHazards.episodeId))
    .where(and(eq(safetyHazards.channelId, channelId), isNull(safetyHazards.checkedAt), isNull(episodes.archivedAt), inArray(episodes.stage, [...inStages])))
    .orderBy(asc(episodes.title), asc(safetyHazards.createdAt));
}

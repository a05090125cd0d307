import { calendarDaysBetween, localDate } from "../../shared/slate/dates";
import type { BoardCard } from "../../shared/slate/schemas";
import type { DueOverrides, StageLengths } from "../../shared/slate/schedule";
import type { Stage } from "../../shared/slate/stages";
import type { Database } from "../db/client";
import { boardRows, overridesOf, skippingMoves } from "./episodes.repository";
import { slateFlags } from "./slate-flags";

/** A card with where it sits (its rank stays on the server: the list's order is the board's order). */
export interface PlacedCard {
  id: string;
  stage: Stage;
  rank: string;
  card: BoardCard;
}

/** What a card's figures depend on besides its own rows: the channel's stage lengths and the viewer's day. */
export interface CardContext {
  stageLengths: StageLengths;
  timeZone: string;
  today: string;
  withArchived: boolean;
}

/** The channel's cards in board order, or only those of `episodeIds` that still show. */
export async function readCards(db: Database, channelId: string, context: CardContext, episodeIds?: string[]): Promise<PlacedCard[]> {
  const [rows, overrides, skips] = await Promise.all([
    boardRows(db, channelId, context.withArchived, episodeIds),
    overridesOf(db, channelId, episodeIds),
    skippingMoves(db, channelId, episodeIds),
  ]);
  const overridesByEpisode = new Map<string, DueOverrides>();
  for (const o of overrides) (overridesByEpisode.get(o.episodeId) ?? overridesByEpisode.set(o.episodeId, {}).get(o.episodeId)!)[o.stage] = o.dueDate;
  const skipsByEpisode = new Map<string, typeof skips>();
  for (const s of skips) (skipsByEpisode.get(s.episodeId) ?? skipsByEpisode.set(s.episodeId, []).get(s.episodeId)!).push(s);

  return rows.map((row) => {
    const enteredOn = localDate(row.stageEnteredAt, context.timeZone);
    const skipped = skipsByEpisode.get(row.id)?.find((s) => s.toStage === row.stage && s.movedAt.getTime() === row.stageEnteredAt.getTime());
    const own = slateFlags(
      { stage: row.stage as Stage, targetPublishDate: row.targetPublishDate, dueOverrides: overridesByEpisode.get(row.id) },
      context.stageLengths,
      { enteredOn, today: context.today, skipped: skipped ? { problems: skipped.skipped, reason: skipped.reason } : null },
    );
    const card: BoardCard = {
      id: row.id,
      title: row.title,
      stage: row.stage,
      version: row.version,
      ownerId: row.ownerId,
      ownerName: row.ownerName,
      targetPublishDate: row.targetPublishDate,
      archivedAt: row.archivedAt?.toISOString() ?? null,
      tags: row.tags,
      daysInStage: Math.max(0, calendarDaysBetween(enteredOn, context.today)),
      stageDue: own.stageDue,
      flags: own.flags,
    };
    return { id: row.id, stage: row.stage, rank: row.rank, card };
  });
}

/** The channel's cards in board order, without the board's keeping (what the home's needs read). */
export async function buildCards(db: Database, channelId: string, stageLengths: StageLengths, timeZone: string, today: string, withArchived: boolean): Promise<BoardCard[]> {
  return (await readCards(db, channelId, { stageLengths, timeZone, today, withArchived })).map((placed) => placed.card);
}

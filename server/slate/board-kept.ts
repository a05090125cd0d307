import { replaceCards } from "../../shared/slate/board-order";
import type { BoardFlag } from "../../shared/slate/flags";
import type { StageLengths } from "../../shared/slate/schedule";
import type { Database } from "../db/client";
import { collectFlags } from "../seams/board-flags";
import type { SlatePlugs } from "../seams/slate-plugs";
import { readCards, type CardContext, type PlacedCard } from "./board-cards";
import { boardChangesBetween } from "./slate.repository";

/** A card as the board keeps it: with its JSON as UTF-8 bytes, written once and copied into every answer. */
export type KeptCard = PlacedCard & { json: Buffer };

/** One channel's board for one viewer's zone and day, as of `revision`. */
export interface KeptBoard {
  revision: number;
  /** When the board was last read whole: rows no revision sees (a member's name) are at most a minute older. */
  wholeAt: number;
  cards: KeptCard[];
  /** Every source's flags for every card, by episode id. */
  flags: ReadonlyMap<string, BoardFlag[]>;
  tagsJson: string;
  sponsorOptionsJson: string;
}

export type BoardPlugs = Pick<SlatePlugs, "boardFlags" | "boardFilters">;
export interface BoardState {
  revision: number;
  stageLengths: StageLengths;
}

/** A whole read at most this old is read again whole. */
export const WHOLE_READ_MS = 60_000;
/** More changed episodes than this and reading the board whole is about as quick. */
const MOST_IN_PLACE = 100;

const kept = (placed: PlacedCard[]): KeptCard[] => placed.map((card) => ({ ...card, json: Buffer.from(JSON.stringify(card.card)) }));
const tagsJsonOf = (cards: KeptCard[]) => JSON.stringify([...new Set(cards.flatMap((c) => c.card.tags))].sort());

async function flagsOf(db: Database, plugs: BoardPlugs, channelId: string, ids: string[], context: CardContext): Promise<Map<string, BoardFlag[]>> {
  return new Map(Object.entries(await collectFlags(plugs.boardFlags, db, channelId, ids, { timeZone: context.timeZone, today: context.today })));
}

/** Every card and flag read afresh. */
export async function wholeBoard(db: Database, plugs: BoardPlugs, channelId: string, state: BoardState, context: CardContext): Promise<KeptBoard> {
  const [cards, sponsorOptions] = await Promise.all([
    readCards(db, channelId, context).then(kept),
    plugs.boardFilters.sponsor ? plugs.boardFilters.sponsor.options(db, channelId) : [],
  ]);
  const flags = await flagsOf(db, plugs, channelId, cards.map((c) => c.id), context);
  return { revision: state.revision, wholeAt: Date.now(), cards, flags, tagsJson: tagsJsonOf(cards), sponsorOptionsJson: JSON.stringify(sponsorOptions) };
}

/**
 * The episodes revisions `after`..`upTo` changed, or null when they can't all be named: a revision
 * noted without an episode (a sponsor row, new stage lengths), notes already forgotten, or so many
 * that reading the board whole is as quick.
 */
export async function changedEpisodes(db: Database, channelId: string, after: number, upTo: number): Promise<Set<string> | null> {
  if (upTo - after > MOST_IN_PLACE) return null;
  const changes = await boardChangesBetween(db, channelId, after, upTo);
  if (changes.length !== upTo - after || changes.some((change) => change.episodeId === null)) return null;
  return new Set(changes.map((change) => change.episodeId!));
}

/** `board` with the cards and flags of `changed` episodes read again, the rest as kept. */
export async function updatedBoard(db: Database, plugs: BoardPlugs, channelId: string, board: KeptBoard, changed: Set<string>, state: BoardState, context: CardContext): Promise<KeptBoard> {
  const ids = [...changed];
  const [fresh, freshFlags] = await Promise.all([readCards(db, channelId, context, ids).then(kept), flagsOf(db, plugs, channelId, ids, context)]);
  const cards = replaceCards(board.cards, changed, fresh);
  const flags = new Map(board.flags);
  for (const id of ids) flags.delete(id);
  for (const [id, episodeFlags] of freshFlags) flags.set(id, episodeFlags);
  return { ...board, revision: state.revision, cards, flags, tagsJson: tagsJsonOf(cards) };
}

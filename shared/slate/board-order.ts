import { stageIndex, type Stage } from "./stages";

/** Where a card sits on the board: the query's `order by stage, rank, id` (rank and id compared byte by byte). */
export interface BoardPlace {
  id: string;
  stage: Stage;
  rank: string;
}

/**
 * The board's order, as PostgreSQL gives it: stages in their enum's order, then the fractional key
 * (a `COLLATE "C"` column: fractional-indexing's keys are ASCII, so UTF-16 order is byte order),
 * then the id (a uuid, compared as its bytes: the same order as its lowercase hex).
 */
export function boardOrder(a: BoardPlace, b: BoardPlace): number {
  return stageIndex(a.stage) - stageIndex(b.stage) || compareText(a.rank, b.rank) || compareText(a.id, b.id);
}

const compareText = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0);

/**
 * A board in order with some cards replaced: every card whose id is in `changed` leaves, and each of
 * `fresh` (those of them that still show) goes in at its place. Equal to filtering, appending and
 * sorting the whole list again, in one pass over it plus a binary search per fresh card.
 */
export function replaceCards<T extends BoardPlace>(cards: readonly T[], changed: ReadonlySet<string>, fresh: readonly T[]): T[] {
  const kept = cards.filter((card) => !changed.has(card.id));
  const incoming = [...fresh].sort(boardOrder);
  const out: T[] = [];
  let from = 0;
  for (const card of incoming) {
    const at = insertionPoint(kept, card, from);
    for (let i = from; i < at; i++) out.push(kept[i]!);
    out.push(card);
    from = at;
  }
  for (let i = from; i < kept.length; i++) out.push(kept[i]!);
  return out;
}

/** The first index at or after `from` whose card goes after `card`. */
function insertionPoint<T extends BoardPlace>(cards: readonly T[], card: T, from: number): number {
  let low = from;
  let high = cards.length;
  while (low < high) {
    const middle = (low + high) >>> 1;
    if (boardOrder(cards[middle]!, card) <= 0) low = middle + 1;
    else high = middle;
  }
  return low;
}

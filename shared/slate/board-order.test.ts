import fc from "fast-check";
import { generateNKeysBetween } from "fractional-indexing";
import { describe, expect, it } from "vitest";
import { boardOrder, replaceCards, type BoardPlace } from "./board-order";
import { stages } from "./stages";

// Ranks are real fractional-indexing keys (ASCII base-62), as the episodes' rank column holds.
const ranks = generateNKeysBetween(null, null, 40);
const place = fc.record({
  id: fc.uuid(),
  stage: fc.constantFrom(...stages),
  rank: fc.constantFrom(...ranks),
});
const uniqueById = (list: BoardPlace[]) => [...new Map(list.map((card) => [card.id, card])).values()];

describe("the board's order", () => {
  it("sorts by stage in the stage list's order, then by rank byte by byte, then by id", () => {
    const a = { id: "00000000-0000-4000-8000-000000000002", stage: "challenge" as const, rank: "a0" };
    const b = { id: "00000000-0000-4000-8000-000000000001", stage: "challenge" as const, rank: "a0" };
    const c = { id: "00000000-0000-4000-8000-000000000000", stage: "challenge" as const, rank: "Zz" };
    const d = { id: "00000000-0000-4000-8000-000000000000", stage: "build" as const, rank: "A0" };
    // "Zz" < "a0" byte by byte (PostgreSQL's COLLATE "C"); a linguistic order would put "a0" first.
    expect([a, b, c, d].sort(boardOrder)).toEqual([c, b, a, d]);
  });

  it("when some cards are replaced, then the board equals the whole list sorted again", () => {
    fc.assert(
      fc.property(fc.array(place, { maxLength: 60 }), fc.array(fc.nat(), { maxLength: 10 }), fc.array(place, { maxLength: 10 }), (board, pickedIndexes, extra) => {
        const cards = uniqueById(board).sort(boardOrder);
        const changedCards = cards.length === 0 ? [] : pickedIndexes.map((i) => cards[i % cards.length]!);
        // Changed cards come back moved (some), and some vanish (archived or deleted); new ones arrive.
        const moved = changedCards.filter((_, i) => i % 3 !== 2).map((card, i) => ({ ...card, stage: stages[(i * 5) % stages.length]!, rank: ranks[(i * 7) % ranks.length]! }));
        const arrived = uniqueById(extra).filter((card) => !cards.some((c) => c.id === card.id));
        const changed = new Set([...changedCards, ...arrived].map((card) => card.id));
        const fresh = uniqueById([...moved, ...arrived]);
        const expected = [...cards.filter((card) => !changed.has(card.id)), ...fresh].sort(boardOrder);
        expect(replaceCards(cards, changed, fresh)).toEqual(expected);
      }),
    );
  });
});

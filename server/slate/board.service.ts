import { createHash } from "node:crypto";
import { brotliCompress, brotliCompressSync, constants as zlibConstants, gzipSync } from "node:zlib";
import { LRUCache } from "lru-cache";
import { localDate } from "../../shared/slate/dates";
import type { BoardFlag } from "../../shared/slate/flags";
import { isAtRisk } from "../../shared/slate/flags";
import type { BoardCard, BoardFilters } from "../../shared/slate/schemas";
import type { Database } from "../db/client";
import type { CardContext } from "./board-cards";
import { changedEpisodes, updatedBoard, WHOLE_READ_MS, wholeBoard, type BoardPlugs, type BoardState, type KeptBoard, type KeptCard } from "./board-kept";
import { slateStateOf } from "./slate.repository";

/**
 * The board: every card of a channel with its flags. Building 2,000 cards means reading and shaping
 * 2,000 rows, so the board is kept per (channel, viewer's zone and day, archived or not) with the
 * revision it shows, and each filter's answer as bytes. The revision is raised by triggers on every
 * table the board shows and is read on every request, so a kept board is never served once anything
 * on it changed, on this process or another. A board a few revisions behind is brought up to date in
 * place: the revisions' notes name the episodes they changed, and only those are read again.
 * docs/decisions/0006-board-kept-per-revision.md
 */
export interface Answer {
  etag: string;
  /** `{"episodes":[…]` as bytes: sent as is, never encoded again. */
  head: Buffer;
  /** The flags, today and the filter choices, closing the object. */
  tail: Buffer;
  /** The whole body compressed, each made the first time a client accepting it asks. */
  encoded: Partial<Record<BoardEncoding, Buffer>>;
  /** Brotli is being made in the background (see `encodedBody`). */
  brotliStarted?: boolean;
}

interface Entry {
  board: KeptBoard;
  /** The answer for each filter combination asked for so far, for this board. */
  answers: LRUCache<string, Answer>;
}

export type BoardEncoding = "br" | "gzip";

/** Either the body compressed (for clients that accept it) or in two parts to write one after the other. */
export type BoardAnswer = { etag: string } & ({ encoding: BoardEncoding; body: Buffer } | { head: Buffer; tail: Buffer });

export interface BoardKeeper {
  /** `encodings`: those the client takes, best first; none for the plain body. */
  load(db: Database, plugs: BoardPlugs, channelId: string, viewer: { timeZone: string }, filters: BoardFilters, options?: { encodings: BoardEncoding[] }): Promise<BoardAnswer>;
  /** How the kept boards were made so far: read whole, or brought up to date in place. */
  readonly made: { whole: number; inPlace: number };
}

const KEEP_FILTERS = 16;

/**
 * Made once per change of the board, so more effort pays: for a 2,000-card board (750 KiB) brotli
 * at quality 5 gives about 67 KiB in about 9 ms, gzip at level 1 about 94 KiB in 3 ms; sending the
 * bytes, not making them, is what a busy board route spends its time on.
 */
const BROTLI_OPTIONS = (body: Buffer) => ({ params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 5, [zlibConstants.BROTLI_PARAM_SIZE_HINT]: body.length } });
const compressors: Record<BoardEncoding, (body: Buffer) => Buffer> = {
  br: (body) => brotliCompressSync(body, BROTLI_OPTIONS(body)),
  gzip: (body) => gzipSync(body, { level: 1 }),
};

/** One keeper per app: its boards live in this process only and are checked against PostgreSQL's revision on every load. */
export function createBoardKeeper(): BoardKeeper {
  // The 32 boards used last.
  const boards = new LRUCache<string, Entry>({ max: 32, ttl: WHOLE_READ_MS });
  const inFlight = new Map<string, Promise<unknown>>();
  const made = { whole: 0, inPlace: 0 };

  /**
   * Requests that arrive while the same read is running share it rather than start another: their
   * answer is at most one query's time older than their arrival.
   */
  function shared<T>(key: string, work: () => Promise<T>): Promise<T> {
    const running = inFlight.get(key) as Promise<T> | undefined;
    if (running) return running;
    const started = work().finally(() => inFlight.delete(key));
    inFlight.set(key, started);
    return started;
  }

  async function upToDate(db: Database, plugs: BoardPlugs, channelId: string, key: string, state: BoardState, context: CardContext): Promise<Entry> {
    const current = boards.get(key);
    if (current && current.board.revision >= state.revision) return current;
    return shared(`${key}|${state.revision}`, async () => {
      const previous = current && Date.now() - current.board.wholeAt < WHOLE_READ_MS ? current.board : null;
      const changed = previous ? await changedEpisodes(db, channelId, previous.revision, state.revision) : null;
      const board = previous && changed ? await updatedBoard(db, plugs, channelId, previous, changed, state, context) : await wholeBoard(db, plugs, channelId, state, context);
      made[previous && changed ? "inPlace" : "whole"]++;
      const entry: Entry = { board, answers: new LRUCache({ max: KEEP_FILTERS }) };
      // Another request may have kept a later revision meanwhile: never go back to an earlier one.
      const latest = boards.get(key);
      if (!latest || latest.board.revision < board.revision) boards.set(key, entry);
      return entry;
    });
  }

  return {
    made,
    async load(db, plugs, channelId, viewer, filters, options = { encodings: [] }) {
      const today = localDate(new Date(), viewer.timeZone);
      // Always read fresh: this is what tells a kept board from a stale one.
      const state = await slateStateOf(db, channelId);
      const withArchived = filters.archived === "1";
      const key = `${channelId}|${viewer.timeZone}|${today}|${withArchived}`;
      const entry = await upToDate(db, plugs, channelId, key, state, { stageLengths: state.stageLengths, timeZone: viewer.timeZone, today, withArchived });
      const filterKey = `${filters.owner ?? ""}|${filters.tag ?? ""}|${filters.risk ?? ""}|${filters.sponsor ?? ""}|${filters.archived ?? ""}`;
      const answer =
        entry.answers.get(filterKey) ??
        (await shared(`answer|${key}|${entry.board.revision}|${filterKey}`, async () => {
          const made = await answerFor(db, plugs, channelId, entry.board, filters, { timeZone: viewer.timeZone, today, filterKey });
          entry.answers.set(filterKey, made);
          return made;
        }));
      const { encodings } = options;
      if (encodings.length === 0) return { etag: answer.etag, head: answer.head, tail: answer.tail };
      return { etag: answer.etag, ...encodedBody(answer, encodings) };
    },
  };
}

/** Above this, brotli is made in the background and the answers until then go gzipped. */
const BROTLI_IN_BACKGROUND_BYTES = 64 * 1024;

/**
 * The body in the best encoding the client takes that is ready. A big board's brotli takes about
 * three times gzip's time (9 ms against 3 ms for 750 KiB): the first answer after a change goes
 * gzipped. Brotli is made, on libuv's threads, only once the same answer is asked for again, so a
 * board that changes between every two reads never pays for a brotli nobody gets; later answers go
 * as brotli.
 */
export function encodedBody(answer: Answer, encodings: BoardEncoding[]): { encoding: BoardEncoding; body: Buffer } {
  const [best] = encodings;
  const plain = () => Buffer.concat([answer.head, answer.tail]);
  if (best === "br" && !answer.encoded.br && encodings.includes("gzip") && answer.head.length + answer.tail.length > BROTLI_IN_BACKGROUND_BYTES) {
    if (answer.encoded.gzip) brotliInBackground(answer, plain());
    return { encoding: "gzip", body: (answer.encoded.gzip ??= compressors.gzip(plain())) };
  }
  const ready = encodings.find((encoding) => answer.encoded[encoding]);
  if (ready) return { encoding: ready, body: answer.encoded[ready]! };
  return { encoding: best!, body: (answer.encoded[best!] = compressors[best!](plain())) };
}

function brotliInBackground(answer: Answer, plain: Buffer): void {
  if (answer.brotliStarted) return;
  answer.brotliStarted = true;
  brotliCompress(plain, BROTLI_OPTIONS(plain), (error, body) => {
    if (!error) answer.encoded.br = body;
  });
}

/** The cards a filter keeps, with other features' flags for them, as the bytes of the answer. */
async function answerFor(db: Database, plugs: BoardPlugs, channelId: string, board: KeptBoard, filters: BoardFilters, context: { timeZone: string; today: string; filterKey: string }): Promise<Answer> {
  const sponsor = plugs.boardFilters.sponsor;
  const sponsorKeeps = sponsor && filters.sponsor ? await sponsor.episodeIds(db, channelId, filters.sponsor) : null;
  const cards = board.cards.filter((placed) => keeps(placed.card, filters) && (!sponsorKeeps || sponsorKeeps.has(placed.id)));
  const flags: Record<string, BoardFlag[]> = {};
  for (const { id } of cards) {
    const episodeFlags = board.flags.get(id);
    if (episodeFlags) flags[id] = episodeFlags;
  }
  const tail = `,"flags":${JSON.stringify(flags)},"today":"${context.today}","sponsorOptions":${board.sponsorOptionsJson},"tags":${board.tagsJson}}`;
  const fingerprint = createHash("sha1").update(`${context.timeZone}|${context.filterKey}${tail}`).digest("base64url").slice(0, 16);
  return {
    etag: `W/"b${board.revision}-${fingerprint}"`,
    head: joinedCards(cards),
    tail: Buffer.from(tail),
    encoded: {},
  };
}

const OPEN_CARDS = Buffer.from('{"episodes":[');
const COMMA = Buffer.from(",");
const CLOSE_CARDS = Buffer.from("]");

/**
 * `{"episodes":[…]` from the cards' kept bytes: copying 740 KiB of bytes takes a fraction of joining
 * the same JSON as strings and encoding the result, which the first answer after each change did.
 */
function joinedCards(cards: KeptCard[]): Buffer {
  const parts: Buffer[] = [OPEN_CARDS];
  cards.forEach((placed, index) => {
    if (index > 0) parts.push(COMMA);
    parts.push(placed.json);
  });
  parts.push(CLOSE_CARDS);
  return Buffer.concat(parts);
}

function keeps(card: BoardCard, filters: BoardFilters): boolean {
  if (filters.owner === "none" ? card.ownerId !== null : filters.owner && card.ownerId !== filters.owner) return false;
  if (filters.tag && !card.tags.includes(filters.tag.toLowerCase())) return false;
  if (filters.risk === "1" && !isAtRisk(card.flags)) return false;
  return true;
}

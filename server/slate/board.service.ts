import { createHash } from "node:crypto";
import { brotliCompressSync, constants as zlibConstants, gzipSync } from "node:zlib";
import { LRUCache } from "lru-cache";
import { calendarDaysBetween, localDate } from "../../shared/slate/dates";
import { isAtRisk } from "../../shared/slate/flags";
import type { BoardCard, BoardFilters } from "../../shared/slate/schemas";
import type { DueOverrides } from "../../shared/slate/schedule";
import type { Stage } from "../../shared/slate/stages";
import type { Database } from "../db/client";
import { collectFlags } from "../seams/board-flags";
import type { SlatePlugs } from "../seams/slate-plugs";
import { boardRows, overridesOf, skippingMoves } from "./episodes.repository";
import { slateFlags } from "./slate-flags";
import { slateStateOf } from "./slate.repository";

/**
 * The board: every card of a channel with its flags. Building 2,000 cards means reading and shaping
 * 2,000 rows, so the whole answer is kept per (channel, board revision, viewer's zone and day, filters).
 * The revision is raised by triggers on every table the board shows (episodes, due dates, and the
 * sponsor rows behind the flags and the sponsor filter) and is read on every request, so a kept
 * answer is never served once anything on it changed, on this instance or another.
 */
interface Answer {
  etag: string;
  /** `{"episodes":[…]` as bytes: sent as is, never encoded again. */
  head: Buffer;
  /** The flags, today and the filter choices, closing the object. */
  tail: Buffer;
  /** The whole body compressed, each made the first time a client accepting it asks. */
  encoded: Partial<Record<BoardEncoding, Buffer>>;
}

interface Built {
  cards: BoardCard[];
  tagsJson: string;
  sponsorOptionsJson: string;
  /** The answer for each filter combination asked for so far. */
  answers: LRUCache<string, Answer>;
}

const KEEP_FILTERS = 16;
// The 32 boards used last, each for a minute at most: names of people and other rows outside the
// revision may lag that long.
const built = new LRUCache<string, Built>({ max: 32, ttl: 60_000 });

const inFlight = new Map<string, Promise<unknown>>();

/**
 * Requests that arrive while the same read is running share it rather than start another: their
 * answer is at most one query's time older than their arrival. Under a burst of board loads this
 * runs each read once per burst instead of once per request.
 */
function shared<T>(key: string, work: () => Promise<T>): Promise<T> {
  const running = inFlight.get(key) as Promise<T> | undefined;
  if (running) return running;
  const started = work().finally(() => inFlight.delete(key));
  inFlight.set(key, started);
  return started;
}

export type BoardEncoding = "br" | "gzip";

/** Either the body compressed (for clients that accept it) or in two parts to write one after the other. */
export type BoardAnswer = { etag: string } & ({ encoding: BoardEncoding; body: Buffer } | { head: Buffer; tail: Buffer });

/**
 * Made once per change of the board, so more effort pays: for a 2,000-card board (750 KiB) brotli
 * at quality 5 gives about 67 KiB in about 9 ms, gzip at level 1 about 94 KiB in 3 ms; sending the
 * bytes, not making them, is what a busy board route spends its time on.
 */
const compressors: Record<BoardEncoding, (body: Buffer) => Buffer> = {
  br: (body) => brotliCompressSync(body, { params: { [zlibConstants.BROTLI_PARAM_QUALITY]: 5, [zlibConstants.BROTLI_PARAM_SIZE_HINT]: body.length } }),
  gzip: (body) => gzipSync(body, { level: 1 }),
};

export async function loadBoard(
  db: Database,
  plugs: Pick<SlatePlugs, "boardFlags" | "boardFilters">,
  channelId: string,
  viewer: { timeZone: string },
  filters: BoardFilters,
  options: { encoding: BoardEncoding | null } = { encoding: null },
): Promise<BoardAnswer> {
  const today = localDate(new Date(), viewer.timeZone);
  // Always read fresh: this is what tells a kept board from a stale one.
  const state = await slateStateOf(db, channelId);
  const withArchived = filters.archived === "1";
  const key = `${channelId}|${state.revision}|${viewer.timeZone}|${today}|${withArchived}`;
  const entry =
    built.get(key) ??
    (await shared(`build|${key}`, async () => {
      const [cards, sponsorOptions] = await Promise.all([
        buildCards(db, channelId, state.stageLengths, viewer.timeZone, today, withArchived),
        plugs.boardFilters.sponsor ? plugs.boardFilters.sponsor.options(db, channelId) : [],
      ]);
      const tagsJson = JSON.stringify([...new Set(cards.flatMap((c) => c.tags))].sort());
      const made: Built = { cards, tagsJson, sponsorOptionsJson: JSON.stringify(sponsorOptions), answers: new LRUCache({ max: KEEP_FILTERS }) };
      built.set(key, made);
      return made;
    }));

  const filterKey = `${filters.owner ?? ""}|${filters.tag ?? ""}|${filters.risk ?? ""}|${filters.sponsor ?? ""}`;
  const answer =
    entry.answers.get(filterKey) ??
    (await shared(`answer|${key}|${filterKey}`, async () => {
      const made = await answerFor(db, plugs, channelId, entry, filters, { ...viewer, today, revision: state.revision, filterKey });
      entry.answers.set(filterKey, made);
      return made;
    }));
  const { encoding } = options;
  if (!encoding) return { etag: answer.etag, head: answer.head, tail: answer.tail };
  const body = (answer.encoded[encoding] ??= compressors[encoding](Buffer.concat([answer.head, answer.tail])));
  return { etag: answer.etag, encoding, body };
}

/** The cards a filter keeps, with other features' flags for them, as the bytes of the answer. */
async function answerFor(
  db: Database,
  plugs: Pick<SlatePlugs, "boardFlags" | "boardFilters">,
  channelId: string,
  entry: Built,
  filters: BoardFilters,
  context: { timeZone: string; today: string; revision: number; filterKey: string },
): Promise<Answer> {
  const sponsor = plugs.boardFilters.sponsor;
  const sponsorKeeps = sponsor && filters.sponsor ? await sponsor.episodeIds(db, channelId, filters.sponsor) : null;
  const cards = entry.cards.filter((card) => keeps(card, filters) && (!sponsorKeeps || sponsorKeeps.has(card.id)));
  const flags = await collectFlags(plugs.boardFlags, db, channelId, cards.map((c) => c.id), { timeZone: context.timeZone, today: context.today });
  const tail = `,"flags":${JSON.stringify(flags)},"today":"${context.today}","sponsorOptions":${entry.sponsorOptionsJson},"tags":${entry.tagsJson}}`;
  const fingerprint = createHash("sha1").update(`${context.timeZone}|${context.filterKey}|${filters.archived ?? ""}${tail}`).digest("base64url").slice(0, 16);
  return { etag: `W/"b${context.revision}-${fingerprint}"`, head: Buffer.from(`{"episodes":${JSON.stringify(cards)}`), tail: Buffer.from(tail), encoded: {} };
}

function keeps(card: BoardCard, filters: BoardFilters): boolean {
  if (filters.owner === "none" ? card.ownerId !== null : filters.owner && card.ownerId !== filters.owner) return false;
  if (filters.tag && !card.tags.includes(filters.tag.toLowerCase())) return false;
  if (filters.risk === "1" && !isAtRisk(card.flags)) return false;
  return true;
}

export async function buildCards(db: Database, channelId: string, stageLengths: Parameters<typeof slateFlags>[1], timeZone: string, today: string, withArchived: boolean): Promise<BoardCard[]> {
  const [rows, overrides, skips] = await Promise.all([boardRows(db, channelId, withArchived), overridesOf(db, channelId), skippingMoves(db, channelId)]);
  const overridesByEpisode = new Map<string, DueOverrides>();
  for (const o of overrides) (overridesByEpisode.get(o.episodeId) ?? overridesByEpisode.set(o.episodeId, {}).get(o.episodeId)!)[o.stage] = o.dueDate;
  const skipsByEpisode = new Map<string, typeof skips>();
  for (const s of skips) (skipsByEpisode.get(s.episodeId) ?? skipsByEpisode.set(s.episodeId, []).get(s.episodeId)!).push(s);

  return rows.map((row) => {
    const enteredOn = localDate(row.stageEnteredAt, timeZone);
    const skipped = skipsByEpisode.get(row.id)?.find((s) => s.toStage === row.stage && s.movedAt.getTime() === row.stageEnteredAt.getTime());
    const own = slateFlags(
      { stage: row.stage as Stage, targetPublishDate: row.targetPublishDate, dueOverrides: overridesByEpisode.get(row.id) },
      stageLengths,
      { enteredOn, today, skipped: skipped ? { problems: skipped.skipped, reason: skipped.reason } : null },
    );
    return {
      id: row.id,
      title: row.title,
      stage: row.stage,
      version: row.version,
      ownerId: row.ownerId,
      ownerName: row.ownerName,
      targetPublishDate: row.targetPublishDate,
      archivedAt: row.archivedAt?.toISOString() ?? null,
      tags: row.tags,
      daysInStage: Math.max(0, calendarDaysBetween(enteredOn, today)),
      stageDue: own.stageDue,
      flags: own.flags,
    };
  });
}

import { createHash } from "node:crypto";
import { gzipSync } from "node:zlib";
import { calendarDaysBetween, localDate } from "../../shared/slate/dates";
import { isAtRisk } from "../../shared/slate/flags";
import type { BoardCard, BoardFilters } from "../../shared/slate/schemas";
import type { DueOverrides } from "../../shared/slate/schedule";
import type { Stage } from "../../shared/slate/stages";
import type { Database } from "../db/client";
import { boardRows, overridesOf, skippingMoves } from "./episodes.repository";
import { boardFilters, externalFlags } from "./flags";
import { slateFlags } from "./slate-flags";
import { slateStateOf } from "./slate.repository";

/**
 * The board: every card of a channel with its flags. Building 2,000 cards means reading and shaping
 * 2,000 rows, so the built cards are kept per (channel, board revision, viewer's zone and day): the
 * revision, raised by a trigger on every change to a channel's episodes, is read on every request, so
 * a kept board is never served once anything on it changed, on this instance or another. Flags from
 * other features are read fresh on every load (their tables raise no revision).
 */
interface Shaped {
  ids: string[];
  /** `{"episodes":[…]` as bytes: sent as is, never encoded again. */
  head: Buffer;
  /** The whole body gzipped, for the flags it was made with (`fingerprint`). */
  gzipped?: { fingerprint: string; body: Buffer };
}

interface Built {
  at: number;
  cards: BoardCard[];
  tagsJson: string;
  /** The cards after each filter combination asked for so far. */
  shaped: Map<string, Shaped>;
}

const KEEP_MS = 60_000; // names of people and other rows outside the revision may lag this long
const KEEP_BOARDS = 32;
const built = new Map<string, Built>();

function remember(key: string, value: Built): Built {
  built.delete(key);
  built.set(key, value);
  while (built.size > KEEP_BOARDS) built.delete(built.keys().next().value!);
  return value;
}

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

/** Either the body gzipped (for clients that accept it) or in two parts to write one after the other. */
export type BoardAnswer = { etag: string } & ({ gzip: Buffer } | { head: Buffer; tail: Buffer });

export async function loadBoard(db: Database, channelId: string, viewer: { timeZone: string }, filters: BoardFilters, options: { gzip: boolean } = { gzip: false }): Promise<BoardAnswer> {
  const today = localDate(new Date(), viewer.timeZone);
  // Always read fresh: this is what tells a kept board from a stale one.
  const state = await slateStateOf(db, channelId);
  const withArchived = filters.archived === "1";
  const key = `${channelId}|${state.revision}|${viewer.timeZone}|${today}|${withArchived}`;
  let entry = built.get(key);
  if (!entry || Date.now() - entry.at > KEEP_MS) {
    entry = await shared(`build|${key}`, async () => {
      const cards = await buildCards(db, channelId, state.stageLengths, viewer.timeZone, today, withArchived);
      const tagsJson = JSON.stringify([...new Set(cards.flatMap((c) => c.tags))].sort());
      return remember(key, { at: Date.now(), cards, tagsJson, shaped: new Map() });
    });
  }

  const sponsorFilter = boardFilters.sponsor;
  const [sponsorKeeps, sponsorOptions] = await Promise.all([
    sponsorFilter && filters.sponsor ? shared(`keeps|${channelId}|${filters.sponsor}`, () => sponsorFilter.episodeIds(db, channelId, filters.sponsor!)) : null,
    sponsorFilter ? shared(`options|${channelId}`, () => sponsorFilter.options(db, channelId)) : [],
  ]);
  const filterKey = `${filters.owner ?? ""}|${filters.tag ?? ""}|${filters.risk ?? ""}|${sponsorKeeps ? filters.sponsor : ""}`;
  let shaped = sponsorKeeps ? undefined : entry.shaped.get(filterKey);
  if (!shaped) {
    const cards = entry.cards.filter((card) => keeps(card, filters) && (!sponsorKeeps || sponsorKeeps.has(card.id)));
    shaped = { ids: cards.map((c) => c.id), head: Buffer.from(`{"episodes":${JSON.stringify(cards)}`) };
    if (!sponsorKeeps) entry.shaped.set(filterKey, shaped);
  }

  const ids = shaped.ids;
  const flags = await shared(`flags|${key}|${filterKey}`, async () => JSON.stringify(await externalFlags(db, channelId, ids, { timeZone: viewer.timeZone, today })));
  const extras = `,"flags":${flags},"today":"${today}","sponsorOptions":${JSON.stringify(sponsorOptions)},"tags":${entry.tagsJson}}`;
  const fingerprint = createHash("sha1").update(`${viewer.timeZone}|${filterKey}|${filters.sponsor ?? ""}|${withArchived}${extras}`).digest("base64url").slice(0, 16);
  const etag = `W/"b${state.revision}-${fingerprint}"`;
  const tail = Buffer.from(extras);
  if (!options.gzip) return { etag, head: shaped.head, tail };
  if (shaped.gzipped?.fingerprint !== fingerprint) {
    // Level 1: a tenth of the bytes for about 5 ms, once per change of the board or its flags.
    shaped.gzipped = { fingerprint, body: gzipSync(Buffer.concat([shaped.head, tail]), { level: 1 }) };
  }
  return { etag, gzip: shaped.gzipped.body };
}

function keeps(card: BoardCard, filters: BoardFilters): boolean {
  if (filters.owner === "none" ? card.ownerId !== null : filters.owner && card.ownerId !== filters.owner) return false;
  if (filters.tag && !card.tags.includes(filters.tag.toLowerCase())) return false;
  if (filters.risk === "1" && !isAtRisk(card.flags)) return false;
  return true;
}

async function buildCards(db: Database, channelId: string, stageLengths: Parameters<typeof slateFlags>[1], timeZone: string, today: string, withArchived: boolean): Promise<BoardCard[]> {
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

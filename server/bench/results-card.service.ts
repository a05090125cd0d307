import { randomUUID } from "node:crypto";
import { Readable } from "node:stream";
import { type CardColours, cardColoursInputSchema, colourProblems, defaultCardColours } from "../../shared/bench/card-colours";
import { CARD_HEIGHT, CARD_WIDTH, resultsCardSvg } from "../../shared/bench/results-card";
import type { ResultsCardView } from "../../shared/bench/results-card-view";
import { PREVIEW_URL_SECONDS } from "../../shared/rushes/limits";
import type { Database, Queryable } from "../db/client";
import { inTransaction } from "../db/transaction";
import { AppError } from "../http/app-error";
import { parseBody } from "../http/validate";
import type { Caller } from "../http/route-table";
import { type LeftAlone, settleGivenUp } from "../jobs/given-up";
import type { Jobs } from "../jobs/queue";
import type { Storage } from "../storage/storage";
import { viaStorage } from "../storage/storage";
import { episodeTitle } from "./bench.repository";
import { cardFontFaces, svgToPng } from "./card-picture";
import * as repo from "./results-card.repository";
import { listRunRows } from "./runs.repository";
import { episodeRuns } from "./runs.service";
import { testPlanView } from "./test-plan.service";

export const RESULTS_CARD_QUEUE = "bench-results-card";
/** Where pg-boss puts a copy of a card job it gave up on: its last run failed, or both runs never finished. */
export const RESULTS_CARD_GIVEN_UP_QUEUE = "bench-results-card-given-up";
const STOPPED_REASON = "The server stopped twice before it finished drawing the card; ask for it again, and tell whoever runs Kerf if it happens again.";
/** A card draws in about a second; past two minutes the worker is gone. */
const JOB_EXPIRY_SECONDS = 120;

export interface CardContext {
  db: Database;
  storage: Storage;
  jobs: Pick<Jobs, "enqueue">;
  chromiumPath: string;
}

export interface ResultsCardJob {
  channelId: string;
  episodeId: string;
  [key: string]: unknown;
}

/** Queues the card's drawing; the answer says "queued" at once and the job does the rest. */
export async function requestCard(ctx: CardContext, caller: Caller, episodeId: string): Promise<ResultsCardView> {
  return inTransaction(ctx.db, async (tx, sql) => {
    const runs = await listRunRows(tx, caller.channelId, { episodeId });
    if (runs.length === 0) throw new AppError("conflict", "The card shows the bench's runs: enter a run first.");
    await repo.queueCard(tx, caller.channelId, episodeId, caller.userId);
    await ctx.jobs.enqueue(RESULTS_CARD_QUEUE, { channelId: caller.channelId, episodeId }, { retryLimit: 1, expireInSeconds: JOB_EXPIRY_SECONDS, deadLetter: RESULTS_CARD_GIVEN_UP_QUEUE, db: sql });
    return (await cardView(ctx, tx, caller.channelId, episodeId, false))!;
  });
}

/** The card as it stands, with links to its files when there are any; null before the first request. */
export async function cardView(ctx: Pick<CardContext, "storage">, db: Queryable, channelId: string, episodeId: string, links = true): Promise<ResultsCardView | null> {
  const card = await repo.findCard(db, channelId, episodeId);
  if (!card) return null;
  const files = links ? await repo.cardStills(db, channelId, [card.pngStillId, card.svgStillId].filter((id): id is string => id !== null)) : [];
  const link = async (id: string | null) => {
    const still = files.find((file) => file.id === id);
    if (!still) return null;
    const url = await viaStorage(() => ctx.storage.presignGet(still.objectKey, { expiresInSeconds: PREVIEW_URL_SECONDS, fileName: still.fileName, contentType: still.contentType }));
    return { fileName: still.fileName, url };
  };
  return { state: card.state, failure: card.failure, updatedAt: card.updatedAt.toISOString(), png: await link(card.pngStillId), svg: await link(card.svgStillId) };
}

const slug = (title: string) => title.normalize("NFKD").replace(/[^A-Za-z0-9]+/g, "-").replace(/^-|-$/g, "").toLowerCase().slice(0, 60) || "episode";

export type CardOutcome = { outcome: "made"; width: number; height: number; bytes: number } | { outcome: "skipped"; reason: string };

/**
 * The job: the bench's runs and plan as the section reads them, drawn, stored as the episode's stills.
 * `retryCount` is pg-boss's: above 0, the run before this one never finished.
 */
export async function makeCard(ctx: CardContext, job: ResultsCardJob, retryCount = 0): Promise<CardOutcome> {
  const card = await repo.claimCard(ctx.db, job.channelId, job.episodeId, retryCount > 0);
  if (!card) return { outcome: "skipped", reason: "the card is gone or not waiting" };
  try {
    const [title, channel, runs, plan, fonts] = await Promise.all([
      episodeTitle(ctx.db, job.channelId, job.episodeId),
      repo.channelLook(ctx.db, job.channelId),
      episodeRuns(ctx.db, job.channelId, job.episodeId),
      testPlanView(ctx.db, job.channelId, job.episodeId),
      cardFontFaces(),
    ]);
    const svg = resultsCardSvg({ title, channelName: channel.name, runs, criteria: plan.criteria }, channel.colours ?? defaultCardColours, fonts);
    const png = await svgToPng(svg, ctx.chromiumPath);
    const name = `results-card-${slug(title)}`;
    const stored = async (body: Buffer, extension: string, contentType: string) => {
      const objectKey = `${job.channelId}/${job.episodeId}/${randomUUID()}`;
      await ctx.storage.putStream(objectKey, Readable.from([body]), { contentType, size: body.length });
      const fileName = `${name}.${extension}`;
      return repo.insertCardStill(ctx.db, { channelId: job.channelId, episodeId: job.episodeId, objectKey, fileName, contentType, sizeBytes: body.length, uploadedBy: card.requestedBy });
    };
    const pngStill = await stored(png, "png", "image/png");
    const svgStill = await stored(Buffer.from(svg, "utf8"), "svg", "image/svg+xml");
    await repo.finishCard(ctx.db, job.channelId, job.episodeId, { pngStillId: pngStill.id, svgStillId: svgStill.id });
    return { outcome: "made", width: CARD_WIDTH, height: CARD_HEIGHT, bytes: png.length };
  } catch (error) {
    console.error(`[bench] results card of episode ${job.episodeId} failed: ${(error as Error).message}`);
    await repo.finishCard(ctx.db, job.channelId, job.episodeId, { failure: "Drawing the card failed on the server; try again, and tell whoever runs Kerf if it happens again." });
    throw error;
  }
}

/**
 * A card job pg-boss gave up on. A run that failed has already failed the card; two that never
 * finished (the server stopped during each) left it queued or drawing, so it fails now, saying so,
 * unless a new request has queued a job of its own since. The card's row is held while this looks,
 * as a request holds it while it queues.
 */
export function settleGivenUpCard(ctx: Pick<CardContext, "db"> & { jobs: Pick<Jobs, "countLive"> }, job: ResultsCardJob): Promise<{ outcome: "failed" } | LeftAlone> {
  return settleGivenUp(ctx.db, ctx.jobs, {
    noun: "card",
    queue: RESULTS_CARD_QUEUE,
    key: "episodeId",
    value: job.episodeId,
    lock: (tx) => repo.lockCardState(tx, job.channelId, job.episodeId),
    unfinished: ["queued", "drawing"],
    settle: async (tx) => {
      await repo.finishCard(tx, job.channelId, job.episodeId, { failure: STOPPED_REASON });
      return { outcome: "failed" as const };
    },
  });
}

/** The channel's card colours, and whether they are Kerf's own. */
export async function cardColours(db: Queryable, channelId: string): Promise<{ colours: CardColours; own: boolean }> {
  const { colours } = await repo.channelLook(db, channelId);
  return { colours: colours ?? defaultCardColours, own: colours === null };
}

/** New colours for the channel's cards, refused with the reason when the text would not read; null goes back to Kerf's. */
export async function changeCardColours(db: Database, channelId: string, body: unknown) {
  const { colours } = parseBody(cardColoursInputSchema, body);
  const problem = colours ? colourProblems(colours)[0] : undefined;
  if (problem) throw new AppError("validation_failed", problem, { "colours.ink": problem });
  const lower = colours && { background: colours.background.toLowerCase(), ink: colours.ink.toLowerCase(), accent: colours.accent.toLowerCase() };
  await repo.saveCardColours(db, channelId, lower);
  return cardColours(db, channelId);
}

import { z } from "zod";
import { amountTextSchema, plainAmount } from "../fields/amounts";
import { calendarDateSchema } from "../fields/dates";
import { multiLine, oneLine } from "../fields/text";
import { versionSchema } from "../http/version";
import type { BoardFlag } from "./flags";
import type { GateProblem } from "./gates";
import type { RiskReason, ScheduledStage, StageLengths } from "./schedule";
import { origins, type Origin } from "./choices";
import { stages, type Stage } from "./stages";

export { boardFilterKeys, commonCurrencies, emptyEpisodeFields, originLabels, origins, type Origin } from "./choices";

export const isoDateSchema = calendarDateSchema;

const blankOr = <S extends z.ZodType>(schema: S) => z.union([z.literal(""), z.null(), schema]);

export const tagSchema = oneLine(24, { blank: "A tag can't be empty.", tooLong: "Keep each tag under 24 characters." })
  .toLowerCase()
  .regex(/^[\p{L}\p{N}][\p{L}\p{N} -]*$/u, "Tags are words: letters, digits, spaces and dashes.");

const episodeFieldsObject = z.strictObject({
  title: oneLine(120, { blank: "Give the episode a working title.", tooLong: "Keep the title under 120 characters." }),
  question: oneLine(200, { tooLong: "Keep the question to one line (200 characters)." }),
  origin: z.enum(origins, { error: "Say where the challenge came from." }),
  originLink: blankOr(oneLine(500, { tooLong: "That address is too long." }).pipe(z.url({ protocol: /^https?$/, error: "Paste a full web address (https://…)." }))),
  whyWorthIt: multiLine(2000, { tooLong: "Keep this under 2,000 characters." }),
  ownerId: blankOr(z.uuid({ error: "Pick a member of this channel." })),
  tags: z.array(tagSchema).max(12, "Use at most 12 tags."),
  budgetAmount: blankOr(amountTextSchema("budget")).transform(plainAmount),
  budgetCurrency: blankOr(z.string().regex(/^[A-Z]{3}$/, "Pick a currency (a three-letter code such as EUR).")),
  targetPublishDate: blankOr(isoDateSchema),
});

type EpisodeFieldsShape = z.infer<typeof episodeFieldsObject>;

function crossFieldChecks(fields: Partial<EpisodeFieldsShape>, ctx: z.RefinementCtx) {
  if (fields.origin === "viewer" && !fields.originLink) ctx.addIssue({ code: "custom", path: ["originLink"], message: "Paste the link to the viewer's suggestion." });
  if (fields.budgetAmount && !fields.budgetCurrency) ctx.addIssue({ code: "custom", path: ["budgetCurrency"], message: "Pick the budget's currency." });
  if (fields.tags && new Set(fields.tags).size !== fields.tags.length) ctx.addIssue({ code: "custom", path: ["tags"], message: "Each tag once." });
}

/** Every field of an episode, as the form sends it and as a new episode is created. */
export const episodeFieldsSchema = episodeFieldsObject.superRefine(crossFieldChecks);
export type EpisodeFields = z.input<typeof episodeFieldsSchema>;



/** An edit: any subset of the fields, against the version the editor saw. */
export const episodeChangesSchema = episodeFieldsObject.partial().extend({ version: versionSchema });
export type EpisodeChanges = z.input<typeof episodeChangesSchema>;

export const versionOnlySchema = z.strictObject({ version: versionSchema });

/**
 * A move: to a stage, placed right after `afterId` (or, without it, right before `beforeId`; with
 * neither, at the end of the column). `reason` confirms a forward move past missing essentials.
 */
export const moveEpisodeSchema = z.strictObject({
  version: versionSchema,
  stage: z.enum(stages, { error: "Pick one of the seven stages." }),
  afterId: z.uuid().nullable().optional(),
  beforeId: z.uuid().nullable().optional(),
  reason: multiLine(500, { blank: "Say in a few words why it moves on anyway.", tooLong: "Keep the reason under 500 characters." }).min(3, "Say in a few words why it moves on anyway.").optional(),
});
export type MoveEpisodeInput = z.infer<typeof moveEpisodeSchema>;

export const dueOverrideSchema = z.strictObject({ version: versionSchema, dueDate: isoDateSchema.nullable() });

export const commentSchema = z.strictObject({
  body: multiLine(4000, { blank: "Write a comment first.", tooLong: "Keep a comment under 4,000 characters." }),
});
export type CommentInput = z.infer<typeof commentSchema>;

/** The board's filters, as they appear in the page's URL and the API's query string. */
export const boardFiltersSchema = z.object({
  owner: z.union([z.literal("none"), z.uuid({ error: "Pick a member, or none." })], { error: "Pick a member, or none." }).optional(),
  tag: oneLine(24).optional(),
  sponsor: oneLine(100).optional(),
  risk: z.literal("1").optional(),
  archived: z.literal("1").optional(),
});
export type BoardFilters = z.infer<typeof boardFiltersSchema>;

export const episodeSummarySchema = z.object({
  id: z.string(),
  title: z.string(),
  question: z.string(),
  stage: z.enum(stages),
  rank: z.string(),
  version: z.number().int(),
  ownerId: z.string().nullable(),
  ownerName: z.string().nullable(),
  targetPublishDate: z.string().nullable(),
  archivedAt: z.string().nullable(),
});
export type EpisodeSummary = z.infer<typeof episodeSummarySchema>;

/**
 * `GET /api/channels/:channelId/episode-titles`: every episode that is not archived, by title, with
 * no more than a picker needs (the footage filter, and any other list of episodes to choose from).
 */
export const episodeTitlesResponseSchema = z.object({
  episodes: z.array(z.object({ id: z.string(), title: z.string(), stage: z.enum(stages) })),
});
export type EpisodeTitles = z.infer<typeof episodeTitlesResponseSchema>;

/**
 * A card on the board: what matters at a glance, and no more (a board may hold thousands). The
 * order of the list is the board's order; the rank itself stays on the server.
 */
export interface BoardCard {
  id: string;
  title: string;
  stage: Stage;
  version: number;
  ownerId: string | null;
  ownerName: string | null;
  targetPublishDate: string | null;
  archivedAt: string | null;
  tags: string[];
  daysInStage: number;
  /** Due date of the current stage, when there is a publish date. */
  stageDue: string | null;
  flags: BoardFlag[];
}

export interface Board {
  episodes: BoardCard[];
  /** Flags other features raise, by episode id; shown after the card's own. */
  flags: Record<string, BoardFlag[]>;
  /** The viewer's today, in their time zone: what "overdue" was measured against. */
  today: string;
  sponsorOptions: { value: string; label: string }[];
  /** Every tag on the channel's cards (before filters), for the tag filter. */
  tags: string[];
}

export interface EpisodeRecord extends EpisodeSummary {
  origin: Origin;
  originLink: string | null;
  whyWorthIt: string;
  tags: string[];
  budgetAmount: string | null;
  budgetCurrency: string | null;
  stageEnteredAt: string;
  createdAt: string;
  updatedAt: string;
}

export interface EpisodeDetail {
  episode: EpisodeRecord;
  /** Null while the episode has no target publish date. */
  schedule: ScheduledStage[] | null;
  stageLengths: StageLengths;
  risks: RiskReason[];
  flags: BoardFlag[];
  today: string;
  /** The day the episode entered its stage, in the viewer's zone: the current stage's real start. */
  stageEnteredOn: string;
}

export interface HistoryEntry {
  id: string;
  from: Stage | null;
  to: Stage;
  at: string;
  byId: string | null;
  byName: string | null;
  reason: string | null;
  skipped: GateProblem[];
}

export interface EpisodeHistory {
  entries: HistoryEntry[];
  timeInStage: { stage: Stage; ms: number; visits: number }[];
}

export interface EpisodeComment {
  id: string;
  authorId: string | null;
  authorName: string | null;
  body: string;
  mentions: { id: string; name: string }[];
  createdAt: string;
}

export interface SlatePerson {
  id: string;
  name: string;
}

/** The 409 answer: the episode as it is now, so the client can show what changed. */
export interface ConflictBody {
  error: { code: "conflict"; message: string };
  current: EpisodeSummary;
}

/** The 422 answer to a forward move past missing essentials, until a reason confirms it. */
export interface GateBody {
  error: { code: "unprocessable"; message: string };
  problems: GateProblem[];
}

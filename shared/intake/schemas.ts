import { z } from "zod";
import { emailSchema } from "../auth/schemas";
import { multiLine, oneLine } from "../fields/text";
import { hasHiddenCharacter, hiddenCharacterMessage } from "./hidden";
import { dimensions, type Dimension } from "./weighing";

/** The longest suggestion Kerf keeps: a comment-sized ask, not an essay. */
export const SUGGESTION_MAX = 600;

const suggestionText = multiLine(SUGGESTION_MAX, { blank: "Write your suggestion first.", tooLong: `Keep a suggestion under ${SUGGESTION_MAX} characters.` }).refine(
  (text) => !hasHiddenCharacter(text),
  hiddenCharacterMessage,
);

const webLink = oneLine(500, { tooLong: "That address is too long." }).pipe(z.url({ protocol: /^https?$/, error: "Paste a full web address (https://…)." }));
const blankOr = <S extends z.ZodType>(schema: S) => z.union([z.literal(""), schema]).optional();

/**
 * What a visitor sends from the public page. `nickname` is the trap: a field people never see, so
 * only a form-filling robot fills it (it is answered as if accepted and kept nowhere).
 */
export const publicSuggestionSchema = z
  .strictObject({
    text: suggestionText,
    email: blankOr(emailSchema),
    consent: z.boolean().optional(),
    nickname: z.string().max(200).optional(),
  })
  .superRefine((body, ctx) => {
    if (body.email && !body.consent) ctx.addIssue({ code: "custom", path: ["consent"], message: "Tick the box to let the channel write to you, or leave the address out." });
    if (body.consent && !body.email) ctx.addIssue({ code: "custom", path: ["email"], message: "Give the address the channel may write to." });
  });
export type PublicSuggestion = z.input<typeof publicSuggestionSchema>;

/** A suggestion a member types in (heard at a meet-up, read in a mail). */
export const handSuggestionSchema = z.strictObject({
  text: suggestionText,
  author: blankOr(oneLine(100, { tooLong: "Keep the name under 100 characters." })),
  link: blankOr(webLink),
});
export type HandSuggestion = z.input<typeof handSuggestionSchema>;

export const pageSettingsSchema = z.strictObject({
  open: z.boolean({ error: "Say whether the page takes suggestions." }),
  prompt: multiLine(500, { tooLong: "Keep the prompt under 500 characters." }),
});
export type PageSettings = z.infer<typeof pageSettingsSchema>;

const score = z.number({ error: "Pick 1, 2 or 3." }).int("Pick 1, 2 or 3.").min(1, "Pick 1, 2 or 3.").max(3, "Pick 1, 2 or 3.");
export const judgementSchema = z.strictObject(Object.fromEntries(dimensions.map((d) => [d, score])) as Record<Dimension, typeof score>);
export type Judgement = Record<Dimension, number>;

export const declineSchema = z.strictObject({
  reason: oneLine(300, { blank: "Say in a few words why the channel won't do it.", tooLong: "Keep the reason under 300 characters." }),
});
export const mergeSchema = z.strictObject({ otherIdeaId: z.uuid({ error: "Pick the idea to fold in." }) });
export const ideaWordingSchema = z.strictObject({
  wording: oneLine(200, { blank: "Give the idea a wording.", tooLong: "Keep the wording under 200 characters." }),
});

/** Which CSV column holds what; only the text is required. */
export const columnMappingSchema = z.strictObject({
  text: oneLine(100, { blank: "Pick the column that holds the comment's text." }),
  author: blankOr(oneLine(100)),
  link: blankOr(oneLine(100)),
  postedAt: blankOr(oneLine(100)),
  commentId: blankOr(oneLine(100)),
});
export type ColumnMapping = z.infer<typeof columnMappingSchema>;

/** The file's text as read in the browser (UTF-8), with the mapping chosen (or, on preview, none yet). */
export const CSV_MAX_CHARS = 4_000_000;
export const importSchema = z.strictObject({
  csv: z.string({ error: "Choose a CSV file." }).min(1, "The file is empty.").max(CSV_MAX_CHARS, "Import at most 4 MB at a time: split the file."),
  mapping: columnMappingSchema.optional(),
});
export type ImportInput = z.input<typeof importSchema>;

export const ideaStatuses = ["open", "parked", "declined", "promoted"] as const;
export type IdeaStatus = (typeof ideaStatuses)[number];
export const ideaStatusLabels: Record<IdeaStatus, string> = { open: "Open", parked: "Set aside", declined: "Turned down", promoted: "On the slate" };

export const ideaSorts = ["people", "latest", "combined", ...dimensions] as const;
export type IdeaSort = (typeof ideaSorts)[number];
export const ideaListQuerySchema = z.object({
  sort: z.enum(ideaSorts, { error: "Sort by people, latest, combined or one dimension." }).default("people"),
  status: z.enum(ideaStatuses, { error: "Pick open, parked, declined or promoted." }).default("open"),
});

export interface SuggestionView {
  id: string;
  text: string;
  source: "page" | "import" | "hand";
  author: string | null;
  link: string | null;
  askedAt: string;
  wantsNews: boolean;
}

export interface IdeaView {
  id: string;
  wording: string;
  status: IdeaStatus;
  declineReason: string | null;
  episodeId: string | null;
  people: number;
  suggestions: number;
  firstAsked: string;
  lastAsked: string;
  /** A few of the askers' own words, newest first. */
  samples: string[];
  /** Each dimension's mean over the members who judged it; null until someone has. */
  combined: Record<Dimension, number | null>;
  combinedScore: number | null;
  judges: number;
  mine: Judgement | null;
}

export interface ImportPreview {
  headers: string[];
  mapping: ColumnMapping | null;
  /** Whether the mapping came from the channel's last import (else Kerf guessed it from the headers). */
  mappingSaved: boolean;
  rows: { line: number; text: string; author: string | null; link: string | null; postedAt: string | null }[];
  total: number;
  alreadyImported: number;
}

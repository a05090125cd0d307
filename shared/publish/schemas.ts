import { z } from "zod";
import { timeZoneSchema } from "../auth/account";
import { recordedInstantSchema } from "../fields/dates";
import { multiLine, oneLine } from "../fields/text";
import type { GateProblem } from "../slate/gates";
import type { DescriptionParts } from "./description";
import type { MarkSpan } from "./markers";

export const MAX_TITLE_CANDIDATES = 12;
/** Kerf keeps text past the platform's limits so the person sees by how much; the limits are checked, not cut. */
const TITLE_KEPT = 300;
const DESCRIPTION_KEPT = 20_000;

export const packageInputSchema = z.strictObject({
  version: z.number().int().min(0),
  titles: z.array(oneLine(TITLE_KEPT, { blank: "Write the title or remove the line." })).max(MAX_TITLE_CANDIDATES, `Keep at most ${MAX_TITLE_CANDIDATES} titles.`),
  chosenTitle: z.number().int().min(0).nullable(),
  description: multiLine(DESCRIPTION_KEPT),
  chapters: multiLine(10_000),
  timeZone: timeZoneSchema,
  publishAt: recordedInstantSchema.nullable(),
  thumbnailId: z.uuid().nullable(),
}).refine((input) => input.chosenTitle === null || input.chosenTitle < input.titles.length, { path: ["chosenTitle"], message: "Choose one of the titles." });
export type PackageInput = z.infer<typeof packageInputSchema>;

export const goLiveSchema = z.strictObject({
  videoUrl: z.url({ protocol: /^https?$/, error: "Give the video's web address (https://…)." }).max(500),
  publishedAt: recordedInstantSchema.optional(),
  reason: oneLine(500).optional(),
});
export type GoLiveInput = z.infer<typeof goLiveSchema>;

export interface ThumbnailView {
  id: string;
  fileName: string;
  contentType: string;
  size: number;
  width: number | null;
  height: number | null;
  url: string;
  problems: string[];
}

export interface PublishPackageView {
  version: number;
  titles: string[];
  chosenTitle: number | null;
  description: string;
  chapters: string;
  timeZone: string;
  publishAt: string | null;
  thumbnailId: string | null;
  publishedAt: string | null;
  videoUrl: string | null;
  goLiveReason: string | null;
  thumbnails: ThumbnailView[];
  /** What the description is drafted from. */
  sources: DescriptionParts;
  /** The footage's marks, laid out as the footage's edit decision list lays them: chapters can be taken from them. */
  marks: MarkSpan[];
  gate: GateProblem[];
}

import { z } from "zod";
import { calendarDateSchema, recordedInstantSchema } from "../fields/dates";
import { multiLine, oneLine } from "../fields/text";
import { frameRateSchema, labelsDroppedPerMinute } from "../timecode/rates";
import { checkTimecode } from "../timecode/timecode";
import { MAX_PARTS, RECORDS_PER_REQUEST } from "./limits";
import type { MediaMismatch } from "./media-check";
import { clipRatings, shotKinds, shotPriorities, shotStatuses, type ClipMediaState, type ClipRating, type ShotKind, type ShotPriority, type ShotStatus, type UploadStatus } from "./vocabulary";

// Request bodies are strict: a key the schema doesn't name is refused, never silently dropped.
const id = (what: string) => z.uuid({ message: `Choose a ${what}.` });

/** What the browser (mediainfo.js) or the server (ffprobe) read from a clip. */
export const clipMetadataSchema = z
  .strictObject({
    durationMs: z.number().int().min(0).max(7 * 24 * 3600 * 1000),
    frameRate: frameRateSchema.nullable(),
    dropFrame: z.boolean(),
    width: z.number().int().positive().max(32_768).nullable(),
    height: z.number().int().positive().max(32_768).nullable(),
    codec: oneLine(80).nullable(),
    startTimecode: z.string().max(20).nullable(),
    recordedAt: recordedInstantSchema.nullable(),
    camera: oneLine(120),
  })
  .superRefine((m, ctx) => {
    if (m.dropFrame && (!m.frameRate || labelsDroppedPerMinute(m.frameRate) === undefined)) {
      ctx.addIssue({ code: "custom", path: ["dropFrame"], message: "Drop-frame exists only at 29.97 and 59.94 fps" });
    }
    if (m.startTimecode !== null) {
      if (!m.frameRate) ctx.addIssue({ code: "custom", path: ["startTimecode"], message: "A start timecode needs the clip's frame rate" });
      else {
        const check = checkTimecode(m.startTimecode, { rate: m.frameRate, dropFrame: m.dropFrame });
        if (!check.ok) ctx.addIssue({ code: "custom", path: ["startTimecode"], message: check.message });
      }
    }
  });
export type ClipMetadata = z.infer<typeof clipMetadataSchema>;

export const emptyMetadata: ClipMetadata = {
  durationMs: 0,
  frameRate: null,
  dropFrame: false,
  width: null,
  height: null,
  codec: null,
  startTimecode: null,
  recordedAt: null,
  camera: "",
};

export const startUploadSchema = z.strictObject({
  episodeId: id("episode"),
  fileName: oneLine(255, { blank: "The file needs a name.", tooLong: "File names can be at most 255 characters." }),
  size: z.number({ message: "Give the file's size in bytes." }).int().min(0),
  fingerprint: oneLine(300).default(""),
  metadata: clipMetadataSchema.optional(),
});
export type StartUploadInput = z.input<typeof startUploadSchema>;

/**
 * `POST /uploads/:uploadId/part-urls`: the parts the browser is about to send, each with its size in
 * bytes as it cut them (the upload's `partSize`; the last part holds the rest). Kerf checks each size
 * against the upload's plan and signs it into the part's URL, so storage accepts exactly that many
 * bytes for that part of that upload and refuses anything else. Answers `PartUrlsAnswer`.
 */
export const partUrlsSchema = z.strictObject({
  parts: z
    .array(
      z.strictObject({
        partNumber: z.number().int().min(1).max(10_000),
        size: z.number({ message: "Give each part's size in bytes." }).int().min(1),
      }),
    )
    .min(1, "Ask for at least one part.")
    .max(100, "Ask for at most 100 parts at once."),
});
export type PartUrlsInput = z.input<typeof partUrlsSchema>;

/** One presigned PUT per part: bytes [start, end) of the file, until `expiresAt` (a quarter of an hour). */
export interface PartUrlsAnswer {
  urls: { partNumber: number; start: number; end: number; url: string }[];
  expiresAt: string;
}

/**
 * `POST /uploads/:uploadId/parts`: parts that reached storage, each with the ETag storage answered and
 * its size. The browser sends them a few at a time (RECORD_BATCH); each part once per request.
 */
export const recordPartsSchema = z.strictObject({
  parts: z
    .array(
      z.strictObject({
        partNumber: z.number().int().min(1).max(MAX_PARTS),
        etag: oneLine(200, { blank: "The part's ETag is missing." }).transform((v) => v.replaceAll('"', "")),
        size: z.number({ message: "Give each part's size in bytes." }).int().min(1),
      }),
    )
    .min(1, "Record at least one part.")
    .max(RECORDS_PER_REQUEST, `Record at most ${RECORDS_PER_REQUEST} parts at once.`)
    .superRefine((parts, ctx) => {
      const seen = new Set<number>();
      for (const [index, part] of parts.entries()) {
        if (seen.has(part.partNumber)) ctx.addIssue({ code: "custom", path: [index, "partNumber"], message: `Part ${part.partNumber} is listed twice.` });
        seen.add(part.partNumber);
      }
    }),
});
export type RecordPartsInput = z.input<typeof recordPartsSchema>;

export const completeUploadSchema = z.strictObject({
  sha256: z
    .string()
    .regex(/^[0-9a-f]{64}$/, "A SHA-256 is 64 hexadecimal digits.")
    .optional(),
  metadata: clipMetadataSchema.optional(),
});

export interface UploadPart {
  partNumber: number;
  etag: string;
  size: number;
}

export interface UploadView {
  id: string;
  episodeId: string;
  fileName: string;
  contentType: string;
  size: number;
  partSize: number;
  partCount: number;
  status: UploadStatus;
  fingerprint: string;
  parts: UploadPart[];
  clipId: string | null;
  createdAt: string;
}

/** A SHA-256 written as 64 lower-case hex digits, as the browser's hash gives it. */
export const sha256Pattern = /^[0-9a-f]{64}$/;

/** The clip of this channel that has the file's checksum already, if one has. */
export interface ChecksumAnswer {
  clip: { id: string; fileName: string; episodeId: string; episodeTitle: string } | null;
}

const place = oneLine(200, { tooLong: "Keep the place under 200 characters." });
const shootNotes = multiLine(2000, { tooLong: "Keep the notes under 2,000 characters." });
export const shootDaySchema = z.strictObject({
  day: calendarDateSchema,
  place: place.default(""),
  callTime: z
    .string()
    .regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Write the call time as HH:MM, 24-hour.")
    .nullable()
    .default(null),
  crewIds: z.array(z.uuid()).max(50).default([]),
  notes: shootNotes.default(""),
});
export type ShootDayInput = z.input<typeof shootDaySchema>;
/** A change names only what changes: no defaults here, or a patch would reset the fields it leaves out. */
export const shootDayPatchSchema = z.strictObject({
  day: shootDaySchema.shape.day.optional(),
  place: place.optional(),
  callTime: z
    .string()
    .regex(/^([01]\d|2[0-3]):[0-5]\d$/, "Write the call time as HH:MM, 24-hour.")
    .nullable()
    .optional(),
  crewIds: z.array(z.uuid()).max(50).optional(),
  notes: shootNotes.optional(),
});

export const shotSchema = z.strictObject({
  description: oneLine(500, { blank: "Describe the shot.", tooLong: "Keep the description under 500 characters." }),
  kind: z.enum(shotKinds, { message: "Choose the kind of shot." }),
  priority: z.enum(shotPriorities).default("normal"),
  shootDayId: z.uuid().nullable().default(null),
  /** "captured" is Kerf's to set: a shot is captured when a clip is linked to it. */
  status: z.enum(["planned", "dropped"], { message: "A shot is planned or dropped; it is captured when a clip is linked to it." }).default("planned"),
});
export type ShotInput = z.input<typeof shotSchema>;
export const shotPatchSchema = z.strictObject({
  description: shotSchema.shape.description.optional(),
  kind: shotSchema.shape.kind.optional(),
  priority: z.enum(shotPriorities).optional(),
  shootDayId: z.uuid().nullable().optional(),
  status: z.enum(["planned", "dropped"], { message: "A shot is planned or dropped; it is captured when a clip is linked to it." }).optional(),
});

const tag = oneLine(40, { blank: "A tag can't be empty.", tooLong: "Keep each tag under 40 characters." })
  .toLowerCase()
  .regex(/^[^,]+$/, "A tag can't hold a comma.");

export const updateClipSchema = z
  .strictObject({
    shootDayId: z.uuid().nullable(),
    shotId: z.uuid().nullable(),
    benchRunId: z.uuid().nullable(),
    buildIterationId: z.uuid().nullable(),
    tags: z
      .array(tag)
      .max(30, "At most 30 tags on a clip.")
      .transform((tags) => [...new Set(tags)]),
    rating: z.enum(clipRatings).nullable(),
    notes: multiLine(5000, { tooLong: "Keep notes under 5,000 characters." }),
    camera: oneLine(120),
    kind: z.enum(shotKinds).nullable(),
  })
  .partial()
  .refine((v) => Object.keys(v).length > 0, "Change at least one thing.");
export type UpdateClipInput = z.input<typeof updateClipSchema>;

/** A mark's note is one line: it becomes a comment line of the EDL. */
const markNote = oneLine(500, { tooLong: "Keep the note under 500 characters." });

/** The in/out labels are checked against the clip's own format on the server (shared/timecode). */
export const markInputSchema = z.strictObject({
  in: oneLine(40, { blank: "Enter the in point." }),
  out: oneLine(40, { blank: "Enter the out point." }),
  note: markNote.default(""),
  /** What the marked moment shows: a bench run or build iteration of the clip's episode, or none. */
  benchRunId: z.uuid({ message: "Choose a bench run." }).nullable().optional(),
  buildIterationId: z.uuid({ message: "Choose a build iteration." }).nullable().optional(),
});
export type MarkInput = z.input<typeof markInputSchema>;
export const markPatchSchema = z.strictObject({
  in: markInputSchema.shape.in.optional(),
  out: markInputSchema.shape.out.optional(),
  note: markNote.optional(),
  benchRunId: markInputSchema.shape.benchRunId,
  buildIterationId: markInputSchema.shape.buildIterationId,
});
export type MarkPatch = z.input<typeof markPatchSchema>;

export interface MarkView {
  id: string;
  in: string;
  out: string;
  inFrame: number;
  outFrame: number;
  note: string;
  benchRunId: string | null;
  buildIterationId: string | null;
}

/** A bench run or build iteration of an episode, as footage names it: its number and title. */
export interface FootageTarget {
  id: string;
  number: number;
  title: string;
}

/** A clip, or one mark of it, that shows a run or an iteration. */
export interface ShowingFootage {
  clipId: string;
  fileName: string;
  posterUrl: string | null;
  /** Null when the whole clip is linked; the mark otherwise. */
  mark: { id: string; in: string; out: string; note: string } | null;
}

/**
 * `GET /episodes/:episodeId/footage-links`: the episode's runs and iterations, each with the footage
 * that shows it, and the episode's clips (newest first) to link from a run or an iteration.
 */
export interface FootageLinks {
  runs: (FootageTarget & { footage: ShowingFootage[] })[];
  iterations: (FootageTarget & { footage: ShowingFootage[] })[];
  clips: { id: string; fileName: string; benchRunId: string | null; buildIterationId: string | null }[];
  /** True when the episode has more clips than the list holds. */
  moreClips: boolean;
}

export interface ClipView {
  id: string;
  episodeId: string;
  episodeTitle: string;
  shootDayId: string | null;
  shotId: string | null;
  shotDescription: string | null;
  benchRunId: string | null;
  buildIterationId: string | null;
  fileName: string;
  contentType: string;
  size: number;
  storageEtag: string | null;
  sha256: string | null;
  durationMs: number;
  frameRate: { numerator: number; denominator: number } | null;
  dropFrame: boolean;
  width: number | null;
  height: number | null;
  codec: string | null;
  startTimecode: string | null;
  camera: string;
  recordedAt: string;
  kind: ShotKind | null;
  rating: ClipRating | null;
  tags: string[];
  notes: string;
  markCount: number;
  /** The server's poster when it has made one, else the one the browser sent, else none. */
  posterUrl: string | null;
  uploadedBy: string | null;
  createdAt: string;
  media: ClipMediaView;
}

/** The server's work on a clip: its state, why it failed, and where the file and the browser disagree. */
export interface ClipMediaView {
  state: ClipMediaState;
  /** Plain words, when it failed. */
  failure: string | null;
  attempts: number;
  /** The file's values are the clip's; these are what the browser said instead. */
  mismatches: MediaMismatch[];
  /** A small H.264/AAC copy any browser plays: the preview link points at it when there is one. */
  hasProxy: boolean;
}

export interface ClipDetail extends ClipView {
  marks: MarkView[];
}

export interface ShootDayView {
  id: string;
  episodeId: string;
  day: string;
  place: string;
  callTime: string | null;
  notes: string;
  crew: { userId: string; name: string }[];
  shotCount: number;
  missingCount: number;
}

export interface ShotView {
  id: string;
  episodeId: string;
  shootDayId: string | null;
  description: string;
  kind: ShotKind;
  priority: ShotPriority;
  status: ShotStatus;
  clipCount: number;
  position: number;
}

export interface FootageTotals {
  clips: number;
  durationMs: number;
  bytes: number;
}

export interface FootagePage {
  clips: ClipView[];
  nextCursor: string | null;
  totals: FootageTotals;
}

export { shotStatuses };

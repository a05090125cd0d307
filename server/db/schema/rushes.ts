import { sql } from "drizzle-orm";
import { bigint, boolean, date, index, integer, jsonb, pgEnum, pgTable, primaryKey, text, timestamp, uuid } from "drizzle-orm/pg-core";
import { createdAt, id } from "./columns";
import { clipMediaStates, clipRatings, shotKinds, shotPriorities, shotStatuses, uploadStatuses } from "../../../shared/rushes/vocabulary";
import type { ClipMetadata } from "../../../shared/rushes/schemas";
import type { MediaMismatch, ProbedMedia } from "../../../shared/rushes/media-check";
import { channelRef, personRef, users } from "./accounts";
import { benchRuns, buildIterations } from "./bench";
import { episodeRef, episodes } from "./slate";

export const shotKindEnum = pgEnum("shot_kind", shotKinds);
export const shotPriorityEnum = pgEnum("shot_priority", shotPriorities);
export const shotStatusEnum = pgEnum("shot_status", shotStatuses);
export const clipRatingEnum = pgEnum("clip_rating", clipRatings);
export const uploadStatusEnum = pgEnum("upload_status", uploadStatuses);
export const clipMediaStateEnum = pgEnum("clip_media_state", clipMediaStates);

export const shootDays = pgTable(
  "shoot_days",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    day: date("day").notNull(),
    place: text("place").notNull().default(""),
    /** Local wall-clock time at the place, "HH:MM". */
    callTime: text("call_time"),
    notes: text("notes").notNull().default(""),
    createdAt: createdAt(),
  },
  (t) => [index("shoot_days_channel_episode_idx").on(t.channelId, t.episodeId, t.day)],
);

export const shootDayCrew = pgTable(
  "shoot_day_crew",
  {
    shootDayId: uuid("shoot_day_id")
      .notNull()
      .references(() => shootDays.id, { onDelete: "cascade" }),
    userId: uuid("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
  },
  (t) => [primaryKey({ columns: [t.shootDayId, t.userId] })],
);

export const shots = pgTable(
  "shots",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    shootDayId: uuid("shoot_day_id").references(() => shootDays.id, { onDelete: "set null" }),
    description: text("description").notNull(),
    kind: shotKindEnum("kind").notNull(),
    priority: shotPriorityEnum("priority").notNull().default("normal"),
    status: shotStatusEnum("status").notNull().default("planned"),
    position: integer("position").notNull().default(0),
    createdAt: createdAt(),
  },
  (t) => [index("shots_channel_episode_idx").on(t.channelId, t.episodeId, t.position), index("shots_shoot_day_idx").on(t.shootDayId)],
);

/** One presigned multipart upload, from its start to completion, cancellation, abandonment or refusal. */
export const uploads = pgTable(
  "uploads",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    createdBy: personRef("created_by"),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    partSize: integer("part_size").notNull(),
    partCount: integer("part_count").notNull(),
    /** channel/episode/uuid, made by the server; never from the file name. */
    objectKey: text("object_key").notNull().unique(),
    storageUploadId: text("storage_upload_id").notNull(),
    status: uploadStatusEnum("status").notNull().default("uploading"),
    /** What the browser read from the file before upload (mediainfo.js), kept until completion. */
    metadata: jsonb("metadata").$type<ClipMetadata>(),
    /** The browser's own fingerprint of the file (name, size, modified time) to find it again after a reload. */
    fingerprint: text("fingerprint").notNull().default(""),
    clipId: uuid("clip_id"),
    createdAt: createdAt(),
    lastActivityAt: timestamp("last_activity_at", { withTimezone: true }).notNull().defaultNow(),
    finishedAt: timestamp("finished_at", { withTimezone: true }),
  },
  (t) => [
    index("uploads_channel_episode_status_idx").on(t.channelId, t.episodeId, t.status),
    // The sweep for abandoned uploads reads every channel's open ones; a channel's list reads only its own.
    index("uploads_open_activity_idx").on(t.lastActivityAt).where(sql`${t.status} = 'uploading'`),
    index("uploads_channel_open_idx").on(t.channelId, t.createdAt).where(sql`${t.status} = 'uploading'`),
  ],
);

/** Each part as the browser reports it stored: the stand-in cannot list parts, so Kerf keeps them. */
export const uploadParts = pgTable(
  "upload_parts",
  {
    uploadId: uuid("upload_id")
      .notNull()
      .references(() => uploads.id, { onDelete: "cascade" }),
    partNumber: integer("part_number").notNull(),
    etag: text("etag").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    recordedAt: createdAt(),
  },
  (t) => [primaryKey({ columns: [t.uploadId, t.partNumber] })],
);

/** A clip exists only for an object storage confirmed complete. */
export const clips = pgTable(
  "clips",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    shootDayId: uuid("shoot_day_id").references(() => shootDays.id, { onDelete: "set null" }),
    shotId: uuid("shot_id").references(() => shots.id, { onDelete: "set null" }),
    // The bench run or build iteration the clip shows: of the clip's own episode (the service checks).
    benchRunId: uuid("bench_run_id").references(() => benchRuns.id, { onDelete: "set null" }),
    buildIterationId: uuid("build_iteration_id").references(() => buildIterations.id, { onDelete: "set null" }),
    uploadedBy: personRef("uploaded_by"),
    objectKey: text("object_key").notNull().unique(),
    posterKey: text("poster_key"),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    /** The store's ETag of the whole object (for a multipart object: MD5 of the parts' MD5s, "-N"). */
    storageEtag: text("storage_etag"),
    /** SHA-256 of the file, when the browser computed it. */
    sha256: text("sha256"),
    durationMs: integer("duration_ms").notNull().default(0),
    frameRateNumerator: integer("frame_rate_numerator"),
    frameRateDenominator: integer("frame_rate_denominator"),
    dropFrame: boolean("drop_frame").notNull().default(false),
    width: integer("width"),
    height: integer("height"),
    codec: text("codec"),
    startTimecode: text("start_timecode"),
    camera: text("camera").notNull().default(""),
    /** When the camera says it recorded the clip; the upload time when it does not say. */
    recordedAt: timestamp("recorded_at", { withTimezone: true }).notNull(),
    kind: shotKindEnum("kind"),
    rating: clipRatingEnum("rating"),
    tags: text("tags").array().notNull().default(sql`'{}'::text[]`),
    notes: text("notes").notNull().default(""),
    markCount: integer("mark_count").notNull().default(0),
    /**
     * The server's poster, proxy and probe (server/rushes/media.service.ts). A clip completed from an
     * upload starts "waiting" with its job queued; rows made any other way have nothing to wait for.
     */
    mediaState: clipMediaStateEnum("media_state").notNull().default("ready"),
    mediaFailure: text("media_failure"),
    mediaAttempts: integer("media_attempts").notNull().default(0),
    serverPosterKey: text("server_poster_key"),
    proxyKey: text("proxy_key"),
    probed: jsonb("probed").$type<ProbedMedia>(),
    mediaMismatches: jsonb("media_mismatches").$type<MediaMismatch[]>().notNull().default([]),
    createdAt: createdAt(),
  },
  (t) => [
    index("clips_channel_episode_recorded_idx").on(t.channelId, t.episodeId, t.recordedAt, t.id),
    // "Is this file already in the channel?" asked before each upload.
    index("clips_channel_sha256_idx").on(t.channelId, t.sha256).where(sql`${t.sha256} is not null`),
    index("clips_channel_recorded_idx").on(t.channelId, t.recordedAt, t.id),
    index("clips_channel_rating_idx").on(t.channelId, t.rating, t.recordedAt, t.id),
    index("clips_shot_idx").on(t.shotId),
    index("clips_shoot_day_idx").on(t.shootDayId),
    index("clips_tags_idx").using("gin", t.tags),
  ],
);

export const clipMarks = pgTable(
  "clip_marks",
  {
    id: id(),
    channelId: channelRef(),
    clipId: uuid("clip_id")
      .notNull()
      .references(() => clips.id, { onDelete: "cascade" }),
    /** Frames from 0 at the clip's own rate, in its timecode's count (labels as typed are kept too). */
    inFrame: integer("in_frame").notNull(),
    outFrame: integer("out_frame").notNull(),
    inLabel: text("in_label").notNull(),
    outLabel: text("out_label").notNull(),
    note: text("note").notNull().default(""),
    // What the marked moment shows: a bench run or build iteration of the clip's own episode (the service checks).
    benchRunId: uuid("bench_run_id").references(() => benchRuns.id, { onDelete: "set null" }),
    buildIterationId: uuid("build_iteration_id").references(() => buildIterations.id, { onDelete: "set null" }),
    createdBy: personRef("created_by"),
    createdAt: createdAt(),
  },
  (t) => [index("clip_marks_clip_idx").on(t.clipId, t.inFrame)],
);

/** Small files that stream through the server (photos for the build log, a part's photo). */
export const stills = pgTable(
  "stills",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: uuid("episode_id").references(() => episodes.id, { onDelete: "cascade" }),
    objectKey: text("object_key").notNull().unique(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    uploadedBy: personRef("uploaded_by"),
    createdAt: createdAt(),
  },
  (t) => [index("stills_channel_idx").on(t.channelId, t.createdAt)],
);

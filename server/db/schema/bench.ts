import { sql } from "drizzle-orm";
import { bigint, boolean, index, integer, jsonb, numeric, pgEnum, pgTable, primaryKey, text, timestamp, unique, uniqueIndex, uuid } from "drizzle-orm/pg-core";
import { id, timestamps, version } from "./columns";
import type { Criterion } from "../../../shared/bench/criteria";
import type { Quantity } from "../../../shared/bench/quantity";
import { iterationOutcomes, partKinds, type PlannedQuantity, type RunInput, type Supply } from "../../../shared/bench/schemas";
import { channelRef, personRef } from "./accounts";
import { episodeRef, episodes } from "./slate";

// Quantities are stored as the person entered them ({value, unit} as jsonb), never pre-converted:
// the figures are derived on read, so "2.4 oz" stays 2.4 oz and every conversion is tested code.

export const partKindEnum = pgEnum("part_kind", partKinds);
export const iterationOutcomeEnum = pgEnum("build_outcome", iterationOutcomes);

/** One sheet per episode; absent until first saved (the API answers an empty sheet). */
export const testPlans = pgTable("test_plans", {
  episodeId: uuid("episode_id")
    .primaryKey()
    .references(() => episodes.id, { onDelete: "cascade" }),
  channelId: channelRef(),
  hypothesis: text("hypothesis").notNull().default(""),
  method: text("method").notNull().default(""),
  quantities: jsonb("quantities").$type<PlannedQuantity[]>().notNull().default([]),
  airframeMass: jsonb("airframe_mass").$type<Quantity>(),
  updatedBy: personRef("updated_by"),
  version: version(),
  ...timestamps(),
});

export const testCriteria = pgTable(
  "test_criteria",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    position: integer("position").notNull(),
    definition: jsonb("definition").$type<Criterion>().notNull(),
    version: version(),
    ...timestamps(),
  },
  (table) => [index("test_criteria_episode_idx").on(table.channelId, table.episodeId, table.position)],
);

export const safetyHazards = pgTable(
  "safety_hazards",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    kind: text("kind").notNull(),
    title: text("title"),
    mitigation: text("mitigation").notNull(),
    checkedBy: personRef("checked_by"),
    checkedAt: timestamp("checked_at", { withTimezone: true }),
    ...timestamps(),
  },
  (table) => [
    index("safety_hazards_episode_idx").on(table.channelId, table.episodeId),
    // A listed hazard once per episode; custom ones are told apart by their titles.
    uniqueIndex("safety_hazards_kind_once").on(table.channelId, table.episodeId, table.kind).where(sql`${table.kind} <> 'custom'`),
  ],
);

export const benchParts = pgTable(
  "bench_parts",
  {
    id: id(),
    channelId: channelRef(),
    name: text("name").notNull(),
    kind: partKindEnum("kind").notNull(),
    // False for a part that takes no power (a frame, a passive fan); parts from before the choice need power.
    powered: boolean("powered").notNull().default(true),
    mass: jsonb("mass").$type<Quantity>(),
    ratedVoltage: jsonb("rated_voltage").$type<Quantity>(),
    ratedCurrent: jsonb("rated_current").$type<Quantity>(),
    priceAmount: numeric("price_amount", { precision: 10, scale: 2 }),
    priceCurrency: text("price_currency"),
    supplier: text("supplier").notNull().default(""),
    notes: text("notes").notNull().default(""),
    version: version(),
    ...timestamps(),
  },
  (table) => [index("bench_parts_channel_idx").on(table.channelId, table.name)],
);

export const benchRuns = pgTable(
  "bench_runs",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    // Numbered per episode and never reused, so "run 3" in a video note keeps meaning run 3.
    number: integer("number").notNull(),
    label: text("label").notNull(),
    supply: jsonb("supply").$type<Supply>(),
    measurements: jsonb("measurements").$type<RunInput["measurements"]>().notNull().default({}),
    notes: text("notes").notNull().default(""),
    createdBy: personRef("created_by"),
    version: version(),
    ...timestamps(),
  },
  (table) => [unique("bench_runs_episode_number_key").on(table.episodeId, table.number), index("bench_runs_channel_episode_idx").on(table.channelId, table.episodeId)],
);

export const benchRunParts = pgTable(
  "bench_run_parts",
  {
    runId: uuid("run_id")
      .notNull()
      .references(() => benchRuns.id, { onDelete: "cascade" }),
    // Restrict: a part that was measured keeps its runs; the API says so before the database has to.
    partId: uuid("part_id")
      .notNull()
      .references(() => benchParts.id, { onDelete: "restrict" }),
    channelId: channelRef(),
    count: integer("count").notNull(),
    position: integer("position").notNull(),
  },
  (table) => [primaryKey({ columns: [table.runId, table.partId] }), index("bench_run_parts_part_idx").on(table.channelId, table.partId)],
);

export const buildIterations = pgTable(
  "build_iterations",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    number: integer("number").notNull(),
    change: text("change").notNull(),
    allUpMass: jsonb("all_up_mass").$type<Quantity>(),
    outcome: iterationOutcomeEnum("outcome").notNull().default("pending"),
    chosenRunId: uuid("chosen_run_id").references(() => benchRuns.id, { onDelete: "set null" }),
    notes: text("notes").notNull().default(""),
    createdBy: personRef("created_by"),
    version: version(),
    ...timestamps(),
  },
  (table) => [unique("build_iterations_episode_number_key").on(table.episodeId, table.number), index("build_iterations_channel_episode_idx").on(table.channelId, table.episodeId)],
);

/** Photos of a build iteration, streamed into storage like shoot-day stills; they go with their iteration. */
export const buildPhotos = pgTable(
  "build_photos",
  {
    id: id(),
    channelId: channelRef(),
    episodeId: episodeRef(),
    iterationId: uuid("iteration_id")
      .notNull()
      .references(() => buildIterations.id, { onDelete: "cascade" }),
    objectKey: text("object_key").notNull().unique(),
    fileName: text("file_name").notNull(),
    contentType: text("content_type").notNull(),
    sizeBytes: bigint("size_bytes", { mode: "number" }).notNull(),
    uploadedBy: personRef("uploaded_by"),
    ...timestamps(),
  },
  (table) => [index("build_photos_iteration_idx").on(table.channelId, table.iterationId, table.createdAt)],
);

export const resultsCardStates = ["queued", "drawing", "ready", "failed"] as const;

/**
 * The episode's results card, one per episode, drawn again on each request by a job. The picture
 * and its SVG are also the episode's stills (rushes' `stills` table), so the editor finds them with
 * the footage; the ids here point at those rows.
 */
export const resultsCards = pgTable("bench_results_cards", {
  episodeId: uuid("episode_id")
    .primaryKey()
    .references(() => episodes.id, { onDelete: "cascade" }),
  channelId: channelRef(),
  state: text("state", { enum: resultsCardStates }).notNull(),
  failure: text("failure"),
  pngStillId: uuid("png_still_id"),
  svgStillId: uuid("svg_still_id"),
  requestedBy: personRef("requested_by"),
  ...timestamps(),
});

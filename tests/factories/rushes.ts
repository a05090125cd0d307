import { randomUUID } from "node:crypto";
import type { Database } from "../../server/db/client";
import { clips, shootDays, shots } from "../../server/db/schema/rushes";

type ClipOverrides = Partial<typeof clips.$inferInsert>;

/** A clip row with metadata only (no stored object): for lists, filters, exports and the demo. */
export function clipValues(channelId: string, episodeId: string, overrides: ClipOverrides = {}): typeof clips.$inferInsert {
  return {
    channelId,
    episodeId,
    objectKey: `${channelId}/${episodeId}/${randomUUID()}`,
    fileName: `A001_C${Math.floor(Math.random() * 900 + 100)}.mov`,
    contentType: "video/quicktime",
    sizeBytes: 250_000_000,
    durationMs: 12_012,
    frameRateNumerator: 30000,
    frameRateDenominator: 1001,
    dropFrame: true,
    width: 3840,
    height: 2160,
    codec: "HEVC",
    startTimecode: "01:00:00;00",
    camera: "A cam",
    recordedAt: new Date(),
    ...overrides,
  };
}

export async function createClip(db: Database, channelId: string, episodeId: string, overrides: ClipOverrides = {}) {
  const [row] = await db.insert(clips).values(clipValues(channelId, episodeId, overrides)).returning();
  return row!;
}

export async function createShootDay(db: Database, channelId: string, episodeId: string, overrides: Partial<typeof shootDays.$inferInsert> = {}) {
  const [row] = await db
    .insert(shootDays)
    .values({ channelId, episodeId, day: "2026-12-05", place: "Workshop", callTime: "08:30", ...overrides })
    .returning();
  return row!;
}

export async function createShot(db: Database, channelId: string, episodeId: string, overrides: Partial<typeof shots.$inferInsert> = {}) {
  const [row] = await db
    .insert(shots)
    .values({ channelId, episodeId, description: "Wide of the launch rail", kind: "test_run", ...overrides })
    .returning();
  return row!;
}

import { randomUUID } from "node:crypto";
import { expect } from "vitest";
import { clipMarks, stills, uploadParts, uploads } from "../../../server/db/schema/rushes";
import { createClip, createShootDay, createShot } from "../../factories/rushes";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * The spec's role table, by hand:
 * - footage (upload, log, marks, export): owner, producer, editor W; crew W for upload and log,
 *   but no delete (the role table's "footageRemoval" area: deleting a clip; of the marks only their
 *   own, and the matrix's mark is someone else's);
 * - shoot days and the shot list: all four W.
 * "outsider" is the owner of another channel: 404, never 403.
 * The two photo routes take multipart forms; the matrix sends none, so a caller let through meets
 * the form's own 400 ("choose a photo"), and the zip without ids its 400 ("choose at least one clip").
 */
const C = "/api/channels/:channelId";
const up = `${C}/uploads/:uploadId`;
const clip = `${C}/clips/:clipId`;

export const access: FeatureAccess = {
  rows: [
    // route                                         visitor owner producer editor crew outsider
    [`POST ${C}/uploads`,                              401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/uploads`,                               401,  ok,   ok,   ok,   ok,   404],
    [`GET ${up}`,                                      401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/footage-checksums/:sha256`,             401,  ok,   ok,   ok,   ok,   404],
    [`POST ${up}/part-urls`,                           401,  ok,   ok,   ok,   ok,   404],
    [`POST ${up}/parts`,                               401,  ok,   ok,   ok,   ok,   404],
    [`POST ${up}/complete`,                            401,  ok,   ok,   ok,   ok,   404],
    [`DELETE ${up}`,                                   401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/clips`,                                 401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/exports/footage.csv`,                   401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/exports/footage.edl`,                   401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/exports/footage.otio`,                  401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/exports/edl-rates`,                     401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/exports/footage.zip`,                   401,  ok,   ok,   ok,   ok,   404],
    [`GET ${clip}`,                                    401,  ok,   ok,   ok,   ok,   404],
    [`PATCH ${clip}`,                                  401,  ok,   ok,   ok,   ok,   404],
    [`DELETE ${clip}`,                                 401,  ok,   ok,   ok,   403,  404],
    [`GET ${clip}/preview`,                            401,  ok,   ok,   ok,   ok,   404],
    [`POST ${clip}/poster`,                            401,  ok,   ok,   ok,   ok,   404],
    [`POST ${clip}/media/retry`,                       401,  ok,   ok,   ok,   ok,   404],
    [`POST ${clip}/marks`,                             401,  ok,   ok,   ok,   ok,   404],
    [`PATCH ${clip}/marks/:markId`,                    401,  ok,   ok,   ok,   ok,   404],
    [`DELETE ${clip}/marks/:markId`,                   401,  ok,   ok,   ok,   403,  404],
    [`POST ${C}/stills`,                               401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/stills/:stillId`,                       401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/episodes/:episodeId/shoot-days`,        401,  ok,   ok,   ok,   ok,   404],
    [`POST ${C}/episodes/:episodeId/shoot-days`,       401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/shoot-crew`,                            401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/shoot-days/:shootDayId`,                401,  ok,   ok,   ok,   ok,   404],
    [`PATCH ${C}/shoot-days/:shootDayId`,              401,  ok,   ok,   ok,   ok,   404],
    [`DELETE ${C}/shoot-days/:shootDayId`,             401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/episodes/:episodeId/shots`,             401,  ok,   ok,   ok,   ok,   404],
    [`POST ${C}/episodes/:episodeId/shots`,            401,  ok,   ok,   ok,   ok,   404],
    [`PATCH ${C}/shots/:shotId`,                       401,  ok,   ok,   ok,   ok,   404],
    [`DELETE ${C}/shots/:shotId`,                      401,  ok,   ok,   ok,   ok,   404],
    [`GET ${C}/episodes/:episodeId/footage-links`,     401,  ok,   ok,   ok,   ok,   404],
  ],
  recipes: rushesRecipes,
};

function rushesRecipes({ app, world }: AccessContext): Record<string, Recipe> {
  const channelId = world.channel.id;
  const episodeId = world.episode.id;
  const rows = async (sql: string, params: unknown[]) => (await app.database.pool.query(sql, params)).rows;
  const one = async (sql: string, params: unknown[]) => (await rows(sql, params))[0];

  /** An open upload row of 100 bytes (one part); `stored` also puts that part in storage and records it. */
  async function openUpload(createdBy: string, stored = false) {
    const objectKey = `${channelId}/${episodeId}/${randomUUID()}`;
    const storageUploadId = stored ? await app.deps.storage.createMultipart(objectKey, "video/quicktime") : `matrix-${randomUUID()}`;
    const [row] = await app.db
      .insert(uploads)
      .values({ channelId, episodeId, createdBy, fileName: "matrix.mov", contentType: "video/quicktime", sizeBytes: 100, partSize: 8 * 1024 * 1024, partCount: 1, objectKey, storageUploadId })
      .returning();
    if (stored) {
      const put = await fetch(await app.deps.storage.presignPart(objectKey, storageUploadId, 1, 100, 60), { method: "PUT", body: Buffer.alloc(100, 3) });
      await app.db.insert(uploadParts).values({ uploadId: row!.id, partNumber: 1, etag: put.headers.get("etag")!.replaceAll('"', ""), sizeBytes: 100 });
    }
    return row!;
  }
  const uploadIntact = (id: string) => async () => {
    expect(await one("select status, clip_id from uploads where id = $1", [id])).toEqual({ status: "uploading", clip_id: null });
    expect(await rows("select 1 from upload_parts where upload_id = $1 and etag = 'matrix-etag'", [id])).toEqual([]);
  };
  const freshClip = () => createClip(app.db, channelId, episodeId, { fileName: "matrix.mov", durationMs: 60_000 });
  const freshMark = async () => {
    const c = await freshClip();
    const [m] = await app.db.insert(clipMarks).values({ channelId, clipId: c.id, inFrame: 107_922, outFrame: 107_952, inLabel: "01:00:01;00", outLabel: "01:00:02;00", note: "kept", createdBy: world.people.editor.id }).returning();
    return { clipId: c.id, markId: m!.id };
  };

  return {
    [`POST ${C}/uploads`]: {
      ok: 201,
      prepare: async () => {
        const fileName = `matrix-${randomUUID().slice(0, 8)}.mov`;
        return {
          body: { episodeId, fileName, size: 100 },
          intact: async () => expect(await rows("select 1 from uploads where file_name = $1", [fileName])).toEqual([]),
        };
      },
    },
    [`GET ${C}/uploads`]: { ok: 200 },
    [`GET ${up}`]: { ok: 200, prepare: async () => ({ params: { uploadId: (await openUpload(world.owner.id)).id } }) },
    [`POST ${up}/part-urls`]: {
      ok: 200,
      prepare: async () => {
        const u = await openUpload(world.owner.id);
        return { params: { uploadId: u.id }, body: { parts: [{ partNumber: 1, size: 100 }] }, intact: uploadIntact(u.id) };
      },
    },
    [`POST ${up}/parts`]: {
      ok: 200,
      prepare: async () => {
        const u = await openUpload(world.owner.id);
        return { params: { uploadId: u.id }, body: { parts: [{ partNumber: 1, etag: "matrix-etag", size: 100 }] }, intact: uploadIntact(u.id) };
      },
    },
    [`POST ${up}/complete`]: {
      ok: 201,
      prepare: async () => {
        const u = await openUpload(world.owner.id, true);
        return { params: { uploadId: u.id }, body: {}, intact: uploadIntact(u.id) };
      },
    },
    [`DELETE ${up}`]: {
      ok: 200,
      // Each caller cancels an upload of their own (crew may cancel only their own).
      prepare: async ({ person }) => {
        const u = await openUpload(person?.id ?? world.owner.id);
        return { params: { uploadId: u.id }, intact: uploadIntact(u.id) };
      },
    },
    [`GET ${C}/clips`]: { ok: 200 },
    [`GET ${C}/footage-checksums/:sha256`]: { ok: 200, prepare: async () => ({ params: { sha256: "0".repeat(64) } }) },
    [`GET ${C}/exports/footage.csv`]: { ok: 200 },
    [`GET ${C}/exports/footage.edl`]: { ok: 200, prepare: async () => (await freshClip(), {}) },
    [`GET ${C}/exports/footage.otio`]: { ok: 200 },
    [`GET ${C}/exports/edl-rates`]: { ok: 200 },
    [`GET ${C}/exports/footage.zip`]: { ok: 400 },
    [`GET ${clip}`]: { ok: 200, prepare: async () => ({ params: { clipId: (await freshClip()).id } }) },
    [`PATCH ${clip}`]: {
      ok: 200,
      prepare: async () => {
        const c = await freshClip();
        return { params: { clipId: c.id }, body: { rating: "select" }, intact: async () => expect(await one("select rating from clips where id = $1", [c.id])).toEqual({ rating: null }) };
      },
    },
    [`DELETE ${clip}`]: {
      ok: 204,
      prepare: async () => {
        const c = await freshClip();
        return { params: { clipId: c.id }, intact: async () => expect(await rows("select 1 from clips where id = $1", [c.id])).toHaveLength(1) };
      },
    },
    [`GET ${clip}/preview`]: { ok: 200, prepare: async () => ({ params: { clipId: (await freshClip()).id } }) },
    [`POST ${clip}/poster`]: {
      ok: 400,
      prepare: async () => {
        const c = await freshClip();
        return { params: { clipId: c.id }, intact: async () => expect(await one("select poster_key from clips where id = $1", [c.id])).toEqual({ poster_key: null }) };
      },
    },
    [`POST ${clip}/media/retry`]: {
      ok: 202,
      // A clip whose server media failed; a refused caller leaves it failed with no job queued.
      prepare: async () => {
        const c = await createClip(app.db, channelId, episodeId, { fileName: "matrix.mov", mediaState: "failed", mediaFailure: "matrix" });
        return {
          params: { clipId: c.id },
          intact: async () => {
            expect(await one("select media_state from clips where id = $1", [c.id])).toEqual({ media_state: "failed" });
            expect(await rows("select 1 from pgboss.job where data->>'clipId' = $1", [c.id])).toEqual([]);
          },
        };
      },
    },
    [`POST ${clip}/marks`]: {
      ok: 201,
      prepare: async () => {
        const c = await freshClip();
        return { params: { clipId: c.id }, body: { in: "01:00:01;00", out: "01:00:02;00", note: "" }, intact: async () => expect(await rows("select 1 from clip_marks where clip_id = $1", [c.id])).toEqual([]) };
      },
    },
    [`PATCH ${clip}/marks/:markId`]: {
      ok: 200,
      prepare: async () => {
        const m = await freshMark();
        return { params: m, body: { note: "changed" }, intact: async () => expect(await one("select note from clip_marks where id = $1", [m.markId])).toEqual({ note: "kept" }) };
      },
    },
    [`DELETE ${clip}/marks/:markId`]: {
      ok: 204,
      prepare: async () => {
        const m = await freshMark();
        return { params: m, intact: async () => expect(await rows("select 1 from clip_marks where id = $1", [m.markId])).toHaveLength(1) };
      },
    },
    [`POST ${C}/stills`]: { ok: 400 },
    [`GET ${C}/stills/:stillId`]: {
      ok: 200,
      prepare: async () => {
        const [s] = await app.db
          .insert(stills)
          .values({ channelId, objectKey: `${channelId}/stills/${randomUUID()}`, fileName: "m.jpg", contentType: "image/jpeg", sizeBytes: 4 })
          .returning();
        return { params: { stillId: s!.id } };
      },
    },
    [`GET ${C}/episodes/:episodeId/shoot-days`]: { ok: 200, prepare: async () => ({ params: { episodeId } }) },
    [`POST ${C}/episodes/:episodeId/shoot-days`]: {
      ok: 201,
      prepare: async () => {
        const place = `Matrix ${randomUUID().slice(0, 8)}`;
        return { params: { episodeId }, body: { day: "2026-12-10", place }, intact: async () => expect(await rows("select 1 from shoot_days where place = $1", [place])).toEqual([]) };
      },
    },
    [`GET ${C}/shoot-crew`]: { ok: 200 },
    [`GET ${C}/shoot-days/:shootDayId`]: { ok: 200, prepare: async () => ({ params: { shootDayId: (await createShootDay(app.db, channelId, episodeId)).id } }) },
    [`PATCH ${C}/shoot-days/:shootDayId`]: {
      ok: 200,
      prepare: async () => {
        const d = await createShootDay(app.db, channelId, episodeId, { place: "Barn" });
        return { params: { shootDayId: d.id }, body: { place: "Field" }, intact: async () => expect(await one("select place from shoot_days where id = $1", [d.id])).toEqual({ place: "Barn" }) };
      },
    },
    [`DELETE ${C}/shoot-days/:shootDayId`]: {
      ok: 204,
      prepare: async () => {
        const d = await createShootDay(app.db, channelId, episodeId);
        return { params: { shootDayId: d.id }, intact: async () => expect(await rows("select 1 from shoot_days where id = $1", [d.id])).toHaveLength(1) };
      },
    },
    [`GET ${C}/episodes/:episodeId/shots`]: { ok: 200, prepare: async () => ({ params: { episodeId } }) },
    [`GET ${C}/episodes/:episodeId/footage-links`]: { ok: 200, prepare: async () => ({ params: { episodeId } }) },
    [`POST ${C}/episodes/:episodeId/shots`]: {
      ok: 201,
      prepare: async () => {
        const description = `Matrix shot ${randomUUID().slice(0, 8)}`;
        return {
          params: { episodeId },
          body: { description, kind: "insert" },
          intact: async () => expect(await rows("select 1 from shots where description = $1", [description])).toEqual([]),
        };
      },
    },
    [`PATCH ${C}/shots/:shotId`]: {
      ok: 200,
      prepare: async () => {
        const s = await createShot(app.db, channelId, episodeId);
        return { params: { shotId: s.id }, body: { status: "dropped" }, intact: async () => expect(await one("select status from shots where id = $1", [s.id])).toEqual({ status: "planned" }) };
      },
    },
    [`DELETE ${C}/shots/:shotId`]: {
      ok: 204,
      prepare: async () => {
        const s = await createShot(app.db, channelId, episodeId);
        return { params: { shotId: s.id }, intact: async () => expect(await rows("select 1 from shots where id = $1", [s.id])).toHaveLength(1) };
      },
    },
  };
}

import { describe, expect, it } from "vitest";
import { MiB } from "../../shared/rushes/limits";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { patternBytes, rushesSuite, uploadFile } from "./rushes-helpers";

/*
 * The browser tells Kerf which parts reached storage a few at a time (POST …/parts): one request and
 * one statement for the batch, all or nothing, and resuming reads what was recorded.
 */
const suite = rushesSuite();
const app = () => suite.app;
const world = () => suite.world;

const recordedParts = async (uploadId: string) =>
  (await app().database.pool.query("select part_number, etag, size_bytes::int as size from upload_parts where upload_id = $1 order by part_number", [uploadId])).rows;

/** An open upload of 20 MiB: parts of 8, 8 and 4 MiB. */
async function openUpload(fileName: string) {
  const started = await world().as.editor.send("post", `${world().base}/uploads`, { episodeId: world().episode.id, fileName, size: 20 * MiB }).expect(201);
  return started.body.upload as { id: string };
}
const record = (uploadId: string, parts: unknown) => world().as.editor.send("post", `${world().base}/uploads/${uploadId}/parts`, { parts });

describe("recording stored parts in batches", () => {
  it("when three parts are reported in one request, then all three are recorded, and the open upload lists them for resuming", async () => {
    const upload = await openUpload("batch.mov");
    const parts = [
      { partNumber: 3, etag: '"etag-three"', size: 4 * MiB },
      { partNumber: 1, etag: "etag-one", size: 8 * MiB },
      { partNumber: 2, etag: "etag-two", size: 8 * MiB },
    ];
    const answer = await record(upload.id, parts).expect(200);
    expect(answer.body.parts.map((p: { partNumber: number; etag: string }) => [p.partNumber, p.etag])).toEqual([[3, "etag-three"], [1, "etag-one"], [2, "etag-two"]]);
    expect(await recordedParts(upload.id)).toEqual([
      { part_number: 1, etag: "etag-one", size: 8 * MiB },
      { part_number: 2, etag: "etag-two", size: 8 * MiB },
      { part_number: 3, etag: "etag-three", size: 4 * MiB },
    ]);
    const resumed = await world().as.editor.get(`${world().base}/uploads/${upload.id}`).expect(200);
    expect(resumed.body.upload.parts.map((p: { partNumber: number }) => p.partNumber)).toEqual([1, 2, 3]);
  });

  it("when a part is reported again (sent again after a failure), then its newer record replaces the first", async () => {
    const upload = await openUpload("again.mov");
    await record(upload.id, [{ partNumber: 2, etag: "first", size: 8 * MiB }]).expect(200);
    await record(upload.id, [{ partNumber: 2, etag: "second", size: 8 * MiB }, { partNumber: 3, etag: "third", size: 4 * MiB }]).expect(200);
    expect(await recordedParts(upload.id)).toEqual([
      { part_number: 2, etag: "second", size: 8 * MiB },
      { part_number: 3, etag: "third", size: 4 * MiB },
    ]);
  });

  it("when a batch is malformed or names a part the file doesn't have, then it answers 400 and records none of the batch", async () => {
    const upload = await openUpload("refused.mov");
    await record(upload.id, [{ partNumber: 1, etag: "kept", size: 8 * MiB }]).expect(200);
    const good = { partNumber: 2, etag: "good", size: 8 * MiB };
    const cases: [unknown, string, string][] = [
      [[], "parts", "Record at least one part."],
      [Array.from({ length: 101 }, (_, i) => ({ partNumber: i + 1, etag: "e", size: 1 })), "parts", "Record at most 100 parts at once."],
      [[good, { partNumber: 2, etag: "twice", size: 8 * MiB }], "parts.1.partNumber", "Part 2 is listed twice."],
      [[good, { partNumber: 3, etag: "", size: 4 * MiB }], "parts.1.etag", "The part's ETag is missing."],
      [[good, { partNumber: 3, etag: "e" }], "parts.1.size", "Give each part's size in bytes."],
      [[good, { partNumber: 0, etag: "e", size: 1 }], "parts.1.partNumber", ""],
      [[good, { partNumber: 3, etag: "e", size: 4 * MiB, extra: true }], "parts.1", ""],
      [[good, { partNumber: 4, etag: "e", size: 1 }], "partNumber", "Part 4 is not one of this file's 3 parts."],
      [[good, { partNumber: 3, etag: "e", size: 4 * MiB + 1 }], "size", "Part 3 should be 4194304 bytes."],
    ];
    for (const [parts, field, message] of cases) {
      const answer = await record(upload.id, parts).expect(400);
      expect(answer.body.error.code).toBe("validation_failed");
      if (message) expect(answer.body.error.fields[field]).toBe(message);
      else expect(Object.keys(answer.body.error.fields).some((key) => key.startsWith(field))).toBe(true);
    }
    const notJson = await world().as.editor.send("post", `${world().base}/uploads/${upload.id}/parts`, { parts: "1,2" }).expect(400);
    expect(notJson.body.error.code).toBe("validation_failed");
    expect(await recordedParts(upload.id)).toEqual([{ part_number: 1, etag: "kept", size: 8 * MiB }]);
  });

  it("when the upload is another channel's, then it answers 404 and that upload's parts stay as they were", async () => {
    const other = await createCrewedChannel(app().db, "Other Rushes Channel");
    const theirEpisode = await createEpisode(app().db, other.channel.id, { title: "Their rocket", stage: "shoot" });
    const them = await app().signedIn(other.editor);
    const theirBase = `/api/channels/${other.channel.id}`;
    const theirs = (await them.send("post", `${theirBase}/uploads`, { episodeId: theirEpisode.id, fileName: "theirs.mov", size: 20 * MiB }).expect(201)).body.upload;
    await them.send("post", `${theirBase}/uploads/${theirs.id}/parts`, { parts: [{ partNumber: 1, etag: "theirs", size: 8 * MiB }] }).expect(200);

    // Their upload's id under this channel's address, and under theirs by a non-member.
    const viaMine = await record(theirs.id, [{ partNumber: 1, etag: "mine", size: 8 * MiB }]).expect(404);
    expect(viaMine.body.error.message).toMatch(/not found/i);
    await world().as.editor.send("post", `${theirBase}/uploads/${theirs.id}/parts`, { parts: [{ partNumber: 2, etag: "mine", size: 8 * MiB }] }).expect(404);
    expect(await recordedParts(theirs.id)).toEqual([{ part_number: 1, etag: "theirs", size: 8 * MiB }]);
  });

  it("when the upload is complete, then a late record is refused with 409 and the clip's parts stay as joined", async () => {
    const response = await uploadFile(world().as.editor, world().base, world().episode.id, "late.mov", patternBytes(8 * MiB + 10));
    expect(response.status).toBe(201);
    const [{ id }] = (await app().database.pool.query("select id from uploads where clip_id = $1", [response.body.clip.id])).rows;
    const before = await recordedParts(id);
    const late = await world().as.editor.send("post", `${world().base}/uploads/${id}/parts`, { parts: [{ partNumber: 2, etag: "late", size: 10 }] }).expect(409);
    expect(late.body.error.message).toBe("This upload is already complete.");
    expect(await recordedParts(id)).toEqual(before);
  });
});

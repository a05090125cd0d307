import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parse as parseCsv } from "csv-parse/sync";
import { eq } from "drizzle-orm";
import { strFromU8, unzipSync } from "fflate";
import type { Response } from "superagent";
import { parseEdl } from "../../shared/rushes/exports/edl-parse";
import { formatOfEdlRate } from "../../shared/rushes/exports/edl-rates";
import { clipMarks, clips } from "../../server/db/schema/rushes";
import { createCrewedChannel } from "../factories/accounts";
import { createIteration, createRun } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { clipValues, createClip, createShootDay, createShot } from "../factories/rushes";
import { readLikeOtio } from "../support/cmx3600-otio-rules";
import { startTestApp, type TestApp } from "../support/test-app";
import { patternBytes, rushesWorld, sampleMetadata, uploadFile } from "./rushes-helpers";

let app: TestApp;
let world: Awaited<ReturnType<typeof rushesWorld>>;
beforeAll(async () => {
  app = await startTestApp();
  world = await rushesWorld(app);
});
afterAll(() => app.close());

/** A binary body (a zip) as bytes. */
const binary = (res: Response, done: (error: Error | null, body: Buffer) => void) => {
  const chunks: Buffer[] = [];
  res.on("data", (c: Buffer) => chunks.push(c));
  res.on("end", () => done(null, Buffer.concat(chunks)));
};
const unzip = (body: Buffer) => unzipSync(new Uint8Array(body));

describe("shoot days and the shot list", () => {
  it("when crew plan a day with shots, then the day's view lists the shots still missing until a clip is linked", async () => {
    const { crew } = world.as;
    const day = await crew
      .send("post", `${world.base}/episodes/${world.episode.id}/shoot-days`, { day: "2026-12-07", place: "Quarry car park", callTime: "07:45", crewIds: [world.crew.id, world.editor.id] })
      .expect(201);
    expect(day.body.shootDay).toMatchObject({ day: "2026-12-07", place: "Quarry car park", callTime: "07:45", shotCount: 0 });
    expect(day.body.shootDay.crew.map((c: { name: string }) => c.name).sort()).toEqual(["Cato Crew", "Edda Editor"]);
    const dayId = day.body.shootDay.id;

    const make = (description: string, kind: string, priority = "normal") =>
      crew.send("post", `${world.base}/episodes/${world.episode.id}/shots`, { description, kind, priority, shootDayId: dayId }).expect(201);
    const launch = (await make("Second stage separation, slow motion", "slow_motion", "must")).body.shot;
    await make("Host explains the nozzle", "talking_head");
    const dropped = (await make("Drone orbit of the pad", "aerial")).body.shot;
    await crew.send("patch", `${world.base}/shots/${dropped.id}`, { status: "dropped" }).expect(200);

    let view = await crew.get(`${world.base}/shoot-days/${dayId}`).expect(200);
    expect(view.body.missing.map((s: { description: string }) => s.description)).toEqual(["Second stage separation, slow motion", "Host explains the nozzle"]);

    const clip = await createClip(app.db, world.channel.id, world.episode.id, { fileName: "C0042.MP4" });
    const linked = await crew.send("patch", `${world.base}/clips/${clip.id}`, { shotId: launch.id }).expect(200);
    // The shot tells the clip its kind and its day.
    expect(linked.body.clip).toMatchObject({ shotId: launch.id, kind: "slow_motion", shootDayId: dayId, shotDescription: "Second stage separation, slow motion" });

    view = await crew.get(`${world.base}/shoot-days/${dayId}`).expect(200);
    expect(view.body.missing.map((s: { description: string }) => s.description)).toEqual(["Host explains the nozzle"]);
    expect(view.body.shots.find((s: { id: string }) => s.id === launch.id), JSON.stringify(view.body.shots)).toMatchObject({ status: "captured", clipCount: 1 });

    await crew.send("patch", `${world.base}/clips/${clip.id}`, { shotId: null }).expect(200);
    view = await crew.get(`${world.base}/shoot-days/${dayId}`).expect(200);
    expect(view.body.missing).toHaveLength(2);
  });

  it("when a shoot day names someone outside the channel or a date that doesn't exist, then it says which field", async () => {
    const response = await world.as.owner
      .send("post", `${world.base}/episodes/${world.episode.id}/shoot-days`, { day: "2026-02-30", callTime: "25:00", crewIds: [] })
      .expect(400);
    expect(response.body.error.fields).toEqual({ day: "That date doesn't exist.", callTime: "Write the call time as HH:MM, 24-hour." });
    const stranger = await world.as.owner
      .send("post", `${world.base}/episodes/${world.episode.id}/shoot-days`, { day: "2026-03-01", crewIds: ["00000000-0000-4000-8000-000000000001"] })
      .expect(400);
    expect(stranger.body.error.fields.crewIds).toBe("Everyone on a shoot day must be a member of this channel.");
    const yearZero = await world.as.owner.send("post", `${world.base}/episodes/${world.episode.id}/shoot-days`, { day: "0000-01-01", crewIds: [] }).expect(400);
    expect(yearZero.body.error.fields.day).toBeTruthy();
  });

  it("when a shot is linked to a clip of another episode, then it is refused", async () => {
    const other = await createEpisode(app.db, world.channel.id, { title: "Other" });
    const shot = await createShot(app.db, world.channel.id, other.id);
    const clip = await createClip(app.db, world.channel.id, world.episode.id);
    const response = await world.as.editor.send("patch", `${world.base}/clips/${clip.id}`, { shotId: shot.id }).expect(400);
    expect(response.body.error.fields.shotId).toBe("Choose a shot of this clip's episode.");
  });
});

describe("a clip's bench run and build iteration", () => {
  it("when a clip names a run or iteration of another episode or channel, or none at all, then it answers 400 on that field and the clip keeps its links", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id);
    const url = `${world.base}/clips/${clip.id}`;
    const ownRun = await createRun(app.db, world.channel.id, world.episode.id, world.owner.id);
    const ownIteration = await createIteration(app.db, world.channel.id, world.episode.id, world.owner.id);
    const linked = await world.as.editor.send("patch", url, { benchRunId: ownRun.id, buildIterationId: ownIteration.id }).expect(200);
    expect(linked.body.clip).toMatchObject({ benchRunId: ownRun.id, buildIterationId: ownIteration.id });

    const otherEpisode = await createEpisode(app.db, world.channel.id, { title: "Another build" });
    const elsewhere = await createCrewedChannel(app.db, "Elsewhere Bench");
    const elsewhereEpisode = await createEpisode(app.db, elsewhere.channel.id, { title: "Theirs" });
    const refused = [
      { benchRunId: (await createRun(app.db, world.channel.id, otherEpisode.id, world.owner.id)).id },
      { benchRunId: (await createRun(app.db, elsewhere.channel.id, elsewhereEpisode.id, elsewhere.owner.id)).id },
      { benchRunId: "00000000-0000-4000-8000-000000000001" },
      { buildIterationId: (await createIteration(app.db, world.channel.id, otherEpisode.id, world.owner.id)).id },
      { buildIterationId: (await createIteration(app.db, elsewhere.channel.id, elsewhereEpisode.id, elsewhere.owner.id)).id },
    ];
    for (const patch of refused) {
      const response = await world.as.editor.send("patch", url, patch);
      const seen = `${JSON.stringify(patch)}: ${response.status} ${JSON.stringify(response.body)}`;
      expect(response.status, seen).toBe(400);
      expect(Object.keys(response.body.error.fields), seen).toEqual(Object.keys(patch));
    }
    const after = await world.as.editor.get(url).expect(200);
    expect(after.body.clip).toMatchObject({ benchRunId: ownRun.id, buildIterationId: ownIteration.id });
  });

  it("when a linked run or iteration is deleted, then the clip stays and its link is cleared", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id);
    const run = await createRun(app.db, world.channel.id, world.episode.id, world.owner.id);
    await world.as.editor.send("patch", `${world.base}/clips/${clip.id}`, { benchRunId: run.id }).expect(200);
    await app.database.pool.query("delete from bench_runs where id = $1", [run.id]);
    const after = await world.as.editor.get(`${world.base}/clips/${clip.id}`).expect(200);
    expect(after.body.clip.benchRunId).toBeNull();
  });
});

describe("logging and marks", () => {
  it("when marks are entered in the clip's own drop-frame timecode, then they are kept and counted", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id, { durationMs: 120_000 });
    const url = `${world.base}/clips/${clip.id}/marks`;
    const mark = await world.as.crew.send("post", url, { in: "01:00:59;29", out: "01:01:00;02", note: "the moment the fin snaps" }).expect(201);
    // 29.97 DF: 01:00:59;29 is followed by 01:01:00;02 (OpenTimelineIO, tests/test_opentime.py, TestTime.test_dropframe_timecode_2997fps:
    // ;00 and ;01 are skipped at each minute but every tenth), so this mark is one frame long.
    expect(mark.body.mark).toMatchObject({ in: "01:00:59;29", out: "01:01:00;02", note: "the moment the fin snaps" });
    expect(mark.body.mark.outFrame - mark.body.mark.inFrame).toBe(1);
    const detail = await world.as.editor.get(`${world.base}/clips/${clip.id}`).expect(200);
    expect(detail.body.clip.markCount).toBe(1);
  });

  it("when a mark is a skipped label, written non-drop, outside the clip or backwards, then each field says why", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id, { durationMs: 60_000 });
    const url = `${world.base}/clips/${clip.id}/marks`;
    const skipped = await world.as.editor.send("post", url, { in: "01:01:00;00", out: "01:01:00;10" }).expect(400);
    expect(skipped.body.error.fields.in).toMatch(/does not exist in 29.97 fps drop-frame/);
    const wrongSeparator = await world.as.editor.send("post", url, { in: "01:00:01:00", out: "01:00:02;00" }).expect(400);
    expect(wrongSeparator.body.error.fields.in).toMatch(/written as non-drop-frame/);
    const before = await world.as.editor.send("post", url, { in: "00:59:59;00", out: "01:00:02;00" }).expect(400);
    expect(before.body.error.fields.in).toBe("The clip starts at 01:00:00;00; the in point can't be before it.");
    const after = await world.as.editor.send("post", url, { in: "01:00:10;00", out: "01:04:00;10" }).expect(400);
    expect(after.body.error.fields.out).toMatch(/^The clip ends at 01:00:59;28/);
    const backwards = await world.as.editor.send("post", url, { in: "01:00:10;00", out: "01:00:05;00" }).expect(400);
    expect(backwards.body.error.fields.out).toBe("The out point 01:00:05;00 must come after the in point 01:00:10;00");
    expect((await world.as.editor.get(`${world.base}/clips/${clip.id}`)).body.clip.markCount).toBe(0);
  });

  it("when tags, rating and notes are logged, then they come back tidied", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id);
    const response = await world.as.crew.send("patch", `${world.base}/clips/${clip.id}`, { tags: ["Wiring", "wiring", " close-up "], rating: "select", notes: "Good focus" }).expect(200);
    expect(response.body.clip).toMatchObject({ tags: ["wiring", "close-up"], rating: "select", notes: "Good focus" });
  });

  it("when crew delete someone else's mark, then it answers 403 and the mark stays; their own mark they may delete", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id, { durationMs: 120_000 });
    const url = `${world.base}/clips/${clip.id}/marks`;
    const editors = (await world.as.editor.send("post", url, { in: "01:00:01;00", out: "01:00:02;00", note: "editor's pick" }).expect(201)).body.mark;
    const refused = await world.as.crew.send("delete", `${url}/${editors.id}`).expect(403);
    expect(refused.body.error.message).toBe("Crew can delete only the marks they made.");
    expect((await world.as.editor.get(`${world.base}/clips/${clip.id}`).expect(200)).body.clip.marks.map((m: { id: string }) => m.id)).toEqual([editors.id]);

    const own = (await world.as.crew.send("post", url, { in: "01:00:03;00", out: "01:00:04;00", note: "my slip" }).expect(201)).body.mark;
    await world.as.crew.send("delete", `${url}/${own.id}`).expect(204);
    await world.as.editor.send("delete", `${url}/${editors.id}`).expect(204);
    expect((await world.as.editor.get(`${world.base}/clips/${clip.id}`).expect(200)).body.clip.markCount).toBe(0);
  });

  it("when crew try to delete footage, then it answers 403 and the clip stays; an editor may", async () => {
    const clip = await createClip(app.db, world.channel.id, world.episode.id);
    const refused = await world.as.crew.send("delete", `${world.base}/clips/${clip.id}`).expect(403);
    expect(refused.body.error.message).toBe("Crew can upload and log footage but not delete it.");
    await world.as.editor.send("delete", `${world.base}/clips/${clip.id}`).expect(204);
    await world.as.editor.get(`${world.base}/clips/${clip.id}`).expect(404);
  });
});

describe("the footage list", () => {
  let episodeId: string;
  beforeAll(async () => {
    const episode = await createEpisode(app.db, world.channel.id, { title: "List episode" });
    episodeId = episode.id;
    const base = new Date("2026-11-01T09:00:00Z").getTime();
    for (let i = 0; i < 25; i++) {
      await createClip(app.db, world.channel.id, episodeId, {
        fileName: `L${String(i).padStart(3, "0")}.mov`,
        recordedAt: new Date(base + i * 60_000),
        durationMs: 1000 * (i + 1),
        sizeBytes: 1_000_000 + i,
        rating: i % 3 === 0 ? "select" : i % 3 === 1 ? "maybe" : null,
        tags: i % 5 === 0 ? ["wiring"] : [],
        camera: i % 2 === 0 ? "A cam" : "B cam",
        notes: i === 7 ? "the part fails here" : "",
        markCount: i % 4 === 0 ? 1 : 0,
      });
    }
  });

  it("when the list is read page by page, then keyset pages cover every clip once, in order", async () => {
    const seen: string[] = [];
    let cursor: string | null = null;
    do {
      const query: string = `episodeId=${episodeId}&sort=recorded&dir=asc&limit=10${cursor ? `&cursor=${cursor}` : ""}`;
      const page = await world.as.editor.get(`${world.base}/clips?${query}`).expect(200);
      seen.push(...page.body.clips.map((c: { fileName: string }) => c.fileName));
      expect(page.body.totals).toEqual({ clips: 25, durationMs: 325_000, bytes: 25_000_300 });
      cursor = page.body.nextCursor;
    } while (cursor);
    expect(seen).toEqual(Array.from({ length: 25 }, (_, i) => `L${String(i).padStart(3, "0")}.mov`));
  });

  it("when three filters are combined, then only the clips matching all three come back, with their totals", async () => {
    const page = await world.as.editor.get(`${world.base}/clips?episodeId=${episodeId}&rating=select&tag=wiring&camera=a%20cam`).expect(200);
    // i divisible by 3 (select), by 5 (wiring) and even (A cam): 0 and 30 → only 0 below 25.
    expect(page.body.clips.map((c: { fileName: string }) => c.fileName)).toEqual(["L000.mov"]);
    expect(page.body.totals.clips).toBe(1);
  });

  it("when the list is filtered by text, marks, or unrated, then it finds those", async () => {
    const text = await world.as.editor.get(`${world.base}/clips?episodeId=${episodeId}&q=PART%20FAILS`).expect(200);
    expect(text.body.clips.map((c: { fileName: string }) => c.fileName)).toEqual(["L007.mov"]);
    expect(text.body.totals.clips).toBe(1);
    // A mark's note counts as the clip's text too.
    const marked = text.body.clips[0].id;
    await world.as.editor.send("post", `${world.base}/clips/${marked}/marks`, { in: "01:00:00;10", out: "01:00:00;20", note: "smoke from relay 9" }).expect(201);
    const byMark = await world.as.editor.get(`${world.base}/clips?episodeId=${episodeId}&q=relay%209`).expect(200);
    expect(byMark.body.totals.clips).toBe(1);
    const marks = await world.as.editor.get(`${world.base}/clips?episodeId=${episodeId}&hasMarks=yes`).expect(200);
    expect(marks.body.totals.clips).toBe(8);
    const unrated = await world.as.editor.get(`${world.base}/clips?episodeId=${episodeId}&rating=unrated`).expect(200);
    expect(unrated.body.totals.clips).toBe(8);
  });

  it("when sorted by size descending, then the biggest comes first", async () => {
    const page = await world.as.editor.get(`${world.base}/clips?episodeId=${episodeId}&sort=size&dir=desc&limit=2`).expect(200);
    expect(page.body.clips.map((c: { fileName: string }) => c.fileName)).toEqual(["L024.mov", "L023.mov"]);
  });

  it("when a filter or cursor is malformed, then it answers 400 naming it", async () => {
    const bad = await world.as.editor.get(`${world.base}/clips?rating=great&cursor=nonsense`).expect(400);
    expect(Object.keys(bad.body.error.fields)).toContain("rating");
    const stale = await world.as.editor.get(`${world.base}/clips?cursor=bm9uc2Vuc2U`).expect(400);
    expect(stale.body.error.fields.cursor).toBe("Not a page of this list.");
  });

  it("when a cursor is well formed but its value is not of the sort's kind, then it answers 400, not 500", async () => {
    const id = "00000000-0000-4000-8000-000000000001";
    const forged = (v: unknown) => Buffer.from(JSON.stringify([v, id])).toString("base64url");
    const cases: [string, unknown][] = [
      ["recorded", "not a time"],
      ["recorded", "0000-01-01 00:00:00+00"],
      ["uploaded", "2026-02-30 10:00:00+00"],
      ["duration", "ten"],
      ["duration", 1e30],
      ["size", "9".repeat(40)],
      ["name", "nul\u0000byte"],
    ];
    for (const [sort, v] of cases) {
      const response = await world.as.editor.get(`${world.base}/clips?sort=${sort}&cursor=${forged(v)}`);
      expect(response.status, `${sort} ${JSON.stringify(v)}: ${JSON.stringify(response.body)}`).toBe(400);
      expect(response.body.error.fields.cursor).toBe("Not a page of this list.");
    }
  });

  it("when another channel's member asks, then they see none of it", async () => {
    const { createUser, createChannel } = await import("../factories/accounts");
    const outsider = await createUser(app.db);
    await createChannel(app.db, outsider, "Elsewhere");
    const agent = await app.signedIn(outsider);
    const refused = await agent.get(`${world.base}/clips`).expect(404);
    expect(refused.body).toEqual({ error: expect.objectContaining({ code: "not_found" }) });
  });
});

describe("exports of the current filter", () => {
  let episodeId: string;
  beforeAll(async () => {
    const episode = await createEpisode(app.db, world.channel.id, { title: "Relay calculator" });
    episodeId = episode.id;
    const day = await createShootDay(app.db, world.channel.id, episodeId, { day: "2026-12-01" });
    const clip = await createClip(app.db, world.channel.id, episodeId, { fileName: 'Relay "bank", take 2.mov', shootDayId: day.id, recordedAt: new Date("2026-12-01T10:00:00Z"), notes: "=SUM(A1)" });
    await world.as.editor.send("post", `${world.base}/clips/${clip.id}/marks`, { in: "01:00:01;00", out: "01:00:03;00", note: "carry ripples, all 16 relays" }).expect(201);
    await world.as.editor.send("post", `${world.base}/clips/${clip.id}/marks`, { in: "01:00:05;00", out: "01:00:06;00", note: "" }).expect(201);
    await createClip(app.db, world.channel.id, episodeId, { fileName: "B002.mov", recordedAt: new Date("2026-12-01T11:00:00Z"), durationMs: 2002, startTimecode: "02:00:00;00" });
  });

  it("when exported as CSV, then it is RFC 4180 and parses back to one record per mark", async () => {
    const response = await world.as.editor.get(`${world.base}/exports/footage.csv?episodeId=${episodeId}&sort=recorded&dir=asc`).expect(200);
    expect(response.headers["content-type"]).toMatch(/^text\/csv/);
    expect(response.headers["content-disposition"]).toMatch(/^attachment; filename="footage-\d{4}-\d{2}-\d{2}\.csv"/);
    expect(response.text.endsWith("\r\n")).toBe(true);
    const records: string[][] = parseCsv(response.text, { record_delimiter: "\r\n" });
    expect(records[0]!.slice(0, 3)).toEqual(["file_name", "episode", "shoot_day"]);
    expect(records).toHaveLength(4);
    expect(records[1]![0]).toBe('Relay "bank", take 2.mov');
    expect(records[1]![13]).toBe("01:00:01;00");
    expect(records[1]![15]).toBe("carry ripples, all 16 relays");
    // A note starting with "=" is kept as text, not run as a spreadsheet formula.
    expect(records[1]![16]).toBe("'=SUM(A1)");
    expect(records[3]![0]).toBe("B002.mov");
  });

  it("when exported as an EDL, then it is CMX 3600 with one cut per mark, laid end to end from 01:00:00;00", async () => {
    const response = await world.as.editor.get(`${world.base}/exports/footage.edl?episodeId=${episodeId}&sort=recorded&dir=asc`).expect(200);
    const edl = parseEdl(response.text);
    expect(edl.title).toBe("Relay calculator");
    expect(edl.dropFrame).toBe(true);
    expect(edl.events.map((e) => [e.event, e.channel, e.transition, e.sourceIn, e.sourceOut, e.recordIn, e.recordOut])).toEqual([
      [1, "V", "C", "01:00:01;00", "01:00:03;00", "01:00:00;00", "01:00:02;00"],
      [2, "V", "C", "01:00:05;00", "01:00:06;00", "01:00:02;00", "01:00:03;00"],
      // No marks: the whole clip, 2.002 s = 60 frames at 29.97.
      [3, "V", "C", "02:00:00;00", "02:00:02;00", "01:00:03;00", "01:00:05;00"],
    ]);
    expect(edl.events[0]!.reel).toBe("RELAYBAN");
    expect(edl.events[0]!.comments).toEqual(['FROM CLIP NAME: Relay "bank", take 2.mov', "COMMENT: carry ripples, all 16 relays"]);
  });

  it("when exported as OpenTimelineIO, then marks become the clips' source ranges", async () => {
    const response = await world.as.editor.get(`${world.base}/exports/footage.otio?episodeId=${episodeId}&sort=recorded&dir=asc`).expect(200);
    const timeline = JSON.parse(response.text);
    expect(timeline.OTIO_SCHEMA).toBe("Timeline.1");
    const track = timeline.tracks.children[0];
    expect(track).toMatchObject({ OTIO_SCHEMA: "Track.1", kind: "Video" });
    const first = track.children[0];
    expect(first.OTIO_SCHEMA).toBe("Clip.2");
    expect(first.active_media_reference_key).toBe("DEFAULT_MEDIA");
    // The file's name as a percent-encoded relative URL (RFC 3986, sections 2.1 and 4.2).
    expect(first.media_references.DEFAULT_MEDIA).toMatchObject({ OTIO_SCHEMA: "ExternalReference.1", name: 'Relay "bank", take 2.mov', target_url: "Relay%20%22bank%22%2C%20take%202.mov" });
    // 01:00:01;00 at 29.97 DF is frame 107,922: an hour is 107,892 frames (a tenth of 10:00:00;00 = 1,078,920 in
    // smpte-timecode 1.3.6, test/smpte-timecode-test.js, "drop-frame counts"), plus 30.
    expect(first.source_range.start_time).toEqual({ OTIO_SCHEMA: "RationalTime.1", value: 107_922, rate: 30000 / 1001 });
    expect(first.source_range.duration.value).toBe(60);
    expect(track.children).toHaveLength(3);
  });
});

describe("bulk download and photos", () => {
  it("when two clips are chosen, then they stream out as one zip holding both files by name", async () => {
    const one = await uploadFile(world.as.editor, world.base, world.episode.id, "zip-one.mov", patternBytes(3000, 1));
    const two = await uploadFile(world.as.editor, world.base, world.episode.id, "zip-one.mov", patternBytes(5000, 2));
    const response = await world.as.editor
      .get(`${world.base}/exports/footage.zip?ids=${one.body.clip.id},${two.body.clip.id}`)
      .buffer(true)
      .parse(binary)
      .expect(200);
    const body = response.body as Buffer;
    expect(response.headers["content-type"]).toBe("application/zip");
    expect(body.subarray(0, 4).toString("hex")).toBe("504b0304");
    // Stored, not compressed: the names and the bytes are readable in place.
    expect(body.includes(Buffer.from("zip-one.mov"))).toBe(true);
    expect(body.includes(Buffer.from("zip-one (2).mov"))).toBe(true);
    expect(body.includes(patternBytes(5000, 2))).toBe(true);
  });

  it("when a chosen clip's file is missing from storage, then the zip holds the others and a MISSING.txt naming it; all missing is a 404", async () => {
    const present = await uploadFile(world.as.editor, world.base, world.episode.id, "kept-take.mov", patternBytes(2000, 3));
    const lost = await createClip(app.db, world.channel.id, world.episode.id, { fileName: "lost-take.mov" });
    const response = await world.as.editor
      .get(`${world.base}/exports/footage.zip?ids=${lost.id},${present.body.clip.id}`)
      .buffer(true)
      .parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () => done(null, Buffer.concat(chunks)));
      })
      .expect(200);
    const body = response.body as Buffer;
    expect(body.includes(patternBytes(2000, 3))).toBe(true);
    expect(body.includes(Buffer.from("MISSING.txt"))).toBe(true);
    expect(body.includes(Buffer.from("lost-take.mov"))).toBe(true);

    const none = await world.as.editor.get(`${world.base}/exports/footage.zip?ids=${lost.id}`).expect(404);
    expect(none.body.error.message).toMatch(/lost-take\.mov/);
  });

  it("when a photo streams through the server, then it is stored and readable; a wrong type is 415 and a big one 413", async () => {
    const jpeg = Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), patternBytes(2000), Buffer.from([0xff, 0xd9])]);
    const post = (name: string, bytes: Buffer, size = bytes.length) =>
      world.as.crew.agent
        .post(`${world.base}/stills?episodeId=${world.episode.id}`)
        .set("x-csrf-token", world.as.crew.csrf)
        .field("size", String(size))
        .attach("file", bytes, { filename: name, contentType: "image/jpeg" });
    const saved = await post("motor-mount.jpg", jpeg).expect(201);
    const read = await world.as.editor.get(`${world.base}/stills/${saved.body.still.id}`).expect(200);
    expect(Buffer.from(await (await fetch(read.body.still.url)).arrayBuffer()).equals(jpeg)).toBe(true);
    expect((await post("notes.pdf", jpeg).expect(415)).body.error.message).toMatch(/doesn't take \.pdf files as a photo/);
    expect((await post("big.jpg", jpeg, 30 * 1024 * 1024).expect(413)).body.error.message).toBe('"big.jpg" is 30 MiB; a photo can be at most 20 MiB.');
    expect((await post("liar.jpg", jpeg, jpeg.length + 5).expect(400)).body.error.message).toMatch(/its size field said/);
  });
});


describe("EDLs of a filter that mixes frame rates", () => {
  let episodeId: string;
  beforeAll(async () => {
    const episode = await createEpisode(app.db, world.channel.id, { title: "Gantry crane" });
    episodeId = episode.id;
    const at = (minute: number) => new Date(`2026-12-02T10:${String(minute).padStart(2, "0")}:00Z`);
    const dfClip = await createClip(app.db, world.channel.id, episodeId, { fileName: "A001_C001.mov", recordedAt: at(1), startTimecode: "00:00:58;00", durationMs: 4004 });
    await world.as.editor.send("post", `${world.base}/clips/${dfClip.id}/marks`, { in: "00:00:59;28", out: "00:01:00;04", note: "hook slips" }).expect(201);
    // The text rule refuses line breaks in a note today; a row from before it may still hold one.
    await app.db.update(clipMarks).set({ note: "hook\u2028slips" }).where(eq(clipMarks.clipId, dfClip.id));
    const pal = { frameRateNumerator: 25, frameRateDenominator: 1, dropFrame: false };
    await createClip(app.db, world.channel.id, episodeId, { ...pal, fileName: "A001_C002.mov", recordedAt: at(2), startTimecode: "10:00:00:00", durationMs: 2000 });
    await createClip(app.db, world.channel.id, episodeId, { fileName: "phone.mp4", recordedAt: at(3), frameRateNumerator: null, frameRateDenominator: null, dropFrame: false, startTimecode: null });
  });
  const filter = () => `episodeId=${episodeId}&sort=recorded&dir=asc`;

  it("when the footage list asks, then it learns the filter's rates and the clips no list can hold", async () => {
    const answer = await world.as.editor.get(`${world.base}/exports/edl-rates?${filter()}`).expect(200);
    expect(answer.body).toEqual({
      rates: [
        { rate: "29.97df", label: "29.97 fps drop-frame", clips: 1 },
        { rate: "25", label: "25 fps non-drop-frame", clips: 1 },
      ],
      withoutRate: 1,
    });
  });

  it("when exported without a rate, then a zip holds one list per rate, each read back with its clips' own timecode", async () => {
    const response = await world.as.editor.get(`${world.base}/exports/footage.edl?${filter()}`).buffer(true).parse(binary).expect(200);
    expect(response.headers["content-type"]).toBe("application/zip");
    expect(response.headers["content-disposition"]).toMatch(/filename="footage-\d{4}-\d{2}-\d{2}-edls\.zip"/);
    const files = unzip(response.body as Buffer);
    const names = Object.keys(files).sort();
    expect(names).toEqual([expect.stringMatching(/^footage-.*-25\.edl$/), expect.stringMatching(/^footage-.*-29\.97df\.edl$/)]);
    const df = strFromU8(files[names[1]!]!);
    const pal = strFromU8(files[names[0]!]!);
    // Both readers, Kerf's strict one (with the rate's labels checked) and OpenTimelineIO's rules, see the clips' own labels.
    expect(parseEdl(df, formatOfEdlRate("29.97df")).events.map((e) => [e.reel, e.sourceIn, e.sourceOut])).toEqual([["A001C001", "00:00:59;28", "00:01:00;04"]]);
    expect(readLikeOtio(df).events[0]).toMatchObject({ sourceIn: "00:00:59;28", sourceOut: "00:01:00;04", clipName: "A001_C001.mov" });
    expect(parseEdl(pal, formatOfEdlRate("25")).events.map((e) => [e.reel, e.sourceIn, e.sourceOut])).toEqual([["A001C002", "10:00:00:00", "10:00:02:00"]]);
    expect(readLikeOtio(pal).events[0]).toMatchObject({ sourceIn: "10:00:00:00", sourceOut: "10:00:02:00", clipName: "A001_C002.mov" });
    expect(parseEdl(df).events[0]!.comments).toContain("COMMENT: hook slips");
    expect(parseEdl(pal).notes).toEqual(
      expect.arrayContaining([expect.stringMatching(/^OTHER RATES: this filter also holds 29.97 fps drop-frame \(1 clip\)/), "LEFT OUT (no frame rate Kerf can time): phone.mp4"]),
    );
  });

  it("when a rate is chosen, then that list alone comes back, named by its rate; an unknown rate is a 400", async () => {
    const response = await world.as.editor.get(`${world.base}/exports/footage.edl?${filter()}&rate=25`).expect(200);
    expect(response.headers["content-type"]).toMatch(/^text\/plain/);
    expect(response.headers["content-disposition"]).toMatch(/filename="footage-\d{4}-\d{2}-\d{2}-25\.edl"/);
    expect(parseEdl(response.text, formatOfEdlRate("25")).events).toHaveLength(1);
    const wrong = await world.as.editor.get(`${world.base}/exports/footage.edl?${filter()}&rate=24df`).expect(400);
    expect(wrong.body.error.fields.rate).toMatch(/^Choose one of 23.976, 24, 25, 29.97, 29.97df/);
    const absent = await world.as.editor.get(`${world.base}/exports/footage.edl?${filter()}&rate=50`).expect(422);
    expect(absent.body.error.message).toBe("None of these clips is at 50 fps non-drop-frame.");
  });
});

describe("a large export, streamed", () => {
  let episodeId: string;
  const count = 620; // more than two of the export's batches of 250
  beforeAll(async () => {
    episodeId = (await createEpisode(app.db, world.channel.id, { title: "Big shoot" })).id;
    const rows = Array.from({ length: count }, (_, i) =>
      clipValues(world.channel.id, episodeId, { fileName: `BIG_${String(i).padStart(4, "0")}.mov`, recordedAt: new Date(Date.UTC(2026, 11, 3, 9, 0, i)) }),
    );
    const inserted = await app.db.insert(clips).values(rows).returning({ id: clips.id });
    // Two marks on every clip, inserted in reverse so the marks' order in the table is not the clips'.
    const marks = inserted.flatMap(({ id }) => [1, 0].map((m) => ({ channelId: world.channel.id, clipId: id, inFrame: 107_892 + m * 30, outFrame: 107_922 + m * 30, inLabel: `01:00:0${m};00`, outLabel: `01:00:0${m + 1};00`, note: `mark ${m}` })));
    await app.db.insert(clipMarks).values(marks.reverse());
  });

  it("when exported as CSV by name, then every clip and mark comes once, in the list's order, whatever the batch edges", async () => {
    const response = await world.as.editor.get(`${world.base}/exports/footage.csv?episodeId=${episodeId}&sort=name&dir=desc`).expect(200);
    const records: string[][] = parseCsv(response.text, { record_delimiter: "\r\n" });
    expect(records).toHaveLength(1 + count * 2);
    const expected = Array.from({ length: count }, (_, i) => `BIG_${String(count - 1 - i).padStart(4, "0")}.mov`).flatMap((name) => [
      [name, "01:00:00;00", "mark 0"],
      [name, "01:00:01;00", "mark 1"],
    ]);
    expect(records.slice(1).map((r) => [r[0], r[13], r[15]])).toEqual(expected);
  });

  it("when exported as OpenTimelineIO, then the streamed pieces are one timeline of every mark", async () => {
    const response = await world.as.editor.get(`${world.base}/exports/footage.otio?episodeId=${episodeId}`).expect(200);
    const timeline = JSON.parse(response.text);
    expect(timeline.name).toBe("Big shoot");
    expect(timeline.tracks.children[0].children).toHaveLength(count * 2);
  });

  it("when another channel's member asks for the same filter, then they get nothing of it", async () => {
    const other = await rushesWorld(app);
    const response = await other.as.editor.get(`${other.base}/exports/footage.csv?episodeId=${episodeId}`).expect(200);
    expect(response.text.split("\r\n")).toHaveLength(2); // the header and the empty string after it
  });
});

describe("the zip of chosen clips", () => {
  it("when downloaded, then it holds a timeline whose target URLs are the files' names in the zip", async () => {
    const metadata = { ...sampleMetadata, startTimecode: "01:00:00;00" };
    const one = await uploadFile(world.as.editor, world.base, world.episode.id, "take #1.mov", patternBytes(3000, 1), metadata);
    const two = await uploadFile(world.as.editor, world.base, world.episode.id, "take #1.mov", patternBytes(4000, 2), metadata);
    const response = await world.as.editor.get(`${world.base}/exports/footage.zip?ids=${one.body.clip.id},${two.body.clip.id}`).buffer(true).parse(binary).expect(200);
    const files = unzip(response.body as Buffer);
    expect(Object.keys(files).sort()).toEqual(["take #1 (2).mov", "take #1.mov", "timeline.otio"]);
    const timeline = JSON.parse(strFromU8(files["timeline.otio"]!));
    const targets = timeline.tracks.children[0].children.map((c: { media_references: { DEFAULT_MEDIA: { target_url: string } } }) => c.media_references.DEFAULT_MEDIA.target_url);
    expect(targets.map((t: string) => decodeURIComponent(t)).sort()).toEqual(["take #1 (2).mov", "take #1.mov"]);
    expect(targets.every((t: string) => !/[ #]/.test(t))).toBe(true);
    // Each name holds the bytes of the clip the timeline says it is.
    for (const child of timeline.tracks.children[0].children) {
      const bytes = files[decodeURIComponent(child.media_references.DEFAULT_MEDIA.target_url)]!;
      expect(bytes.length).toBe(child.metadata.kerf.clip_id === one.body.clip.id ? 3000 : 4000);
    }
  });
});

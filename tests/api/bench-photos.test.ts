import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MAX_PHOTOS_PER_ITERATION } from "../../shared/bench/schemas";
import { buildPhotos } from "../../server/db/schema/bench";
import { createCrewedChannel } from "../factories/accounts";
import { createIteration } from "../factories/bench";
import { createEpisode } from "../factories/episodes";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

/** A small JPEG-shaped file: the start-of-image and end-of-image markers around a made-up body. */
const jpeg = (size = 2000) => Buffer.concat([Buffer.from([0xff, 0xd8, 0xff, 0xe0]), Buffer.alloc(size, 0x5a), Buffer.from([0xff, 0xd9])]);

async function setting() {
  const crewed = await createCrewedChannel(app.db, "Photo Bench");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Printed arms", stage: "build" });
  const iteration = await createIteration(app.db, crewed.channel.id, episode.id, crewed.owner.id, { change: "Printed arms" });
  const crew = await app.signedIn(crewed.crew);
  const editor = await app.signedIn(crewed.editor);
  const episodeBase = `/api/channels/${crewed.channel.id}/episodes/${episode.id}`;
  return { ...crewed, episode, iteration, crew, editor, episodeBase };
}

const upload = (who: Visitor, path: string, name: string, bytes: Buffer, size = bytes.length, contentType = "image/jpeg") =>
  who.agent.post(path).set("x-csrf-token", who.csrf).field("size", String(size)).attach("file", bytes, { filename: name, contentType });

const stored = async (key: string) => (await app.deps.storage.head(key)) !== null;
const keyOf = async (photoId: string) => (await app.database.pool.query("select object_key from build_photos where id = $1", [photoId])).rows[0]?.object_key as string | undefined;

describe("photos of a build iteration", () => {
  it("when crew add a photo, then everyone who reads the build log sees it through a signed link", async () => {
    const { crew, editor, episodeBase, iteration } = await setting();
    const bytes = jpeg();
    const added = await upload(crew, `${episodeBase}/build-log/${iteration.id}/photos`, "arm-joint.jpg", bytes).expect(201);
    expect(added.body.photo).toMatchObject({ iterationId: iteration.id, fileName: "arm-joint.jpg", contentType: "image/jpeg", size: bytes.length });

    const listed = await editor.get(`${episodeBase}/build-photos`).expect(200);
    expect(listed.body.photos).toHaveLength(1);
    const [photo] = listed.body.photos;
    const fetched = await fetch(photo.url);
    expect(fetched.status).toBe(200);
    expect(fetched.headers.get("content-type")).toBe("image/jpeg");
    expect(Buffer.from(await fetched.arrayBuffer()).equals(bytes)).toBe(true);
    // The key is Kerf's: channel/episode/uuid, never the file's name.
    expect(await keyOf(photo.id)).not.toContain("arm-joint");
  });

  it("when the file is not an image, too big or not the size it claimed, then it is refused and nothing is kept", async () => {
    const { crew, episodeBase, iteration } = await setting();
    const path = `${episodeBase}/build-log/${iteration.id}/photos`;
    expect((await upload(crew, path, "notes.pdf", jpeg(), undefined, "application/pdf").expect(415)).body.error.message).toMatch(/doesn't take \.pdf files as a photo/);
    expect((await upload(crew, path, "big.jpg", jpeg(), 30 * 1024 * 1024).expect(413)).body.error.message).toBe('"big.jpg" is 30 MiB; a photo can be at most 20 MiB.');
    expect((await upload(crew, path, "liar.jpg", jpeg(), jpeg().length + 5).expect(400)).body.error.message).toMatch(/its size field said/);
    await crew.agent.post(path).set("x-csrf-token", crew.csrf).field("size", "10").expect(400);
    expect((await app.database.pool.query("select 1 from build_photos where iteration_id = $1", [iteration.id])).rows).toEqual([]);
  });

  it("when an iteration already holds the most photos it keeps, then one more is refused", async () => {
    const { crew, episodeBase, iteration, channel, episode } = await setting();
    for (let i = 0; i < MAX_PHOTOS_PER_ITERATION; i++) {
      await app.db.insert(buildPhotos).values({ channelId: channel.id, episodeId: episode.id, iterationId: iteration.id, objectKey: `${channel.id}/${episode.id}/00000000-0000-4000-8000-${String(i).padStart(12, "0")}`, fileName: `${i}.jpg`, contentType: "image/jpeg", sizeBytes: 4 });
    }
    const refused = await upload(crew, `${episodeBase}/build-log/${iteration.id}/photos`, "one-more.jpg", jpeg()).expect(409);
    expect(refused.body.error.message).toMatch(`at most ${MAX_PHOTOS_PER_ITERATION} photos`);
  });

  it("when a photo is removed, then its row and its object are gone; removing the iteration takes its photos along", async () => {
    const { crew, episodeBase, iteration, channel, episode, owner } = await setting();
    const first = await upload(crew, `${episodeBase}/build-log/${iteration.id}/photos`, "a.png", jpeg(), undefined, "image/png").expect(201);
    const firstKey = (await keyOf(first.body.photo.id))!;
    expect(await stored(firstKey)).toBe(true);
    await crew.send("delete", `${episodeBase}/build-photos/${first.body.photo.id}`).expect(204);
    expect(await keyOf(first.body.photo.id)).toBeUndefined();
    expect(await stored(firstKey)).toBe(false);
    await crew.send("delete", `${episodeBase}/build-photos/${first.body.photo.id}`).expect(404);

    const second = await createIteration(app.db, channel.id, episode.id, owner.id, { change: "Lighter arms" });
    const kept = await upload(crew, `${episodeBase}/build-log/${second.id}/photos`, "b.webp", jpeg(), undefined, "image/webp").expect(201);
    const keptKey = (await keyOf(kept.body.photo.id))!;
    await crew.send("delete", `${episodeBase}/build-log/${second.id}`).expect(204);
    expect(await keyOf(kept.body.photo.id)).toBeUndefined();
    expect(await stored(keptKey)).toBe(false);
  });

  it("when someone names another episode's iteration or photo, or another channel's, then it is not found and nothing changes", async () => {
    const a = await setting();
    const b = await setting();
    const otherEpisode = await createEpisode(app.db, a.channel.id, { title: "Another build", stage: "build" });
    const otherBase = `/api/channels/${a.channel.id}/episodes/${otherEpisode.id}`;
    // The iteration is the channel's but not this episode's.
    expect((await upload(a.crew, `${otherBase}/build-log/${a.iteration.id}/photos`, "x.jpg", jpeg()).expect(404)).body.error.message).toBe("Iteration not found.");
    // Another channel's iteration, under one's own channel.
    await upload(a.crew, `${a.episodeBase}/build-log/${b.iteration.id}/photos`, "x.jpg", jpeg()).expect(404);

    const photo = await upload(b.crew, `${b.episodeBase}/build-log/${b.iteration.id}/photos`, "b.jpg", jpeg()).expect(201);
    await a.crew.send("delete", `${a.episodeBase}/build-photos/${photo.body.photo.id}`).expect(404);
    const own = await upload(a.crew, `${a.episodeBase}/build-log/${a.iteration.id}/photos`, "a.jpg", jpeg()).expect(201);
    await a.crew.send("delete", `${otherBase}/build-photos/${own.body.photo.id}`).expect(404);
    expect(await keyOf(photo.body.photo.id)).toBeDefined();
    expect(await keyOf(own.body.photo.id)).toBeDefined();
    expect((await a.crew.get(`${otherBase}/build-photos`).expect(200)).body.photos).toEqual([]);
  });

  it("when the editor tries to add or remove a photo, then the role is refused", async () => {
    const { crew, editor, episodeBase, iteration } = await setting();
    await upload(editor, `${episodeBase}/build-log/${iteration.id}/photos`, "e.jpg", jpeg()).expect(403);
    const photo = await upload(crew, `${episodeBase}/build-log/${iteration.id}/photos`, "c.jpg", jpeg()).expect(201);
    await editor.send("delete", `${episodeBase}/build-photos/${photo.body.photo.id}`).expect(403);
    expect(await keyOf(photo.body.photo.id)).toBeDefined();
  });
});

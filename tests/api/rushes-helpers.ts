import { partRange } from "../../shared/rushes/limits";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { afterAll, beforeAll } from "vitest";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

/** A crewed channel with one episode, signed-in agents for each role. */
export async function rushesWorld(app: TestApp) {
  const crewed = await createCrewedChannel(app.db, "Rushes Channel");
  const episode = await createEpisode(app.db, crewed.channel.id, { title: "Bottle rocket", stage: "shoot" });
  const [owner, editor, crew] = await Promise.all([app.signedIn(crewed.owner), app.signedIn(crewed.editor), app.signedIn(crewed.crew)]);
  return { ...crewed, episode, as: { owner, editor, crew }, base: `/api/channels/${crewed.channel.id}` };
}

/** A test file's app and rushes world: made before its first test, the app closed after its last. */
export function rushesSuite() {
  const suite = {} as { app: TestApp; world: Awaited<ReturnType<typeof rushesWorld>> };
  beforeAll(async () => {
    suite.app = await startTestApp();
    suite.world = await rushesWorld(suite.app);
  });
  afterAll(() => suite.app.close());
  return suite;
}

export const sampleMetadata = {
  durationMs: 10_010,
  frameRate: { numerator: 30000, denominator: 1001 },
  dropFrame: true,
  width: 1920,
  height: 1080,
  codec: "AVC",
  startTimecode: "01:00:00;00",
  recordedAt: "2026-11-20T10:15:00Z",
  camera: "A cam",
};

/** Bytes with a pattern, so a part sent in the wrong place would show. */
export function patternBytes(size: number, seed = 7): Buffer {
  const buffer = Buffer.alloc(size);
  for (let i = 0; i < size; i++) buffer[i] = (i * 31 + seed) & 0xff;
  return buffer;
}

/** Sends one part to its presigned URL as a browser would, and reports it to Kerf. */
export async function sendPart(agent: Visitor, base: string, upload: { id: string; partSize: number }, bytes: Buffer, partNumber: number, report = true) {
  const { start: from, end: to } = partRange(partNumber, upload.partSize, bytes.length);
  const signed = await agent.send("post", `${base}/uploads/${upload.id}/part-urls`, { parts: [{ partNumber, size: to - from }] });
  if (signed.status !== 200) throw new Error(`part-urls ${signed.status} ${JSON.stringify(signed.body)}`);
  const { url, start, end } = signed.body.urls[0] as { url: string; start: number; end: number };
  const put = await fetch(url, { method: "PUT", body: new Uint8Array(bytes.subarray(start, end)) });
  if (!put.ok) throw new Error(`storage answered ${put.status}`);
  const etag = put.headers.get("etag")!;
  if (report) {
    const recorded = await agent.send("post", `${base}/uploads/${upload.id}/parts`, { parts: [{ partNumber, etag, size: end - start }] });
    if (recorded.status !== 200) throw new Error(`record ${recorded.status} ${JSON.stringify(recorded.body)}`);
  }
  return { etag, size: end - start };
}

/** A whole upload through the presigned path; answers the completion's response. */
export async function uploadFile(agent: Visitor, base: string, episodeId: string, fileName: string, bytes: Buffer, metadata: object = sampleMetadata) {
  const started = await agent.send("post", `${base}/uploads`, { episodeId, fileName, size: bytes.length, metadata });
  if (started.status !== 201) throw new Error(`start ${started.status} ${JSON.stringify(started.body)}`);
  const upload = started.body.upload as { id: string; partSize: number; partCount: number };
  for (let n = 1; n <= upload.partCount; n++) await sendPart(agent, base, upload, bytes, n);
  return agent.send("post", `${base}/uploads/${upload.id}/complete`, {});
}

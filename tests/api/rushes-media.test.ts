import { readFile } from "node:fs/promises";
import path from "node:path";
import mediaInfoFactory from "mediainfo.js";
import { describe, expect, it } from "vitest";
import { metadataFromProbe, type ProbeTrack } from "../../shared/rushes/media";

// The fixtures were made with Debian's ffmpeg from its built-in test sources:
//   testsrc2 320x180 at 30000/1001 with -timecode "01:00:00;00" (A001_C001.mov, 3 s)
//   smptebars 320x180 at 25 with -timecode "10:00:00:00" (B002_C004.mp4, 2 s)
const fixture = (name: string) => path.resolve(import.meta.dirname, "../fixtures/rushes", name);

async function probe(name: string) {
  const bytes = await readFile(fixture(name));
  const mi = await mediaInfoFactory({ format: "object" });
  try {
    // The same slice-by-slice reading the browser does with a File.
    const result = await mi.analyzeData(bytes.length, (size, offset) => bytes.subarray(offset, offset + size));
    return metadataFromProbe((result.media?.track ?? []) as unknown as ProbeTrack[]);
  } finally {
    mi.close();
  }
}

describe("reading real files with mediainfo.js", () => {
  it("when a QuickTime file has a 29.97 drop-frame timecode track, then its first frame and format come through", async () => {
    const metadata = await probe("A001_C001.mov");
    expect(metadata).toMatchObject({ frameRate: { numerator: 30000, denominator: 1001 }, dropFrame: true, startTimecode: "01:00:00;00", width: 320, height: 180, codec: "AVC" });
    expect(metadata.durationMs).toBeGreaterThan(2900);
    expect(metadata.durationMs).toBeLessThan(3100);
    expect(metadata.recordedAt).toBe("2026-11-20T10:15:00.000Z");
  });

  it("when an MP4 runs at 25 fps with a non-drop timecode, then it is read as such", async () => {
    const metadata = await probe("B002_C004.mp4");
    expect(metadata).toMatchObject({ frameRate: { numerator: 25, denominator: 1 }, dropFrame: false, startTimecode: "10:00:00:00" });
  });
});

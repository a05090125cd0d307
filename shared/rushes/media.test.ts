import { describe, expect, it } from "vitest";
import { clipMetadataSchema } from "./schemas";
import { metadataFromProbe, probeDate } from "./media";

describe("reading a probe's tracks", () => {
  it("when a 29.97 clip carries a drop-frame timecode track, then Kerf keeps rate, drop-frame and the first frame", () => {
    // The track fields mediainfo.js 0.3.8 gives (format "object") for a QuickTime file with a timecode track,
    // as tests/api/rushes-media.test.ts reads them from the real fixture A001_C001.mov.
    const metadata = metadataFromProbe([
      { "@type": "General", Format: "MPEG-4", Duration: "12.012", Encoded_Date: "2026-11-20 10:15:00 UTC" },
      { "@type": "Video", Format: "AVC", FrameRate_Num: 30000, FrameRate_Den: 1001, FrameRate: "29.970", Width: 1920, Height: 1080 },
      { "@type": "Other", Type: "Time code", TimeCode_FirstFrame: "01:00:00;00" },
    ]);
    expect(metadata).toEqual({
      durationMs: 12_012,
      frameRate: { numerator: 30000, denominator: 1001 },
      dropFrame: true,
      width: 1920,
      height: 1080,
      codec: "AVC",
      startTimecode: "01:00:00;00",
      recordedAt: "2026-11-20T10:15:00.000Z",
      camera: "",
    });
    expect(clipMetadataSchema.safeParse(metadata).success).toBe(true);
  });

  it("when the rate is only given as a decimal at 25 fps, then it is matched and drop-frame stays off", () => {
    const metadata = metadataFromProbe([{ "@type": "General", Duration: 4 }, { "@type": "Video", FrameRate: "25.000", Format: "ProRes" }, { "@type": "Other", TimeCode_FirstFrame: "10:00:00:00" }]);
    expect(metadata).toMatchObject({ frameRate: { numerator: 25, denominator: 1 }, dropFrame: false, startTimecode: "10:00:00:00", durationMs: 4000 });
  });

  it("when the probe knows nothing (a sound file), then metadata is empty rather than guessed", () => {
    const metadata = metadataFromProbe([{ "@type": "General", Format: "Wave", Duration: "3.5" }, { "@type": "Audio" }]);
    expect(metadata).toMatchObject({ frameRate: null, dropFrame: false, startTimecode: null, width: null, durationMs: 3500 });
  });

  it("when a timecode names a label drop-frame skips, then it is dropped, not stored", () => {
    const metadata = metadataFromProbe([{ "@type": "Video", FrameRate_Num: 30000, FrameRate_Den: 1001 }, { "@type": "Other", TimeCode_FirstFrame: "00:01:00;00" }]);
    expect(metadata.startTimecode).toBeNull();
  });

  it("reads mediainfo's UTC dates and refuses anything else", () => {
    expect(probeDate("2026-01-02 03:04:05 UTC")).toBe("2026-01-02T03:04:05.000Z");
    expect(probeDate("9999-12-31 00:00:00 UTC")).toBeNull();
    expect(probeDate("1904-01-01 00:00:00 UTC")).toBe("1904-01-01T00:00:00.000Z");
    expect(probeDate("yesterday")).toBeNull();
  });

  it("when a file's own camera and codec names hold control or direction characters, then they are cleaned into text the clip rule accepts", () => {
    const metadata = metadataFromProbe([
      { "@type": "General", Make: "Acme\u0000\r\nCam", Model: "\u202EX-100\u0007", Duration: "2" },
      { "@type": "Video", Format: "AVC\u200B\u0085" },
    ]);
    expect(metadata.camera).toBe("Acme Cam X-100");
    expect(metadata.codec).toBe("AVC\u200B");
    expect(clipMetadataSchema.safeParse(metadata).success).toBe(true);
  });
});

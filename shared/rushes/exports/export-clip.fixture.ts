import type { ExportClip } from "./clip-ranges";

/** An export clip for tests: 10 s of a 25 fps clip starting at 10:00:00:00, no marks. */
export const exportClip = (overrides: Partial<ExportClip> = {}): ExportClip => ({
  id: "3f7c1a52-54a8-4c1e-9d35-0a1b2c3d4e5f",
  fileName: "A001_C007.mov",
  objectKey: "c/e/k",
  episodeTitle: "Relay calculator",
  shootDay: null,
  shotDescription: null,
  kind: null,
  rating: null,
  tags: [],
  camera: "",
  recordedAt: "2026-12-01T10:00:00.000Z",
  durationMs: 10_000,
  frameRate: { numerator: 25, denominator: 1 },
  dropFrame: false,
  startTimecode: "10:00:00:00",
  size: 1,
  notes: "",
  marks: [],
  ...overrides,
});

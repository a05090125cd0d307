import type { FrameRate } from "../timecode/rates";

/** What the server's probe (ffprobe) read from the stored file itself. */
export interface ProbedMedia {
  durationMs: number | null;
  /** The video's average frame rate as a fraction, e.g. 30000/1001. */
  frameRate: FrameRate | null;
  width: number | null;
  height: number | null;
  /** In the words the browser's reader uses ("AVC", "HEVC", "ProRes"), so the two compare. */
  codec: string | null;
  audioCodec: string | null;
}

/** What the browser said about the same file before upload (null: it said nothing). */
export interface ReportedMedia {
  durationMs: number;
  frameRate: FrameRate | null;
  width: number | null;
  height: number | null;
  codec: string | null;
}

export type MediaField = "frameRate" | "durationMs" | "resolution" | "codec";

/** One difference between the file and the browser's report: the values as numbers or names, worded by the page. */
export type MediaMismatch =
  | { field: "frameRate"; file: FrameRate; browser: FrameRate }
  | { field: "durationMs"; file: number; browser: number }
  | { field: "resolution"; file: { width: number; height: number }; browser: { width: number; height: number } }
  | { field: "codec"; file: string; browser: string };

/**
 * ffprobe's codec_name in the words mediainfo (the browser's reader) uses for the same format. The
 * names on both sides are the tools' own (FFmpeg's libavcodec codec list, MediaInfo's format names);
 * the pairing is common practice, written from memory.
 */
const codecWords: Record<string, string> = {
  h264: "AVC",
  hevc: "HEVC",
  prores: "ProRes",
  dnxhd: "VC-3",
  mpeg2video: "MPEG Video",
  mpeg4: "MPEG-4 Visual",
  vp8: "VP8",
  vp9: "VP9",
  av1: "AV1",
  mjpeg: "JPEG",
};

export function codecWord(ffprobeName: string): string {
  return codecWords[ffprobeName.toLowerCase()] ?? ffprobeName.toUpperCase();
}

/** Names that mean the same format on either side (H.264 is AVC, H.265 is HEVC, DNxHD/HR is VC-3). */
const sameFormat: string[][] = [
  ["avc", "h264", "avc1"],
  ["hevc", "h265", "hvc1", "hev1"],
  ["prores", "apple prores"],
  ["vc3", "dnxhd", "dnxhr"],
];

function codecKey(name: string): string {
  const plain = name.toLowerCase().replace(/[^a-z0-9 ]/g, "").trim();
  const group = sameFormat.find((names) => names.some((n) => n.replace(/[^a-z0-9 ]/g, "") === plain));
  return group ? group[0]! : plain;
}

/** A duration difference under half a second (or one frame, if longer) is container rounding, not a disagreement. */
function durationsDiffer(file: number, browser: number, rate: FrameRate | null): boolean {
  const frameMs = rate ? (1000 * rate.denominator) / rate.numerator : 0;
  return Math.abs(file - browser) > Math.max(500, frameMs);
}

/** Rates within 0.01 fps are the same rate (25/1 and 2500/100, or a container's 29.97 rounded). */
function ratesDiffer(a: FrameRate, b: FrameRate): boolean {
  return Math.abs(a.numerator / a.denominator - b.numerator / b.denominator) > 0.01;
}

/**
 * Where the file and the browser disagree. A value only one side gave is no disagreement: the
 * browser often can't read a camera codec at all, and then the file's values simply fill in.
 */
export function mediaMismatches(file: ProbedMedia, browser: ReportedMedia): MediaMismatch[] {
  const found: MediaMismatch[] = [];
  if (file.frameRate && browser.frameRate && ratesDiffer(file.frameRate, browser.frameRate)) {
    found.push({ field: "frameRate", file: file.frameRate, browser: browser.frameRate });
  }
  if (file.durationMs !== null && browser.durationMs > 0 && durationsDiffer(file.durationMs, browser.durationMs, file.frameRate ?? browser.frameRate)) {
    found.push({ field: "durationMs", file: file.durationMs, browser: browser.durationMs });
  }
  if (file.width && file.height && browser.width && browser.height && (file.width !== browser.width || file.height !== browser.height)) {
    found.push({ field: "resolution", file: { width: file.width, height: file.height }, browser: { width: browser.width, height: browser.height } });
  }
  if (file.codec && browser.codec && codecKey(file.codec) !== codecKey(browser.codec)) {
    found.push({ field: "codec", file: file.codec, browser: browser.codec });
  }
  return found;
}

/**
 * A frame rate from ffprobe's "30000/1001" (avg_frame_rate, else r_frame_rate); "0/0" and nonsense
 * give null. Reduced, so 2997/100 compares as the number it is.
 */
export function rateFromText(text: string | undefined): FrameRate | null {
  const match = /^(\d+)\/(\d+)$/.exec(text ?? "");
  if (!match) return null;
  const numerator = Number(match[1]);
  const denominator = Number(match[2]);
  if (numerator <= 0 || denominator <= 0 || numerator / denominator > 1000) return null;
  const gcd = (a: number, b: number): number => (b === 0 ? a : gcd(b, a % b));
  const d = gcd(numerator, denominator);
  return { numerator: numerator / d, denominator: denominator / d };
}

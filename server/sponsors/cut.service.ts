import { clipFormat, pinTimecode, segmentRange, type SegmentClip, type SegmentTiming } from "../../shared/sponsors/segment";
import type { ReviewPinView, ReviewSegment } from "../../shared/sponsors/schemas";
import { frameRateName } from "../../shared/timecode/rates";
import type { Storage } from "../storage/storage";
import { findCutClips, type CutClipRow } from "./cut.repository";
import type { DealRow, Db } from "./deals.repository";

// The cut as it plays: which object of the clip a player gets, where the segment runs in it, and the
// timecode of a moment of it, always in the clip's own frame rate.

/** The clip as the segment's arithmetic reads it. */
export function segmentClipOf(clip: CutClipRow): SegmentClip {
  const frameRate = clip.frameRateNumerator && clip.frameRateDenominator ? { numerator: clip.frameRateNumerator, denominator: clip.frameRateDenominator } : null;
  return { durationMs: clip.durationMs, frameRate, dropFrame: clip.dropFrame, startTimecode: clip.startTimecode };
}

/** The clip's frame rate by name ("29.97"), or null when the clip doesn't say or Kerf has no timecode for it. */
export function clipRateName(clip: CutClipRow): string | null {
  const format = clipFormat(segmentClipOf(clip));
  return format ? (frameRateName(format.rate) ?? null) : null;
}

/** The deal's in and out as the segment reads them. */
export function timingOf(deal: Pick<DealRow, "cutIn" | "cutOut" | "cutFrameRate" | "cutDropFrame">): SegmentTiming | null {
  if (!deal.cutIn || !deal.cutOut || !deal.cutFrameRate) return null;
  return { inTimecode: deal.cutIn, outTimecode: deal.cutOut, frameRate: deal.cutFrameRate, dropFrame: deal.cutDropFrame ?? false };
}

/**
 * The one place that says which stored object plays a cut: the web proxy the server made (H.264/AAC,
 * which every browser plays) once it is ready, else the clip's own file.
 */
export function playableKey(clip: Pick<CutClipRow, "objectKey" | "contentType" | "mediaState" | "proxyKey">): { key: string; contentType: string } {
  if (clip.mediaState === "ready" && clip.proxyKey) return { key: clip.proxyKey, contentType: "video/mp4" };
  return { key: clip.objectKey, contentType: clip.contentType };
}

/** A short-lived address to play the clip: one object, one hour (long enough to watch a segment, too short to become a share link). */
export async function playUrlOf(storage: Storage | null, clip: CutClipRow): Promise<string | null> {
  if (!storage) return null;
  const { key, contentType } = playableKey(clip);
  try {
    return await storage.presignGet(key, { expiresInSeconds: 3600, contentType });
  } catch {
    return null;
  }
}

/** Where the deal's segment runs in its clip; with no in and out, the whole file (a draft cut) is the segment. */
export function segmentOf(clip: CutClipRow, deal: Pick<DealRow, "cutIn" | "cutOut" | "cutFrameRate" | "cutDropFrame">): ReviewSegment | null {
  const range = segmentRange(segmentClipOf(clip), timingOf(deal));
  if (!range) return null;
  return { ...range, frameRate: clipRateName(clip) };
}

/** The clip a deal's cut names, within the channel. */
export async function cutClipOf(db: Db, channelId: string, clipId: string | null): Promise<CutClipRow | null> {
  if (!clipId) return null;
  const [clip] = await findCutClips(db, channelId, [clipId]);
  return clip ?? null;
}

/** A pin's moment as the clip's timecode of the frame then on screen. */
export function pinLabel(clip: CutClipRow | null, deal: Pick<DealRow, "cutIn" | "cutOut" | "cutFrameRate" | "cutDropFrame">, atSeconds: number): string | null {
  if (!clip) return null;
  const timing = timingOf(deal);
  const range = segmentRange(segmentClipOf(clip), timing);
  return range ? pinTimecode(segmentClipOf(clip), timing, range, atSeconds) : null;
}

type PinRow = { id: string; offsetMs: number; note: string; contactName: string; createdAt: Date };

export const pinViewOf = (pin: PinRow): ReviewPinView => ({ id: pin.id, atSeconds: pin.offsetMs / 1000, note: pin.note, contactName: pin.contactName, createdAt: pin.createdAt.toISOString() });

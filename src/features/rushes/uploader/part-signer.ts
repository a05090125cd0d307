import { PART_URL_SECONDS, partRange, SIGN_AHEAD } from "@shared/rushes/limits";
import type { PartUrlsAnswer, PartUrlsInput } from "@shared/rushes/schemas";

/** A kept URL is used only while it has at least half of its life left. */
const KEPT_MS = (PART_URL_SECONDS * 1000) / 2;
/** Parts after the one being sent whose URLs are kept ready: asked SIGN_AHEAD at a time, once that many lack one. */
const WINDOW = 2 * SIGN_AHEAD;

export interface PartPlan {
  uploadId: string;
  partSize: number;
  size: number;
  partCount: number;
}

type Sign = (uploadId: string, parts: PartUrlsInput["parts"]) => Promise<PartUrlsAnswer["urls"]>;

function urlOf(urls: PartUrlsAnswer["urls"], partNumber: number): string {
  const found = urls.find((signed) => signed.partNumber === partNumber);
  if (!found) throw new Error(`Kerf didn't sign part ${partNumber}.`);
  return found.url;
}

/**
 * One upload's signed part URLs (Uppy asks for one part at a time; the rest wait here). The next parts'
 * URLs are asked for while this one is sent, so a part seldom waits on Kerf before it goes to storage.
 */
export class PartSigner {
  private kept = new Map<number, { url: Promise<string>; at: number }>();

  constructor(private readonly sign: Sign) {}

  /** After a pause, a failure or a cancel: URLs may be stale or for parts sent since. */
  forget() {
    this.kept.clear();
  }

  /** The URL for this part: kept from an earlier batch, or asked for now together with the next parts. */
  urlFor(plan: PartPlan, partNumber: number, size: number, isStored: (partNumber: number) => boolean): Promise<string> {
    const kept = this.kept.get(partNumber);
    this.kept.delete(partNumber);
    const fresh = kept && Date.now() - kept.at < KEPT_MS ? kept.url : null;
    const ahead = this.unsignedAfter(plan, partNumber, isStored);
    if (fresh && ahead.length < SIGN_AHEAD) return fresh;
    const parts = [...(fresh ? [] : [{ partNumber, size }]), ...ahead];
    const signing = this.sign(plan.uploadId, parts.slice(0, SIGN_AHEAD));
    const at = Date.now();
    for (const { partNumber: next } of parts.slice(fresh ? 0 : 1, SIGN_AHEAD)) {
      const url = signing.then((urls) => urlOf(urls, next));
      // A failed batch is asked again when its part's turn comes; no one waits on it before that.
      url.catch(() => undefined);
      this.kept.set(next, { url, at });
    }
    return fresh ?? signing.then((urls) => urlOf(urls, partNumber));
  }

  /** The parts after this one, within the window, with no kept URL and not yet stored. */
  private unsignedAfter(plan: PartPlan, partNumber: number, isStored: (partNumber: number) => boolean) {
    const parts: PartUrlsInput["parts"] = [];
    for (let next = partNumber + 1; next <= Math.min(plan.partCount, partNumber + WINDOW); next++) {
      if (isStored(next) || this.kept.has(next)) continue;
      const { start, end } = partRange(next, plan.partSize, plan.size);
      parts.push({ partNumber: next, size: end - start });
    }
    return parts;
  }
}

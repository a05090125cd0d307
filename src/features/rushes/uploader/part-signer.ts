import { PART_URL_SECONDS, partRange, SIGN_AHEAD } from "@shared/rushes/limits";
import type { PartUrlsAnswer } from "@shared/rushes/schemas";
import { signParts } from "../api/sign-parts";

/** A kept URL is used only while it has at least half of its life left. */
const KEPT_MS = (PART_URL_SECONDS * 1000) / 2;

export interface PartPlan {
  uploadId: string;
  partSize: number;
  size: number;
  partCount: number;
}

function urlOf(urls: PartUrlsAnswer["urls"], partNumber: number): string {
  const found = urls.find((signed) => signed.partNumber === partNumber);
  if (!found) throw new Error(`Kerf didn't sign part ${partNumber}.`);
  return found.url;
}

/** One upload's signed part URLs, asked for SIGN_AHEAD at a time (Uppy asks for one part at a time; the rest wait here). */
export class PartSigner {
  private kept = new Map<number, { url: Promise<string>; at: number }>();

  constructor(private readonly channelId: string) {}

  /** After a pause, a failure or a cancel: URLs may be stale or for parts sent since. */
  forget() {
    this.kept.clear();
  }

  /** The URL for this part: kept from an earlier batch, or in a new batch with the next parts not yet stored. */
  urlFor(plan: PartPlan, partNumber: number, size: number, isStored: (partNumber: number) => boolean): Promise<string> {
    const kept = this.kept.get(partNumber);
    this.kept.delete(partNumber);
    if (kept && Date.now() - kept.at < KEPT_MS) return kept.url;
    const parts = [{ partNumber, size }];
    for (let next = partNumber + 1; next <= plan.partCount && parts.length < SIGN_AHEAD; next++) {
      if (isStored(next) || this.kept.has(next)) continue;
      const { start, end } = partRange(next, plan.partSize, plan.size);
      parts.push({ partNumber: next, size: end - start });
    }
    const signing = signParts(this.channelId, plan.uploadId, parts);
    const at = Date.now();
    for (const { partNumber: ahead } of parts.slice(1)) {
      const url = signing.then((urls) => urlOf(urls, ahead));
      // A failed batch is asked again when its part's turn comes; no one waits on it before that.
      url.catch(() => undefined);
      this.kept.set(ahead, { url, at });
    }
    return signing.then((urls) => urlOf(urls, partNumber));
  }
}
